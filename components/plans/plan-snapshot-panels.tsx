import { View } from 'react-native';
import type { PlanSnapshot } from '@/shared/schemas/plan';
import { UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { lengthIn } from '@/components/check/format';
import { useLengthUnits } from '@/components/data/session';
import { CautionsPanel } from '@/components/check/cautions-panel';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { space } from '@/components/ui/theme';

/** What every result of a plan rests on, in words. */
export function AssumptionsPanel({ snapshot }: { snapshot: PlanSnapshot }) {
  return (
    <Card style={{ gap: space.xs }}>
      <AppText variant="heading">Assumptions</AppText>
      {snapshot.assumptions.map((a) => (
        <AppText key={a} variant="small">
          • {a}
        </AppText>
      ))}
    </Card>
  );
}

/** The inputs a revision froze: posts with their heights, targets, condition sets and the standard. */
export function InputsPanel({ snapshot }: { snapshot: PlanSnapshot }) {
  const { plan, posts, targets, conditionSets } = snapshot.inputs;
  const { height, distance } = useLengthUnits(unitsOf(snapshot));
  const n = (v: unknown) => lengthIn(typeof v === 'number' ? v : Number(v), height);
  return (
    <Card style={{ gap: space.sm }}>
      <AppText variant="heading">Inputs</AppText>
      <AppText variant="small">
        Standard: at least {plan.standard.minSeenPct} % of the site seen by one post or more; each priority zone seen by{' '}
        {plan.standard.priorityMinPosts} post{plan.standard.priorityMinPosts === 1 ? '' : 's'} or more.
      </AppText>
      <View style={{ gap: 2 }}>
        <AppText variant="label">Posts</AppText>
        {posts.map((p) => (
          <AppText key={String(p.id)} variant="small">
            {String(p.name)} — ground {n(p.groundElevationM)} + structure {n(p.structureHeightM)} + eye {n(p.eyeHeightM)}
            {p.status === 'proposed' ? ' (proposed)' : ''}
          </AppText>
        ))}
      </View>
      <View style={{ gap: 2 }}>
        <AppText variant="label">Targets</AppText>
        {targets.map((t) => (
          <AppText key={String(t.id)} variant="small">
            {String(t.name)} — {n(t.heightM)} high, {n(t.widthM)} wide, top {n(t.requiredVisibleM)} must show
          </AppText>
        ))}
      </View>
      <View style={{ gap: 2 }}>
        <AppText variant="label">Condition sets</AppText>
        {conditionSets.map((c) => (
          <AppText key={String(c.id)} variant="small">
            {String(c.name)}
            {c.visibilityM
              ? ` — visibility ${lengthIn(Number(c.visibilityM), distance, (m) => `${(m / 1000).toFixed(1)} km`)}`
              : ''}
          </AppText>
        ))}
      </View>
    </Card>
  );
}

/** The standing cautions a plan's figures carry. */
export function SnapshotCautions({ snapshot }: { snapshot: PlanSnapshot }) {
  return <CautionsPanel cautions={snapshot.cautions} />;
}

/** The unit system of the plan's site (metric when the snapshot does not say). */
export const unitsOf = (snapshot: PlanSnapshot): UnitSystem => {
  const units = snapshot.inputs.site.defaultUnits;
  return typeof units === 'string' && units in UNIT_SYSTEMS ? (units as UnitSystem) : 'metric';
};

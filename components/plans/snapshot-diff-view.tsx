import { View } from 'react-native';
import type { EntityChange, FieldChange, SnapshotDiff } from '@/shared/plans/diff-snapshots';
import type { LengthUnit } from '@/shared/units/length';
import { formatLength, lengthIn, LIMIT_LABELS } from '@/components/check/format';
import { useLengthUnits } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { space } from '@/components/ui/theme';

const show = (v: unknown) => (v === null || v === undefined ? '—' : typeof v === 'object' ? JSON.stringify(v) : String(v));
const CHANGE = { added: 'Added', removed: 'Removed', changed: 'Changed' } as const;

/** Which unit a changed field's metres are shown in: distances (visibility, ranges) or heights (any other `…M`). */
const unitOfField = (field: string, units: { height: LengthUnit; distance: LengthUnit }): LengthUnit | null =>
  !field.endsWith('M') ? null : /visibility|range|distance/i.test(field) ? units.distance : units.height;

function Fields({ fields }: { fields: readonly FieldChange[] }) {
  const units = useLengthUnits();
  const showField = (field: string, v: unknown) => {
    const unit = unitOfField(field, units);
    return unit && typeof v === 'number' ? lengthIn(v, unit, show) : show(v);
  };
  return (
    <>
      {fields.map((f) => (
        <AppText key={f.field} variant="small">
          {f.field}: {showField(f.field, f.before)} → {showField(f.field, f.after)}
        </AppText>
      ))}
    </>
  );
}

function Entities({ title, list }: { title: string; list: readonly EntityChange[] }) {
  if (list.length === 0) return null;
  return (
    <View style={{ gap: 2 }}>
      <AppText variant="label">{title}</AppText>
      {list.map((e) => (
        <View key={e.id} style={{ paddingLeft: space.sm }}>
          <AppText variant="small">
            {CHANGE[e.change]}: {e.name}
          </AppText>
          <View style={{ paddingLeft: space.sm }}>
            <Fields fields={e.fields} />
          </View>
        </View>
      ))}
    </View>
  );
}

/** What changed between two revisions: inputs first, then the result lines whose figures moved. */
export function SnapshotDiffView({ diff, from, to }: { diff: SnapshotDiff; from: number; to: number }) {
  const { distance } = useLengthUnits();
  return (
    <Card style={{ gap: space.sm }} aria-label={`Changes from revision ${from} to ${to}`}>
      <AppText variant="heading">
        Revision {from} → {to}
      </AppText>
      {diff.same ? <AppText tone="muted">No differences: the two revisions hold the same inputs and results.</AppText> : null}
      {diff.plan.length ? (
        <View style={{ gap: 2 }}>
          <AppText variant="label">Plan</AppText>
          <Fields fields={diff.plan} />
        </View>
      ) : null}
      {diff.site.length ? (
        <View style={{ gap: 2 }}>
          <AppText variant="label">Site</AppText>
          <Fields fields={diff.site} />
        </View>
      ) : null}
      <Entities title="Posts" list={diff.posts} />
      <Entities title="Targets" list={diff.targets} />
      <Entities title="Condition sets" list={diff.conditionSets} />
      {diff.assumptions.added.length + diff.assumptions.removed.length ? (
        <View style={{ gap: 2 }}>
          <AppText variant="label">Assumptions</AppText>
          {diff.assumptions.removed.map((a) => (
            <AppText key={`-${a}`} variant="small">
              Removed: {a}
            </AppText>
          ))}
          {diff.assumptions.added.map((a) => (
            <AppText key={`+${a}`} variant="small">
              Added: {a}
            </AppText>
          ))}
        </View>
      ) : null}
      {diff.results.length ? (
        <View style={{ gap: 2 }}>
          <AppText variant="label">Results ({diff.results.length} lines)</AppText>
          {diff.results.map((r) => (
            <AppText key={r.key} variant="small">
              {CHANGE[r.change]}: {r.postName} → {r.targetName}, {r.conditionSetName} #{r.conditionIndex + 1}:{' '}
              {formatLength(r.detectionRangeM.before, distance)} → {formatLength(r.detectionRangeM.after, distance)}
              {r.limitedBy.before !== r.limitedBy.after
                ? ` (limit ${r.limitedBy.before ? LIMIT_LABELS[r.limitedBy.before as keyof typeof LIMIT_LABELS] : '—'} → ${r.limitedBy.after ? LIMIT_LABELS[r.limitedBy.after as keyof typeof LIMIT_LABELS] : '—'})`
                : ''}
              {r.zones.map((z) => ` · ${z.name}: ${z.before ?? '—'} → ${z.after ?? '—'}`).join('')}
            </AppText>
          ))}
        </View>
      ) : null}
    </Card>
  );
}

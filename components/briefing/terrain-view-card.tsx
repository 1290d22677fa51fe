import { useState } from 'react';
import { View } from 'react-native';
import type { BriefingTerrainView } from '@/shared/schemas/assignment';
import type { LengthUnit } from '@/shared/units/length';
import { formatLength, LIMIT_LABELS } from '@/components/check/format';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { space } from '@/components/ui/theme';
import { SeenShareRose } from './seen-share-rose';

/** A bearing in degrees true as three digits (070°). */
export const bearing = (deg: number) => `${String(Math.round(deg) % 360).padStart(3, '0')}°`;
const pct = (v: number) => `${v.toLocaleString('en', { maximumFractionDigits: v < 10 ? 1 : 0 })} %`;

/**
 * What this post sees over the site's terrain for one target and condition at
 * a time: the seen share, the blind bearing sectors, a seen-share rose and
 * the detection range, from the approved plan's frozen coverage run.
 */
export function TerrainViewCard({
  view,
  siteName,
  wide,
  watch,
  distance = 'km',
}: {
  view: BriefingTerrainView;
  siteName: string;
  wide: boolean;
  watch: { fromDeg: number; toDeg: number } | null;
  /** The person's distance unit. */
  distance?: LengthUnit;
}) {
  const targets = [...new Map(view.cases.map((c) => [c.targetId, c.targetName])).entries()];
  const [targetId, setTargetId] = useState(targets[0]![0]);
  const forTarget = view.cases.filter((c) => c.targetId === targetId);
  const standard = forTarget.findIndex((c) => /standard/i.test(c.conditionLabel));
  const [caseKey, setCaseKey] = useState<string | null>(null);
  const current = forTarget.find((c) => c.caseKey === caseKey) ?? forTarget[Math.max(0, standard)]!;
  return (
    <Card style={{ gap: space.md }} aria-label="What you see over the terrain">
      <View style={{ gap: space.xs }}>
        <AppText variant="heading">What you see from here, over the terrain</AppText>
        <AppText variant="small" tone="muted">
          From the approved plan’s terrain coverage. Bearings are true (grid convergence {view.gridConvergenceDeg.toFixed(2)}°
          applied); shares count the ground of the site within the detection range.
        </AppText>
      </View>
      {targets.length > 1 ? (
        <ChipRow label="Target">
          {targets.map(([id, name]) => (
            <Chip key={id} label={name} on={id === targetId} onPress={() => setTargetId(id)} />
          ))}
        </ChipRow>
      ) : null}
      <ChipRow label="Condition">
        {forTarget.map((c) => (
          <Chip
            key={c.caseKey}
            label={c.conditionLabel}
            on={c.caseKey === current.caseKey}
            onPress={() => setCaseKey(c.caseKey)}
          />
        ))}
      </ChipRow>
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.lg, alignItems: wide ? 'flex-start' : 'center' }}>
        <SeenShareRose view={current} blindBelowPct={view.blindBelowPct} watch={watch} />
        <View style={{ gap: space.sm, flex: wide ? 1 : undefined, alignSelf: 'stretch' }}>
          <View>
            <AppText variant="figure" aria-label="Seen share">
              {pct(current.seenPct)} of {siteName}
            </AppText>
            <AppText variant="small" tone="muted">
              where you see the target: {current.targetName}, {current.conditionLabel}
            </AppText>
          </View>
          <View aria-label="Blind sectors">
            <AppText variant="label">Blind sectors (you see under {view.blindBelowPct} % of the ground in range)</AppText>
            {current.blindSectors.length === 0 ? (
              <AppText variant="small">None: every direction is at least {view.blindBelowPct} % seen.</AppText>
            ) : (
              current.blindSectors.map((b) => (
                <AppText key={b.fromDeg} variant="small">
                  {bearing(b.fromDeg)} → {bearing(b.toDeg)} true · {b.seenPct.toFixed(1)} % seen
                </AppText>
              ))
            )}
          </View>
          <View>
            <AppText variant="label">Detection range</AppText>
            <AppText variant="small">
              {formatLength(current.detectionRangeM, distance)}
              {current.limitedBy ? `, limited by ${LIMIT_LABELS[current.limitedBy]}` : ', no limit found'}
            </AppText>
          </View>
          <AppText variant="small" tone="muted">
            Rose: petal length is the share seen in each 10° sector (true north up); ember petals are blind sectors, the dashed
            ring is {view.blindBelowPct} %{watch ? ', the gold arc your watch sector' : ''}; a grey rim means no ground of the
            site in range that way.
          </AppText>
        </View>
      </View>
    </Card>
  );
}

import { useMemo } from 'react';
import { View } from 'react-native';
import type { SightlineRequest, SightlineResult } from '@/shared/schemas/sightline';
import { evaluateSightline } from '@/shared/sightline/evaluate-sightline';
import type { LengthUnit } from '@/shared/units/length';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { space } from '@/components/ui/theme';
import { formatLength } from './format';

const BAND_K = [0, 0.05, 0.1, 0.15, 0.2, 0.25, 0.3];

const span = (results: SightlineResult[], pick: (r: SightlineResult) => number | null) => {
  const v = results.map(pick).filter((x): x is number => x !== null);
  return v.length ? { min: Math.min(...v), max: Math.max(...v) } : null;
};

/** How far the answer moves as k runs over its usual daytime range. */
export function RefractionBandPanel({
  request,
  units,
}: {
  request: SightlineRequest;
  units: { height: LengthUnit; distance: LengthUnit };
}) {
  const results = useMemo(() => evaluateSightline({ ...request, conditions: BAND_K.map((k) => ({ k })) }).results, [request]);
  const rows: [string, ReturnType<typeof span>, LengthUnit][] = [
    ['Horizon distance', span(results, (r) => r.horizonDistanceM), units.distance],
    ['Hidden height', span(results, (r) => r.hiddenHeightM), units.height],
    ['Detection range', span(results, (r) => r.detectionRangeM), units.distance],
  ];
  return (
    <Card>
      <AppText variant="heading">Sensitivity to refraction</AppText>
      <AppText variant="small" tone="muted">
        The same question for k from {BAND_K[0]} to {BAND_K[BAND_K.length - 1]} (no refraction to a strong daytime value).
      </AppText>
      <View style={{ gap: space.xs }}>
        {rows.map(([label, s, unit]) => (
          <View key={label} style={{ flexDirection: 'row', justifyContent: 'space-between', gap: space.md }}>
            <AppText variant="label">{label}</AppText>
            <AppText style={{ fontVariant: ['tabular-nums'] }}>
              {s ? `${formatLength(s.min, unit)} – ${formatLength(s.max, unit)}` : '—'}
            </AppText>
          </View>
        ))}
      </View>
    </Card>
  );
}

import { StyleSheet, View } from 'react-native';
import { SWEEP_MODEL_LABELS, type SweepWidthResult } from '@/shared/schemas/sweep-width';
import type { UnitSystem } from '@/shared/units/unit-systems';
import type { ComputedOn } from '@/components/data/sightline';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { formatSweepDistance } from './search-effort-form-model';

const percent = (p: number) => `${(p * 100).toFixed(p >= 0.995 ? 1 : 0)} %`;

function Figure({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <View style={styles.figure} aria-label={`${label}: ${value}`}>
      <AppText variant="label" tone="muted">
        {label}
      </AppText>
      <AppText variant="figure">{value}</AppText>
      {note ? (
        <AppText variant="small" tone="muted">
          {note}
        </AppText>
      ) : null}
    </View>
  );
}

/** W, C and POD of one search (W and S in `units`), with the method, the source and any warnings. */
export function SweepResult({
  result,
  units = 'metric',
}: {
  result: SweepWidthResult & { computedOn: ComputedOn };
  units?: UnitSystem;
}) {
  return (
    <Card accent="ember" aria-label="Search effort result">
      <AppText variant="heading">Probability of detection (estimate)</AppText>
      <View style={styles.figures}>
        <Figure label="Sweep width W" value={formatSweepDistance(result.sweepWidthM, units)} />
        <Figure
          label="Coverage factor C"
          value={result.coverageFactor.toFixed(2)}
          note={`W / S, S = ${formatSweepDistance(result.trackSpacingM, units)}`}
        />
        <Figure label="POD" value={percent(result.pod)} note={SWEEP_MODEL_LABELS[result.model]} />
        <Figure label="POD, random search" value={percent(result.podRandomSearch)} note="1 − e^(−C), the pessimistic bound" />
      </View>
      <AppText variant="small">{result.method}</AppText>
      <AppText variant="small" tone="muted">
        Source: {result.source}
        {result.computedOn === 'device' ? ' · computed on this device (offline)' : ''}
      </AppText>
      {result.warnings.map((w) => (
        <Notice key={w} tone="caution">
          <AppText variant="small">{w}</AppText>
        </Notice>
      ))}
    </Card>
  );
}

const styles = StyleSheet.create({
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  figure: {
    minWidth: 140,
    flexGrow: 1,
    flexBasis: 140,
    gap: 2,
    paddingLeft: space.sm,
    borderLeftWidth: 2,
    borderLeftColor: colors.line,
  },
});

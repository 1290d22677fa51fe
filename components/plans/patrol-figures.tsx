import { View } from 'react-native';
import type { CoverageCase } from '@/shared/schemas/coverage';
import { convertLength, type LengthUnit } from '@/shared/units/length';
import { AppText } from '@/components/ui/app-text';
import { tableStyles } from '@/components/ui/table-styles';
import { space } from '@/components/ui/theme';
import { formatArea, formatPct } from './coverage-format';

/**
 * A case's patrols (vessels and aircraft on routes): what each watches at
 * least once in its cycle, how long its cells are in view on average, and the
 * probability of detection along its track by the stated model.
 */
export function PatrolFigures({ patrols, distanceUnit = 'km' }: { patrols: CoverageCase['patrols']; distanceUnit?: LengthUnit }) {
  if (!patrols || patrols.length === 0) return null;
  const dist = (m: number) => `${convertLength(m, 'm', distanceUnit).toFixed(2)} ${distanceUnit}`;
  return (
    <View style={{ gap: space.sm }} aria-label="Patrols">
      <AppText variant="heading">Patrols</AppText>
      {patrols.map((p) => (
        <View
          key={p.postId}
          style={[tableStyles.table, { padding: space.sm, gap: 2 }]}
          role="group"
          aria-label={`Patrol ${p.postName}`}
        >
          <AppText style={{ fontWeight: '700' }}>{p.postName}</AppText>
          <AppText variant="small">
            Route {dist(p.routeLengthM)}, run in {p.transitMinutes.toFixed(0)} min of a {p.cycleMinutes} min cycle
          </AppText>
          <AppText variant="small">
            Watched at least once: {formatPct(p.sweptPct)} of the judged area ({formatArea(p.sweptAreaM2)})
          </AppText>
          <AppText variant="small">
            Watched cells are in view {formatPct(100 * p.meanFractionInView)} of the cycle on average
          </AppText>
          <AppText variant="small">
            {p.pod === null
              ? 'Probability of detection: none — the target cannot be detected from this craft under this condition.'
              : `Probability of detection in one cycle: ${formatPct(100 * p.pod)} (sweep width ${dist(p.sweepWidthM!)}, coverage factor ${p.coverageFactor!.toFixed(2)})`}
          </AppText>
          <AppText variant="small" tone="muted">
            Views from {p.samples} places along the track, at most {dist(p.sampleSpacingM)} apart.
          </AppText>
        </View>
      ))}
      <AppText variant="small" tone="muted">
        Model: a target within the detection range of the craft is detected, beyond it not, so the sweep width is twice that range
        over open water; the coverage factor is sweep width × track length ÷ the judged area, and the probability of detection is
        1 − e^(−coverage factor), as for a search whose tracks are not laid out to cover the area evenly. Terrain that hides the
        sea shows in the watched share, not in the sweep width. Estimates only: visibility is not detection; follow your
        agency&apos;s search-planning procedures.
      </AppText>
    </View>
  );
}

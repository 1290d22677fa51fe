import { checkLateralRangeCurve, lateralRangeAt, type LateralRangePoint } from '@/shared/sightline/lateral-range-curve';
import { SweepInputError } from '@/shared/sightline/sweep-input-error';

/** The most tracks counted on each side of the target: a bound on the work of one request. */
export const MAX_TRACKS_EACH_SIDE = 2000;

/** Result of {@link parallelSweepPod}. */
export interface ParallelSweepPod {
  /** Mean probability of detection over the target's position between two tracks, 0…1. */
  readonly pod: number;
  /** Tracks counted on each side of the target (those within the curve's last range). */
  readonly tracksEachSide: number;
}

/**
 * POD of a parallel-sweep search for a target placed uniformly at random
 * between tracks, from any lateral-range curve: with tracks at nS, a target
 * at x is missed only if every track misses it,
 *
 *   P(x) = 1 − Πₙ (1 − p(x − nS)),   POD = (1/S) ∫₀^S P(x) dx,
 *
 * tracks taken as long and passes independent. The mean is a midpoint sum
 * (at least 512 samples, and at least 512 across the curve's reach when the
 * spacing is wider than it); the tracks counted are those within the curve's
 * last range on either side.
 *
 * @param curve - the lateral-range curve (see {@link checkLateralRangeCurve})
 * @param trackSpacingM - S, metres, > 0
 * @returns the POD and the tracks counted each side
 * @throws {SweepInputError} `too-many-tracks` on `trackSpacingM` when the curve
 *   would need more than {@link MAX_TRACKS_EACH_SIDE} tracks on a side; a bad curve or spacing
 *
 * Source: the product over parallel sweeps as written in J. N. Eagle,
 * "Lateral Range Curves and Sweepwidth" (NPS OA3602 notes, 2012, after
 * Washburn, Search and Detection, §2.4).
 *
 * @example
 * parallelSweepPod([{ rangeM: 0, pod: 1 }, { rangeM: 500, pod: 1 }, { rangeM: 500.001, pod: 0 }], 2000).pod; // ≈ 0.5
 */
export function parallelSweepPod(
  curve: readonly LateralRangePoint[],
  trackSpacingM: number,
  field = 'lateralRangeCurve',
): ParallelSweepPod {
  checkLateralRangeCurve(curve, field);
  if (!Number.isFinite(trackSpacingM) || trackSpacingM <= 0) {
    throw new SweepInputError('out-of-range', 'trackSpacingM', 'The track spacing must be a positive number of metres.');
  }
  const reachM = curve[curve.length - 1]!.rangeM;
  const tracksEachSide = Math.max(1, Math.ceil(reachM / trackSpacingM));
  if (tracksEachSide > MAX_TRACKS_EACH_SIDE) {
    const least = reachM / MAX_TRACKS_EACH_SIDE;
    throw new SweepInputError(
      'too-many-tracks',
      'trackSpacingM',
      `This spacing would need ${tracksEachSide} tracks on each side of the target to cover the curve's ${reachM} m; ` +
        `at most ${MAX_TRACKS_EACH_SIDE}: use a spacing of at least ${least.toPrecision(3)} m.`,
    );
  }
  const samples = Math.min(200_000, Math.max(512, Math.ceil((512 * trackSpacingM) / Math.max(reachM, 1e-9))));
  const h = trackSpacingM / samples;
  let sum = 0;
  for (let i = 0; i < samples; i++) {
    const x = (i + 0.5) * h;
    let missed = 1;
    // Tracks at nS for n = −N … N + 1 are all that can reach a target in [0, S).
    for (let n = -tracksEachSide; n <= tracksEachSide + 1 && missed > 0; n++) {
      missed *= 1 - lateralRangeAt(curve, x - n * trackSpacingM);
    }
    sum += 1 - missed;
  }
  return { pod: sum / samples, tracksEachSide };
}

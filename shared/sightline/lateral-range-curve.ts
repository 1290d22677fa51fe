import { SweepInputError } from '@/shared/sightline/sweep-input-error';

/** One point of a lateral-range curve: the chance of detecting the target on one pass at that lateral range. */
export interface LateralRangePoint {
  /** Lateral range (closest point of approach to the track), metres, ≥ 0. */
  readonly rangeM: number;
  /** Probability of detection on one straight pass at that range, 0…1. */
  readonly pod: number;
}

/** The most points a curve may have (a measured curve has tens). */
export const MAX_LATERAL_RANGE_POINTS = 500;

/**
 * Checks a lateral-range curve: 2…500 points, ranges finite, ≥ 0 and
 * strictly increasing, PODs in [0, 1]. The curve is taken as symmetric about
 * the track (the same on either side), holds its first POD from the track out
 * to its first range, is linear between points and zero beyond its last
 * point.
 *
 * @param curve - the points, nearest first
 * @param field - the request field the curve came in, for error paths
 * @returns the same array (not copied, not changed)
 * @throws {SweepInputError} naming the first bad point, e.g. `lateralRangeCurve.2.rangeM`
 *
 * Source: the lateral-range curve as defined in J. N. Eagle, "Lateral Range
 * Curves and Sweepwidth" (NPS OA3602 notes, 2012): detection probability of a
 * straight, infinitely long track against its closest approach x.
 *
 * @example
 * checkLateralRangeCurve([{ rangeM: 0, pod: 0.9 }, { rangeM: 1000, pod: 0 }]);
 */
export function checkLateralRangeCurve(
  curve: readonly LateralRangePoint[],
  field = 'lateralRangeCurve',
): readonly LateralRangePoint[] {
  if (curve.length < 2 || curve.length > MAX_LATERAL_RANGE_POINTS) {
    throw new SweepInputError('out-of-range', field, `Give 2 to ${MAX_LATERAL_RANGE_POINTS} points of the curve.`);
  }
  curve.forEach((point, i) => {
    if (!Number.isFinite(point.rangeM) || point.rangeM < 0) {
      throw new SweepInputError('out-of-range', `${field}.${i}.rangeM`, 'The range must be a number of metres ≥ 0.');
    }
    if (!Number.isFinite(point.pod) || point.pod < 0 || point.pod > 1) {
      throw new SweepInputError('out-of-range', `${field}.${i}.pod`, 'The POD must be between 0 and 1.');
    }
    const before = curve[i - 1];
    if (before && point.rangeM <= before.rangeM) {
      throw new SweepInputError(
        'not-increasing',
        `${field}.${i}.rangeM`,
        `Ranges must increase: ${point.rangeM} m follows ${before.rangeM} m.`,
      );
    }
  });
  return curve;
}

/**
 * The curve's POD at a lateral range (either side of the track), linear
 * between points, the first POD inside the first range, 0 past the last.
 * The curve must have passed {@link checkLateralRangeCurve}.
 *
 * @param curve - a checked curve
 * @param lateralRangeM - x, metres (|x| is used)
 * @returns POD in [0, 1]
 * @example
 * lateralRangeAt([{ rangeM: 0, pod: 1 }, { rangeM: 100, pod: 0 }], 25); // 0.75
 */
export function lateralRangeAt(curve: readonly LateralRangePoint[], lateralRangeM: number): number {
  const x = Math.abs(lateralRangeM);
  const first = curve[0]!;
  const last = curve[curve.length - 1]!;
  if (x <= first.rangeM) return first.pod;
  if (x > last.rangeM) return 0;
  let lo = 0;
  let hi = curve.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (curve[mid]!.rangeM < x) lo = mid;
    else hi = mid;
  }
  const a = curve[lo]!;
  const b = curve[hi]!;
  return a.pod + ((b.pod - a.pod) * (x - a.rangeM)) / (b.rangeM - a.rangeM);
}

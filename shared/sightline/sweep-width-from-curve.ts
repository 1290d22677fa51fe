import { checkLateralRangeCurve, type LateralRangePoint } from '@/shared/sightline/lateral-range-curve';

/**
 * Sweep width W of a lateral-range curve: the area under the curve over
 * both sides of the track, W = ∫ p(x) dx (−∞ < x < ∞) = 2 ∫₀^∞ p(x) dx,
 * by the trapezoid rule between the points (exact for the piecewise-linear
 * curve), the first POD held from the track to the first range, zero past the
 * last point.
 *
 * @param curve - points nearest first (see {@link checkLateralRangeCurve})
 * @param field - the request field, for error paths
 * @returns W, metres
 * @throws {SweepInputError} on a bad curve
 *
 * Source: sweep width as the integral of the lateral-range curve — J. N.
 * Eagle, "Lateral Range Curves and Sweepwidth" (NPS OA3602 notes, 2012, after
 * Washburn, Search and Detection); Koopman, Search and Screening (1946/1980),
 * "effective sweep width" — from memory.
 *
 * @example
 * sweepWidthFromCurve([{ rangeM: 0, pod: 1 }, { rangeM: 500, pod: 1 }, { rangeM: 1500, pod: 0 }]); // 2000 m
 */
export function sweepWidthFromCurve(curve: readonly LateralRangePoint[], field = 'lateralRangeCurve'): number {
  checkLateralRangeCurve(curve, field);
  const first = curve[0]!;
  let oneSide = first.pod * first.rangeM;
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1]!;
    const b = curve[i]!;
    oneSide += ((a.pod + b.pod) / 2) * (b.rangeM - a.rangeM);
  }
  return 2 * oneSide;
}

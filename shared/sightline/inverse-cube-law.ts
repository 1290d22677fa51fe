import { erf } from '@/shared/sightline/erf';
import { SweepInputError } from '@/shared/sightline/sweep-input-error';

/**
 * Koopman's inverse-cube law of visual detection: a glimpse rate that falls
 * with the cube of the range gives, for a searcher passing a target at
 * lateral range x (flying height small against x), the lateral-range curve
 *
 *   p(x) = 1 − exp(−K / x²),   K = 2·k·h / V  (m²)
 *
 * whose integral over −∞ < x < ∞ is the sweep width W = 2·√(π·K). Written
 * with W instead of K: p(x) = 1 − exp(−W² / (4·π·x²)).
 *
 * For parallel tracks at spacing S the detection chances of the tracks
 * combine independently, Σₙ 1/(x + nS)² = π² / (S² sin²(πx/S)), and the mean
 * over the target's position is POD = erf((√π / 2) · C) with C = W / S.
 *
 * Source: the lateral-range curve 1 − exp(−K/x²) with K = 2kAh/V and the
 * product over parallel tracks as read in J. N. Eagle, "Lateral Range Curves
 * and Sweepwidth", lecture notes OA3602 (Naval Postgraduate School, 2012,
 * after A. R. Washburn, Search and Detection, 4th ed., §2.4); W = 2√(πK) by
 * integration (checked numerically in the tests); the erf form of the
 * parallel-sweep POD from B. O. Koopman, Search and Screening (1946/1980) —
 * from memory, and checked in the tests against the numerical sum over tracks.
 */

/**
 * Sweep width of an inverse-cube sensor from its constant K.
 *
 * @param kM2 - K of p(x) = 1 − exp(−K/x²), square metres, > 0
 * @returns W = 2√(πK), metres
 * @throws {SweepInputError} on K ≤ 0 or not finite (field `inverseCubeKM2`)
 * @example
 * inverseCubeSweepWidth(1e6 / Math.PI); // 2000 m
 */
export function inverseCubeSweepWidth(kM2: number): number {
  if (!Number.isFinite(kM2) || kM2 <= 0) {
    throw new SweepInputError('out-of-range', 'inverseCubeKM2', 'K must be a positive number of square metres.');
  }
  return 2 * Math.sqrt(Math.PI * kM2);
}

/**
 * The inverse-cube lateral-range curve for a sweep width W.
 *
 * @param lateralRangeM - x, metres (either side; |x| is used)
 * @param sweepWidthM - W, metres, > 0
 * @returns probability of detection on one pass, in [0, 1]
 * @example
 * inverseCubeLateralRange(1000, 2000); // 1 − e^(−1/π) ≈ 0.273
 */
export function inverseCubeLateralRange(lateralRangeM: number, sweepWidthM: number): number {
  if (!(sweepWidthM > 0) || !Number.isFinite(sweepWidthM)) {
    throw new SweepInputError('out-of-range', 'sweepWidthM', 'The sweep width must be a positive number of metres.');
  }
  const x = Math.abs(lateralRangeM);
  if (x === 0) return 1;
  return -Math.expm1(-(sweepWidthM * sweepWidthM) / (4 * Math.PI * x * x));
}

/**
 * POD of an inverse-cube sensor on parallel tracks with coverage factor C.
 *
 * @param coverageFactor - C = W / S, ≥ 0
 * @returns erf((√π / 2) · C), in [0, 1)
 * @example
 * inverseCubeParallelSweepPod(1); // ≈ 0.79
 */
export function inverseCubeParallelSweepPod(coverageFactor: number): number {
  if (!Number.isFinite(coverageFactor) || coverageFactor < 0) {
    throw new SweepInputError('out-of-range', 'coverageFactor', 'The coverage factor must be a number ≥ 0.');
  }
  return erf((Math.sqrt(Math.PI) / 2) * coverageFactor);
}

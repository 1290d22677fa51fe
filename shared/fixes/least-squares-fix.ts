import type { LatLon } from '@/shared/geo/types';
import { adjustFix, type AdjustedFix } from './adjust-fix';
import { FixError } from './fix-error';
import { intersectBearings } from './intersect-bearings';
import type { BearingLine } from './types';

/** A bearing whose residual exceeds this many σ disagrees with the others (common practice, no source). */
export const DISAGREEMENT_SIGMAS = 3;

/** A least-squares fix from three or more bearings. */
export interface LeastSquaresFix extends AdjustedFix {
  /** The pairwise crossing it started from and the pair (the pair cutting closest to 90°). */
  readonly start: { readonly position: LatLon; readonly pair: readonly [number, number] };
  /** Each bearing's residual in units of its σ (signed). */
  readonly normalisedResiduals: readonly number[];
  /**
   * Bearings whose |residual| exceeds {@link DISAGREEMENT_SIGMAS} σ. Least squares spreads one gross error
   * over every residual, so the wrong bearing is not always among them: see `disagreeing`.
   */
  readonly flagged: readonly number[];
  /**
   * The bearing that disagrees most, when any is flagged: with four or more,
   * the one whose removal leaves the others most consistent (the largest fall of Σ(r/σ)²); with three,
   * the largest normalised residual. Null when none is flagged.
   */
  readonly disagreeing: number | null;
}

/**
 * Weighted least-squares fix from three or more bearing lines on the WGS84
 * ellipsoid (weights 1/σ²; Gauss–Newton in `adjustFix`), started from the
 * pairwise intersection with the cut angle nearest 90°, with each bearing's
 * residual and a flag on those beyond 3σ.
 *
 * Sources: least squares and the 3σ outlier rule: Ghilani, "Adjustment
 * Computations" (2010) (from memory); leaving each bearing out in turn to pick
 * the disagreeing one (the fall of the misfit): common practice, no source.
 *
 * @param lines three or more bearing lines (radians), not modified
 * @throws {FixError} `too-few-bearings`, `parallel` (no pair crosses), and those of `adjustFix`
 * @example
 * leastSquaresFix([a, b, c]).residualsRad;
 */
export function leastSquaresFix(lines: readonly BearingLine[]): LeastSquaresFix {
  if (lines.length < 3) throw new FixError('too-few-bearings', 'A least-squares fix needs at least three bearings.');
  const start = bestPairCrossing(lines);
  const fix = adjustFix(lines, start.position);
  const normalisedResiduals = fix.residualsRad.map((r, i) => r / lines[i]!.sigmaRad);
  const flagged = normalisedResiduals.flatMap((z, i) => (Math.abs(z) > DISAGREEMENT_SIGMAS ? [i] : []));
  let disagreeing: number | null = null;
  if (flagged.length > 0) {
    const score =
      lines.length >= 4 ? leaveOneOutScores(lines, fix.position, fix.residualsRad) : normalisedResiduals.map(Math.abs);
    disagreeing = score.reduce((best, s, i) => (s > score[best]! ? i : best), 0);
  }
  return { ...fix, start: { position: start.position, pair: start.pair }, normalisedResiduals, flagged, disagreeing };
}

function bestPairCrossing(lines: readonly BearingLine[]) {
  let best: { position: LatLon; pair: [number, number]; quality: number } | null = null;
  let lastError: FixError | null = null;
  for (let i = 0; i < lines.length; i++) {
    for (let j = i + 1; j < lines.length; j++) {
      try {
        const x = intersectBearings(lines[i]!, lines[j]!, [i, j]);
        const quality = Math.sin(x.cutAngleRad);
        if (!best || quality > best.quality) best = { position: x.position, pair: [i, j], quality };
      } catch (error) {
        if (!(error instanceof FixError)) throw error;
        lastError = error;
      }
    }
  }
  if (!best) {
    throw new FixError(
      lastError?.code === 'diverging' ? 'diverging' : 'parallel',
      'No two of these bearings cross ahead of their posts: they are parallel or point apart.',
      lines.map((_, i) => i),
    );
  }
  return best;
}

/**
 * For each bearing, how much the misfit Σ(r/σ)² of the others falls when it is left out (the larger, the more
 * that bearing alone explains the disagreement); −∞ where the others do not fix a point.
 */
function leaveOneOutScores(lines: readonly BearingLine[], start: LatLon, residualsRad: readonly number[]): number[] {
  const misfit = (rs: readonly number[], ls: readonly BearingLine[]) =>
    rs.reduce((sum, r, i) => sum + (r / ls[i]!.sigmaRad) ** 2, 0);
  const whole = misfit(residualsRad, lines);
  return lines.map((_, i) => {
    const others = lines.filter((__, j) => j !== i);
    try {
      return whole - misfit(adjustFix(others, start).residualsRad, others);
    } catch (error) {
      if (!(error instanceof FixError)) throw error;
      return Number.NEGATIVE_INFINITY;
    }
  });
}

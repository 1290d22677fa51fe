import type { LatLon } from '@/shared/geo/types';
import { wrapPi } from './angles';
import { FixError } from './fix-error';
import { offsetPoint } from './offset-point';
import { MAX_FIX_DISTANCE_M } from './planar-crossing';
import { sightToPoint } from './sight-to-point';
import type { BearingLine } from './types';

/** The adjusted position and what the adjustment knows about it. */
export interface AdjustedFix {
  /** The position, WGS84 degrees. */
  readonly position: LatLon;
  /** Observed minus computed bearing per line, radians (−π…π), in the caller's order. */
  readonly residualsRad: readonly number[];
  /**
   * Covariance of the position in the local east/north plane at the fix,
   * square metres: [σₑ², σₑₙ, σₙ²], from the bearings' σ (a priori).
   */
  readonly covarianceM2: readonly [number, number, number];
  /** Gauss–Newton steps taken. */
  readonly iterations: number;
}

/** Stop when a step moves the fix less than this, metres (1e-6° of bearing at 30 km is 0.5 mm). */
const STEP_TOLERANCE_M = 1e-5;
const MAX_ITERATIONS = 50;
/** Closer to a post than this the bearing from it is undefined, metres. */
const MIN_DISTANCE_M = 1;

/**
 * Weighted least-squares position from two or more bearing lines on the
 * WGS84 ellipsoid: minimises Σ (rᵢ/σᵢ)², rᵢ the angle between the observed
 * bearing and the geodesic azimuth from the line's origin to the position,
 * by Gauss–Newton from `start`. The derivative of that azimuth is exact to
 * first order: a shift δ of the position across the geodesic (towards
 * azimuth α₂ + 90°) turns the azimuth at the origin by δ/m₁₂, m₁₂ the reduced
 * length. With two lines this is Newton's method for their intersection
 * (residuals → 0).
 *
 * Sources: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013)
 * 43–55 (reduced length, geodesic inverse); Gauss–Newton for weighted least
 * squares and the covariance (JᵀWJ)⁻¹ as in C. D. Ghilani, "Adjustment
 * Computations", 5th ed. (2010), chapters on nonlinear least squares and
 * error ellipses (from memory).
 *
 * @param lines bearing lines (radians), at least two
 * @param start first estimate, WGS84 degrees (e.g. from `planarCrossing`)
 * @returns the position, residuals (radians) and covariance (m²)
 * @throws {FixError} `parallel` (no unique position), `at-post`, `too-far`, `no-convergence`
 * @example
 * adjustFix(lines, planarCrossing(lines[0], lines[1])).position;
 */
export function adjustFix(lines: readonly BearingLine[], start: LatLon): AdjustedFix {
  if (lines.length < 2) throw new FixError('too-few-bearings', 'A fix needs at least two bearings.');
  const all = lines.map((_, i) => i);
  let position = start;
  for (let iteration = 1; iteration <= MAX_ITERATIONS; iteration++) {
    const { normal, gradient } = linearise(lines, position);
    const [nee, nen, nnn] = normal;
    const det = nee * nnn - nen * nen;
    // Relative test: the normal matrix of two lines crossing at angle θ has det ∝ sin²θ.
    if (!(det > 1e-12 * (nee + nnn) ** 2)) {
      throw new FixError('parallel', 'These bearings are (nearly) parallel: they do not fix one position.', all);
    }
    const dE = (nnn * gradient[0] - nen * gradient[1]) / det;
    const dN = (nee * gradient[1] - nen * gradient[0]) / det;
    position = offsetPoint(position, dE, dN);
    if (Math.hypot(dE, dN) > 2 * MAX_FIX_DISTANCE_M) {
      throw new FixError('too-far', 'These bearings do not meet within reach of the posts.', all);
    }
    if (Math.hypot(dE, dN) < STEP_TOLERANCE_M) {
      const last = linearise(lines, position);
      const [ee, en, nn] = last.normal;
      const d = ee * nn - en * en;
      return {
        position,
        residualsRad: last.residualsRad,
        covarianceM2: [nn / d, -en / d, ee / d],
        iterations: iteration,
      };
    }
  }
  throw new FixError('no-convergence', 'The fix did not settle: check the bearings and the posts.', all);
}

function linearise(lines: readonly BearingLine[], position: LatLon) {
  let nee = 0;
  let nen = 0;
  let nnn = 0;
  let ge = 0;
  let gn = 0;
  const residualsRad: number[] = [];
  lines.forEach((line, i) => {
    const sight = sightToPoint(line.from, position);
    if (sight.distanceM < MIN_DISTANCE_M || sight.reducedLengthM <= 0) {
      throw new FixError('at-post', 'The fix falls on a post: a bearing from there says nothing.', [i]);
    }
    const r = wrapPi(line.bearingRad - sight.azimuthAtFromRad);
    residualsRad.push(r);
    // d(azimuth at origin)/d(east, north of the position), radians per metre.
    const je = Math.cos(sight.azimuthAtPointRad) / sight.reducedLengthM;
    const jn = -Math.sin(sight.azimuthAtPointRad) / sight.reducedLengthM;
    const w = 1 / (line.sigmaRad * line.sigmaRad);
    nee += w * je * je;
    nen += w * je * jn;
    nnn += w * jn * jn;
    ge += w * je * r;
    gn += w * jn * r;
  });
  return { normal: [nee, nen, nnn] as const, gradient: [ge, gn] as const, residualsRad };
}

import { FixError } from './fix-error';
import { intersectBearings } from './intersect-bearings';
import { geodesicRing, type GeodesicRing } from './ring-area';
import type { BearingLine } from './types';

/** How the two-bearing error area is drawn, in words (returned with every such fix). */
export const ERROR_QUADRILATERAL_METHOD =
  'Error quadrilateral: the four crossings of each bearing turned by ± its uncertainty (1σ); ' +
  'common practice for cross-bearings and direction finding, no source.';

/**
 * The error area of a two-bearing fix: the quadrilateral whose corners are
 * the crossings of bearing A ± σA with bearing B ± σB (each crossing solved
 * on the ellipsoid like the fix itself), as a counter-clockwise GeoJSON ring
 * with its area. A narrower cut angle stretches it along the bisector: at a
 * cut angle θ the area grows about as 1/sin θ.
 *
 * Source: common practice, no source (the quadrilateral of lines of bearing
 * ± their error is the usual picture of a cross-bearing fix's uncertainty).
 *
 * @param a first bearing line (radians; its `sigmaRad` is the half-width)
 * @param b second bearing line (radians)
 * @returns ring ([lon, lat] degrees) and area (m²)
 * @throws {FixError} `error-area-unbounded` when a pair of turned bearings no longer crosses ahead of both posts
 * @example
 * errorQuadrilateral(a, b).areaM2; // m²
 */
export function errorQuadrilateral(a: BearingLine, b: BearingLine): GeodesicRing {
  const turned = (line: BearingLine, sign: 1 | -1): BearingLine => ({
    ...line,
    bearingRad: line.bearingRad + sign * line.sigmaRad,
  });
  const signs: [1 | -1, 1 | -1][] = [
    [1, 1],
    [1, -1],
    [-1, -1],
    [-1, 1],
  ];
  const corners = signs.map(([sa, sb]) => {
    try {
      return intersectBearings(turned(a, sa), turned(b, sb)).position;
    } catch (error) {
      if (!(error instanceof FixError)) throw error;
      throw new FixError(
        'error-area-unbounded',
        'Within their uncertainties these bearings may not cross at all (the cut is too narrow for the uncertainty): ' +
          'the error area has no bound. Take a bearing from a post with a wider cut, or a more precise bearing.',
        [0, 1],
      );
    }
  });
  return geodesicRing(corners);
}

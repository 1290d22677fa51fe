import type { LatLon } from '@/shared/geo/types';
import { offsetPoint } from './offset-point';
import { geodesicRing, type GeodesicRing } from './ring-area';

/** How the least-squares error area is drawn, in words (returned with every such fix). */
export const ERROR_ELLIPSE_METHOD =
  'Standard error ellipse (1σ, about 39 % probability for a two-dimensional normal error) of the least-squares ' +
  'position, from the bearings’ uncertainties, as in least-squares adjustment (C. D. Ghilani, Adjustment Computations).';

/** Vertices of the polygon drawn for an ellipse. */
const ELLIPSE_VERTICES = 72;

/** The error ellipse's axes and its polygon. */
export interface ErrorEllipse extends GeodesicRing {
  /** Semi-major axis, metres. */
  readonly semiMajorM: number;
  /** Semi-minor axis, metres. */
  readonly semiMinorM: number;
  /** Direction of the major axis, radians clockwise from true north, 0…π. */
  readonly majorAzimuthRad: number;
}

/**
 * The standard (1σ) error ellipse of a position from its east/north
 * covariance: semi-axes the square roots of the covariance's eigenvalues,
 * the major axis along the larger one's eigenvector; drawn as a 72-sided
 * polygon about the position (each vertex placed by the direct geodesic
 * problem) whose geodesic area is returned (0.13 % under πab).
 *
 * Source: C. D. Ghilani, "Adjustment Computations", 5th ed. (2010), error
 * ellipses (from memory); the eigen decomposition of a symmetric 2 × 2 matrix.
 *
 * @param centre the position, WGS84 degrees
 * @param covarianceM2 [σₑ², σₑₙ, σₙ²], square metres
 * @example
 * errorEllipse({ latDeg: 51.7, lonDeg: 15.3 }, [400, 0, 100]); // semiMajorM 20, semiMinorM 10, azimuth π/2
 */
export function errorEllipse(centre: LatLon, covarianceM2: readonly [number, number, number]): ErrorEllipse {
  const [see, sen, snn] = covarianceM2;
  const mean = (see + snn) / 2;
  const half = Math.hypot((see - snn) / 2, sen);
  const semiMajorM = Math.sqrt(Math.max(mean + half, 0));
  const semiMinorM = Math.sqrt(Math.max(mean - half, 0));
  // Angle of the major axis from east, counter-clockwise, then as an azimuth.
  const fromEast = 0.5 * Math.atan2(2 * sen, see - snn);
  const majorAzimuthRad = (((Math.PI / 2 - fromEast) % Math.PI) + Math.PI) % Math.PI;
  const ue = Math.sin(majorAzimuthRad);
  const un = Math.cos(majorAzimuthRad);
  const vertices: LatLon[] = [];
  for (let i = 0; i < ELLIPSE_VERTICES; i++) {
    const t = (2 * Math.PI * i) / ELLIPSE_VERTICES;
    const along = semiMajorM * Math.cos(t);
    const across = semiMinorM * Math.sin(t);
    vertices.push(offsetPoint(centre, along * ue + across * un, along * un - across * ue));
  }
  return { ...geodesicRing(vertices), semiMajorM, semiMinorM, majorAzimuthRad };
}

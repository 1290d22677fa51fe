/**
 * Bearing fixes: where bearings from two or more posts cross on the WGS84
 * ellipsoid, how sure that is (error quadrilateral or ellipse), and which
 * bearing disagrees. Pure and isomorphic; radians and metres inside, degrees
 * at `evaluateFix` and `trueBearingDeg`; geodesics by `geographiclib-geodesic`.
 */
export type * from './types';
export { FixError, type FixErrorCode } from './fix-error';
export { sightToPoint } from './sight-to-point';
export { offsetPoint } from './offset-point';
export { planarCrossing, MAX_FIX_DISTANCE_M } from './planar-crossing';
export { adjustFix, type AdjustedFix } from './adjust-fix';
export { intersectBearings, type BearingIntersection } from './intersect-bearings';
export { errorQuadrilateral, ERROR_QUADRILATERAL_METHOD } from './error-quadrilateral';
export { errorEllipse, ERROR_ELLIPSE_METHOD, type ErrorEllipse } from './error-ellipse';
export { geodesicRing, type GeodesicRing } from './ring-area';
export { leastSquaresFix, DISAGREEMENT_SIGMAS, type LeastSquaresFix } from './least-squares-fix';
export { trueBearingDeg } from './true-bearing';
export { evaluateFix, FIX_CAUTIONS, GOOD_CUT_ANGLE_DEG, type ResolvedFixBearing } from './evaluate-fix';
export { modelDeclination, MAGNETIC_MODEL, type ModelDeclination } from './declination';
export { BEARING_INSTRUMENTS, type BearingInstrument } from './instruments';
export { horizonDipRad, smoothEarthRangeM } from './depression-range';
export { rayTerrainHit, type RayTerrainHit, type RayTerrainInput } from './ray-terrain-hit';
export {
  evaluateVerticalAngleFix,
  VERTICAL_ANGLE_CAUTION,
  type TerrainAlongBearing,
  type VerticalAngleOptions,
} from './vertical-angle-fix';
export { landmarkOffsetFix, LANDMARK_BEARING_SIGMA_DEG, type LandmarkOffsetInput } from './landmark-offset-fix';

/**
 * Kenning's coordinate entry and display for posts, on WGS84: read what a
 * person types (DD, DDM, DMS, UTM), write positions back in each format,
 * and convert to and from UTM. Pure and isomorphic; degrees and metres at
 * this edge.
 */
export type * from '@/shared/geo/types';
export { CoordinateError, type CoordinateErrorCode, type CoordinatePart } from '@/shared/geo/coordinate-error';
export { parseCoordinate, MAX_COORDINATE_TEXT_LENGTH } from '@/shared/geo/parse-coordinate';
export { formatCoordinate, type FormatCoordinateOptions } from '@/shared/geo/format-coordinate';
export * from '@/shared/geo/utm';
export { checkLatLon } from '@/shared/geo/check-lat-lon';
export { wrapLongitude } from '@/shared/geo/wrap-longitude';

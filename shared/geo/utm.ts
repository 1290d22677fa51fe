/**
 * UTM on WGS84 (via proj4): zone of a position with the Norway/Svalbard
 * exceptions, latitude bands, and conversions both ways. Each function lives
 * in its own module; this file gathers them for `@/shared/geo/utm`.
 */
export { utmZoneFor } from '@/shared/geo/utm-zone-for';
export { toUtm } from '@/shared/geo/to-utm';
export { fromUtm } from '@/shared/geo/from-utm';
export { latitudeBand, LATITUDE_BANDS } from '@/shared/geo/latitude-band';
export { utmCentralMeridian } from '@/shared/geo/utm-central-meridian';
export { utmGridConvergence } from '@/shared/geo/utm-grid-convergence';
export { UTM_NORTH_LIMIT_DEG, UTM_SOUTH_LIMIT_DEG } from '@/shared/geo/check-utm-area';
export { MAX_ZONE_REACH_DEG } from '@/shared/geo/check-zone-reach';
export type { Hemisphere, UtmCoordinate, UtmPosition } from '@/shared/geo/types';

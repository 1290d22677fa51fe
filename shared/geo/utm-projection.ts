import proj4 from 'proj4';

import type { Hemisphere } from '@/shared/geo/types';

/** Forward (degrees → metres) and inverse (metres → degrees) of one UTM grid on WGS84. */
export interface UtmProjection {
  /** `[lonDeg, latDeg]` → `[easting, northing]` in metres. */
  readonly forward: (lonLat: readonly [number, number]) => [number, number];
  /** `[easting, northing]` in metres → `[lonDeg, latDeg]` (longitude not wrapped). */
  readonly inverse: (en: readonly [number, number]) => [number, number];
}

const cache = new Map<string, UtmProjection>();

/**
 * The proj4 transverse Mercator of one UTM zone on WGS84
 * (`+proj=utm +zone=Z [+south] +datum=WGS84`): scale 0.9996 on the central
 * meridian, false easting 500 000 m, false northing 0 m (north) or
 * 10 000 000 m (south). Neither direction checks its input: callers
 * validate zone, range and area first.
 *
 * Converters are built once per zone and hemisphere and kept (a memo:
 * the same arguments always give the same answers).
 *
 * @param zone - UTM zone, integer 1–60
 * @param hemisphere - `N` or `S`
 * @returns the zone's forward and inverse
 *
 * Source: proj4 (npm), its `utm` projection (the extended transverse
 * Mercator series), used as a general-purpose reference implementation.
 *
 * @example
 * utmProjection(33, 'N').forward([15, 61]); // [500000, 6762787.35]
 */
export function utmProjection(zone: number, hemisphere: Hemisphere): UtmProjection {
  const key = `${zone}${hemisphere}`;
  const known = cache.get(key);
  if (known) return known;
  const converter = proj4(
    'WGS84',
    `+proj=utm +zone=${zone}${hemisphere === 'S' ? ' +south' : ''} +datum=WGS84 +units=m +no_defs`,
  );
  const projection: UtmProjection = {
    forward: ([lon, lat]) => {
      const [x, y] = converter.forward([lon, lat]);
      return [x ?? Number.NaN, y ?? Number.NaN];
    },
    inverse: ([e, n]) => {
      const [lon, lat] = converter.inverse([e, n]);
      return [lon ?? Number.NaN, lat ?? Number.NaN];
    },
  };
  cache.set(key, projection);
  return projection;
}

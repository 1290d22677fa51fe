import { Geodesic } from 'geographiclib-geodesic';
import type { LatLon } from '@/shared/geo/types';

/** A closed GeoJSON ring, counter-clockwise, and the area it encloses. */
export interface GeodesicRing {
  /** [longitude, latitude] degrees, first position repeated at the end, counter-clockwise (RFC 7946 §3.1.6). */
  readonly ring: [number, number][];
  /** Area on the WGS84 ellipsoid, square metres. */
  readonly areaM2: number;
}

/**
 * Closes a polygon's vertices into a counter-clockwise GeoJSON ring (its
 * edges are geodesics) and measures its area on the WGS84 ellipsoid.
 *
 * Sources: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013),
 * §6 (area of a geodesic polygon), as `geographiclib-geodesic`'s
 * PolygonArea; RFC 7946 (GeoJSON) §3.1.6 for the winding.
 *
 * @param vertices three or more positions, WGS84 degrees, either winding, not closed (not modified)
 * @example
 * geodesicRing([{ latDeg: 0, lonDeg: 0 }, { latDeg: 0, lonDeg: 0.01 }, { latDeg: 0.01, lonDeg: 0 }]).areaM2; // ≈ 6.15e5
 */
export function geodesicRing(vertices: readonly LatLon[]): GeodesicRing {
  const polygon = Geodesic.WGS84.Polygon(false);
  for (const v of vertices) polygon.AddPoint(v.latDeg, v.lonDeg);
  // sign = true: counter-clockwise rings are positive.
  const { area = 0 } = polygon.Compute(false, true);
  const ordered = area < 0 ? [...vertices].reverse() : [...vertices];
  const ring = ordered.map((v) => [v.lonDeg, v.latDeg] as [number, number]);
  ring.push([...ring[0]!] as [number, number]);
  return { ring, areaM2: Math.abs(area) };
}

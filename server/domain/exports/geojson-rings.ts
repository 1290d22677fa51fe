import { Geodesic } from 'geographiclib-geodesic';
import type { LatLon } from '@/shared/geo/types';

/** A GeoJSON position: longitude, latitude (WGS84 degrees). */
export type Position = [number, number];

/** Decimals kept in coordinates: 6 (≈ 0.1 m), enough for planning (RFC 7946 §11.2). */
export const COORDINATE_DECIMALS = 6;
const SCALE = 10 ** COORDINATE_DECIMALS;

/** A coordinate rounded to {@link COORDINATE_DECIMALS}. */
export const roundCoordinate = (v: number) => Math.round(v * SCALE) / SCALE;

/** Twice the signed planar area of a closed ring in lon/lat; positive = counter-clockwise. */
export function signedArea2(ring: readonly Position[]): number {
  let sum = 0;
  for (let i = 0; i + 1 < ring.length; i++) {
    const [x1, y1] = ring[i]!;
    const [x2, y2] = ring[i + 1]!;
    sum += x1 * y2 - x2 * y1;
  }
  return sum;
}

/**
 * A linear ring as RFC 7946 wants it: positions rounded to 6 decimals,
 * consecutive duplicates dropped, closed (last = first), and wound
 * counter-clockwise for an exterior ring, clockwise for a hole.
 *
 * Source: RFC 7946 §3.1.6 (linear rings: ≥ 4 positions, closed; exterior
 * counter-clockwise, holes clockwise) and §11.2 (precision).
 *
 * @param points the ring's positions, open or closed (not modified)
 * @param exterior true for the outer ring of a polygon
 * @returns the ring, or null when fewer than three distinct positions remain
 */
export function rfc7946Ring(points: readonly Position[], exterior: boolean): Position[] | null {
  const ring: Position[] = [];
  for (const [lon, lat] of points) {
    const p: Position = [roundCoordinate(lon), roundCoordinate(lat)];
    const last = ring[ring.length - 1];
    if (!last || last[0] !== p[0] || last[1] !== p[1]) ring.push(p);
  }
  const first = ring[0];
  const last = ring[ring.length - 1];
  if (first && last && ring.length > 1 && first[0] === last[0] && first[1] === last[1]) ring.pop();
  if (ring.length < 3) return null;
  ring.push([...ring[0]!]);
  const area = signedArea2(ring);
  if (area === 0) return null;
  if (area > 0 !== exterior) ring.reverse();
  return ring;
}

/** The point `distanceM` from `from` along the geodesic that leaves at `azimuthDeg` (true). */
export function geodesicDestination(from: LatLon, azimuthDeg: number, distanceM: number): Position {
  const r = Geodesic.WGS84.Direct(from.latDeg, from.lonDeg, azimuthDeg, distanceM, Geodesic.LATITUDE | Geodesic.LONGITUDE);
  return [r.lon2 ?? from.lonDeg, r.lat2 ?? from.latDeg];
}

/** Degrees between vertices of circles and arcs (a 25 km ring: chords ≈ 1.1 km, ≤ 6 m inside the circle). */
export const ARC_STEP_DEG = 2.5;

/**
 * A range ring: the points at `radiusM` from `centre` along geodesics in
 * every direction (every {@link ARC_STEP_DEG}), as an RFC 7946 exterior ring.
 *
 * Source: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013),
 * the direct problem (geographiclib-geodesic).
 */
export function geodesicCircle(centre: LatLon, radiusM: number): Position[] | null {
  const points: Position[] = [];
  for (let az = 0; az < 360; az += ARC_STEP_DEG) points.push(geodesicDestination(centre, az, radiusM));
  return rfc7946Ring(points, true);
}

/**
 * A viewing sector: from the post out to `radiusM` along the `fromDeg`
 * bearing, clockwise along the arc to `toDeg` (true bearings; across north
 * when `toDeg` < `fromDeg`), and back to the post; as an RFC 7946 exterior ring.
 */
export function geodesicSector(centre: LatLon, fromDeg: number, toDeg: number, radiusM: number): Position[] | null {
  const span = (((toDeg - fromDeg) % 360) + 360) % 360 || 360;
  const steps = Math.max(2, Math.ceil(span / ARC_STEP_DEG));
  const points: Position[] = [[centre.lonDeg, centre.latDeg]];
  for (let i = 0; i <= steps; i++) points.push(geodesicDestination(centre, fromDeg + (span * i) / steps, radiusM));
  return rfc7946Ring(points, true);
}

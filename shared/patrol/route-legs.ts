import { geodesicInverse } from '@/shared/geo/geodesic-inverse';
import type { LatLon } from '@/shared/geo/types';

/** The legs of a patrol route and the time it takes at a speed. */
export interface RouteLegs {
  /** Each leg's geodesic length, metres (waypoint i → i + 1). */
  readonly legLengthsM: readonly number[];
  /** Sum of the legs, metres. */
  readonly totalM: number;
  /** Time to run the route once at the speed, seconds (null without a speed). */
  readonly transitS: number | null;
}

/**
 * Lengths of a route's legs on the WGS84 ellipsoid and the time to run it
 * once at `speedMps`.
 *
 * Source: geodesic lengths by C. F. F. Karney's algorithm (`geodesicInverse`);
 * time = length ÷ speed — common practice, no source.
 *
 * @param waypoints - at least one position, degrees (not modified)
 * @param speedMps - speed along the route, m/s; null or ≤ 0 → no time
 * @example
 * routeLegs([{ latDeg: 0, lonDeg: 0 }, { latDeg: 0, lonDeg: 0.1 }], 5).transitS; // ≈ 2226.4
 */
export function routeLegs(waypoints: readonly LatLon[], speedMps: number | null): RouteLegs {
  const legLengthsM: number[] = [];
  for (let i = 1; i < waypoints.length; i++) legLengthsM.push(geodesicInverse(waypoints[i - 1]!, waypoints[i]!).distanceM);
  const totalM = legLengthsM.reduce((a, b) => a + b, 0);
  return { legLengthsM, totalM, transitS: speedMps !== null && speedMps > 0 ? totalM / speedMps : null };
}

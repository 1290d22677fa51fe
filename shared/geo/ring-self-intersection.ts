import { kinks } from '@turf/kinks';

/**
 * Where a closed polygon ring crosses itself, if it does: the first crossing
 * point found, as `[longitude, latitude]` degrees, or null for a simple ring.
 * Corners repeated one after another are skipped first (they are not a
 * crossing). Uses `@turf/kinks`, which tests every pair of non-adjacent sides
 * in the plane of the coordinates (fine at a site's scale).
 *
 * @param ring - closed ring of `[lon, lat]` pairs (first corner repeated last)
 * @returns the crossing `[lon, lat]`, or null
 *
 * @example
 * ringSelfIntersection([[0, 0], [1, 1], [1, 0], [0, 1], [0, 0]]); // [0.5, 0.5] (a bow tie)
 */
export function ringSelfIntersection(ring: readonly (readonly [number, number])[]): [number, number] | null {
  const points: [number, number][] = [];
  for (const p of ring) {
    const last = points[points.length - 1];
    if (!last || last[0] !== p[0] || last[1] !== p[1]) points.push([p[0], p[1]]);
  }
  if (points.length < 4) return null;
  const first = points[0]!;
  const last = points[points.length - 1]!;
  if (first[0] !== last[0] || first[1] !== last[1]) points.push([first[0], first[1]]);
  const found = kinks({ type: 'Polygon', coordinates: [points] });
  const hit = found.features[0]?.geometry.coordinates;
  return hit ? [hit[0]!, hit[1]!] : null;
}

/** How far a polygon lies from a lookout and how much of it a range reaches. */
export interface RingReach {
  /** Distance to the nearest point of the polygon, metres (0 when the lookout is inside). */
  readonly nearestM: number;
  /** Distance to the farthest point of the polygon, metres. */
  readonly farthestM: number;
  /** Share of the polygon's area within the range and the viewing sector, 0…1. */
  readonly coveredShare: number;
}

/** A viewing sector, clockwise from `fromDeg` to `toDeg`, degrees true. */
export interface Sector {
  readonly fromDeg: number;
  readonly toDeg: number;
}

/** Sample grid side used to measure the covered share (samples = SIDE²). */
const SIDE = 96;

const insideRing = (ring: readonly (readonly [number, number])[], x: number, y: number) => {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!;
    const [xj, yj] = ring[j]!;
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
};

const distanceToSegment = (ax: number, ay: number, bx: number, by: number) => {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, -(ax * dx + ay * dy) / len2));
  return Math.hypot(ax + t * dx, ay + t * dy);
};

/** True when the bearing (degrees) lies in the clockwise sector; a null sector is all round. */
export const inSector = (bearingDeg: number, sector: Sector | null) => {
  if (!sector) return true;
  const span = (((sector.toDeg - sector.fromDeg) % 360) + 360) % 360 || 360;
  const off = (((bearingDeg - sector.fromDeg) % 360) + 360) % 360;
  return off <= span;
};

/**
 * Measures a polygon (a priority zone, a named area) against one lookout's
 * reach: nearest and farthest distance, and the share of its area lying both
 * within `rangeM` and inside the viewing sector. The polygon is given in a
 * plane centred on the lookout (metres east, north), e.g. from
 * `projectAzimuthalEquidistant`. The share is measured on a regular
 * 96 × 96 grid of sample points over the polygon's bounding box (cell
 * centres inside the polygon), so it is good to about 1 % of the area for a
 * polygon filling its box.
 *
 * Source: point-in-polygon by the crossing-number rule and point-to-segment
 * distance — common practice, no source.
 *
 * @param ring the polygon's corners, [x, y] metres, lookout at the origin; closed or open (not modified)
 * @param rangeM the reach, metres (e.g. a detection range); ≥ 0, Infinity allowed
 * @param sector the viewing sector, or null for all round
 * @returns nearest and farthest distance (m) and the covered share 0…1
 * @throws RangeError for fewer than three corners or a negative or NaN range
 * @example
 * ringReach([[-500, 9500], [500, 9500], [500, 10500], [-500, 10500]], 20_000, null);
 * // { nearestM: 9500, farthestM: 10511.9…, coveredShare: 1 }
 */
export function ringReach(ring: readonly (readonly [number, number])[], rangeM: number, sector: Sector | null): RingReach {
  if (ring.length < 3) throw new RangeError('A polygon needs at least three corners.');
  if (!(rangeM >= 0)) throw new RangeError(`The range must be ≥ 0 m, got ${rangeM}.`);
  let farthestM = 0;
  let nearestM = Infinity;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (let i = 0; i < ring.length; i++) {
    const [x, y] = ring[i]!;
    const [nx, ny] = ring[(i + 1) % ring.length]!;
    farthestM = Math.max(farthestM, Math.hypot(x, y));
    nearestM = Math.min(nearestM, distanceToSegment(x, y, nx, ny));
    minX = Math.min(minX, x);
    maxX = Math.max(maxX, x);
    minY = Math.min(minY, y);
    maxY = Math.max(maxY, y);
  }
  if (insideRing(ring, 0, 0)) nearestM = 0;

  let inside = 0;
  let covered = 0;
  const stepX = (maxX - minX) / SIDE;
  const stepY = (maxY - minY) / SIDE;
  for (let r = 0; r < SIDE; r++) {
    const y = minY + (r + 0.5) * stepY;
    for (let c = 0; c < SIDE; c++) {
      const x = minX + (c + 0.5) * stepX;
      if (!insideRing(ring, x, y)) continue;
      inside++;
      const bearing = ((Math.atan2(x, y) * 180) / Math.PI + 360) % 360;
      if (Math.hypot(x, y) <= rangeM && inSector(bearing, sector)) covered++;
    }
  }
  // A sliver too thin for the grid: judge it by its corners' distances.
  const coveredShare = inside === 0 ? (farthestM <= rangeM ? 1 : 0) : covered / inside;
  return { nearestM, farthestM, coveredShare };
}

/** The smallest rectangle holding a set of grid points: grid metres, x east, y north. */
export interface PointsBounds {
  readonly west: number;
  readonly south: number;
  readonly east: number;
  readonly north: number;
}

/**
 * The bounds of grid points: the least and greatest x (west, east) and y
 * (south, north), in the points' own units (grid metres). Pure.
 *
 * @param points - points on the grid, x east and y north
 * @returns the bounds, or null when there are no points
 *
 * @example
 * boundsOfPoints([{ x: 3, y: 1 }, { x: -2, y: 4 }]); // { west: -2, south: 1, east: 3, north: 4 }
 */
export function boundsOfPoints(points: readonly { x: number; y: number }[]): PointsBounds | null {
  if (points.length === 0) return null;
  let west = Infinity;
  let south = Infinity;
  let east = -Infinity;
  let north = -Infinity;
  for (const p of points) {
    west = Math.min(west, p.x);
    east = Math.max(east, p.x);
    south = Math.min(south, p.y);
    north = Math.max(north, p.y);
  }
  return { west, south, east, north };
}

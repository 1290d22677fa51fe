import type { LatLon } from '@/shared/geo/types';
import { TerrainInputError } from './terrain-input-error';

/** Where a grid lies: its size in cells, cell size and lower-left corner, in its CRS's metres. */
export interface FootprintGrid {
  readonly width: number;
  readonly height: number;
  readonly cellSize: number;
  readonly xll: number;
  readonly yll: number;
}

/**
 * The footprint of a terrain grid as a WGS 84 ring: the rectangle through the
 * centres of the grid's outermost cells (half a cell inside its outer edge,
 * so every point of the ring has a height between cell centres), each side
 * cut into `segmentsPerEdge` pieces and every point reprojected with
 * `toLatLon`. A grid line that is straight in a projected CRS is slightly
 * curved in degrees; the extra points follow that curve. No-data cells at the
 * grid's edges are inside the footprint all the same.
 *
 * The ring runs counter-clockwise (south-west, south-east, north-east,
 * north-west) as `[longitude, latitude]` pairs rounded to 7 decimals (about
 * 1 cm), closed (its last point repeats the first).
 *
 * @param grid the grid's size and position, metres of its CRS
 * @param toLatLon the grid CRS → WGS 84 conversion
 * @param segmentsPerEdge pieces per side (1 … 1000), default 8
 * @returns the closed ring, `4 · segmentsPerEdge + 1` points
 * @throws TerrainInputError `invalid-option` for a grid of fewer than 2 × 2 cells or a bad segment count
 * @example
 * gridFootprintRing({ width: 3, height: 2, cellSize: 10, xll: 500000, yll: 0 }, (x, y) => toWgs84(x, y), 1);
 * // [[sw], [se], [ne], [nw], [sw]] through the cell centres (500005, 5) … (500025, 15)
 */
export function gridFootprintRing(
  grid: FootprintGrid,
  toLatLon: (x: number, y: number) => LatLon,
  segmentsPerEdge = 8,
): [number, number][] {
  if (!(grid.width >= 2 && grid.height >= 2 && grid.cellSize > 0)) {
    throw new TerrainInputError('invalid-option', 'A footprint needs a grid of at least 2 × 2 cells.', 'grid');
  }
  if (!Number.isInteger(segmentsPerEdge) || segmentsPerEdge < 1 || segmentsPerEdge > 1000) {
    throw new TerrainInputError('invalid-option', 'segmentsPerEdge is a whole number from 1 to 1000.', 'segmentsPerEdge');
  }
  const west = grid.xll + grid.cellSize / 2;
  const south = grid.yll + grid.cellSize / 2;
  const east = grid.xll + (grid.width - 0.5) * grid.cellSize;
  const north = grid.yll + (grid.height - 0.5) * grid.cellSize;
  const corners: [number, number][] = [
    [west, south],
    [east, south],
    [east, north],
    [west, north],
  ];
  const round = (v: number) => Math.round(v * 1e7) / 1e7;
  const ring: [number, number][] = [];
  for (let c = 0; c < 4; c++) {
    const [x0, y0] = corners[c]!;
    const [x1, y1] = corners[(c + 1) % 4]!;
    for (let s = 0; s < segmentsPerEdge; s++) {
      const f = s / segmentsPerEdge;
      const p = toLatLon(x0 + (x1 - x0) * f, y0 + (y1 - y0) * f);
      ring.push([round(p.lonDeg), round(p.latDeg)]);
    }
  }
  ring.push([...ring[0]!]);
  return ring;
}

import { contours } from 'd3-contour';
import type { LatLon } from '@/shared/geo/types';
import type { RasterGrid } from '@/shared/terrain/terrain-raster';
import { rfc7946Ring, type Position } from './geojson-rings';

/** A cell of a grid: column from the west, row from the north. */
export interface GridCell {
  readonly col: number;
  readonly row: number;
}

/**
 * The 8-connected patch of `mask` cells (value 1) that holds `seed` — the
 * same connectivity as the coverage statistics' blind areas — as a mask on
 * its bounding box padded by one empty cell each side. Null when the seed is
 * not a mask cell.
 */
function patchAround(grid: RasterGrid, mask: Uint8Array, seed: GridCell, visited: Uint8Array) {
  const { width: W, height: H } = grid;
  const start = seed.row * W + seed.col;
  if (seed.col < 0 || seed.col >= W || seed.row < 0 || seed.row >= H || mask[start] !== 1) return null;
  const cells: number[] = [start];
  visited[start] = 1;
  let minCol = seed.col;
  let maxCol = seed.col;
  let minRow = seed.row;
  let maxRow = seed.row;
  for (let k = 0; k < cells.length; k++) {
    const i = cells[k]!;
    const col = i % W;
    const row = (i - col) / W;
    if (col < minCol) minCol = col;
    if (col > maxCol) maxCol = col;
    if (row < minRow) minRow = row;
    if (row > maxRow) maxRow = row;
    for (let r = Math.max(0, row - 1); r <= Math.min(H - 1, row + 1); r++) {
      for (let c = Math.max(0, col - 1); c <= Math.min(W - 1, col + 1); c++) {
        const j = r * W + c;
        if (mask[j] === 1 && visited[j] === 0) {
          visited[j] = 1;
          cells.push(j);
        }
      }
    }
  }
  // One empty cell around the patch, so every contour closes inside the box.
  const col0 = minCol - 1;
  const row0 = minRow - 1;
  const boxWidth = maxCol - minCol + 3;
  const boxHeight = maxRow - minRow + 3;
  const values = new Array<number>(boxWidth * boxHeight).fill(0);
  for (const i of cells) {
    const col = i % W;
    const row = (i - col) / W;
    values[(row - row0) * boxWidth + (col - col0)] = 1;
    visited[i] = 0; // left clean for the next patch
  }
  return { col0, row0, boxWidth, boxHeight, values, cells: cells.length };
}

/** Drops vertices that lie on the straight line between their neighbours (exact: contour vertices are on a half-cell lattice). */
function dropCollinear(ring: readonly Position[]): Position[] {
  const open = ring.slice(0, -1);
  const kept = open.filter((p, i) => {
    const a = open[(i - 1 + open.length) % open.length]!;
    const b = open[(i + 1) % open.length]!;
    return (p[0] - a[0]) * (b[1] - a[1]) - (p[1] - a[1]) * (b[0] - a[0]) !== 0;
  });
  return kept;
}

/**
 * The outline of the blind patch of `mask` that contains `seed`, traced with
 * d3-contour's marching squares at the 0.5 level of the 0/1 patch mask and
 * put into WGS84 by `toLatLon` (the terrain CRS → latitude/longitude), as
 * RFC 7946 MultiPolygon coordinates (exterior rings counter-clockwise, holes
 * clockwise, closed, 6 decimals).
 *
 * Cell (col, row) is the square [col, col + 1] × [row, row + 1] in
 * d3-contour's frame (x east, y south, origin at the grid's north-west
 * corner); the outline runs through the middles of the edges between a
 * blind cell and its seen neighbours, so it cuts the corners of the cell
 * squares and always contains each blind cell's centre. Two cells that only
 * touch at a corner (one patch by the statistics' 8-connectivity) may come
 * out as two polygons of the MultiPolygon.
 *
 * Source: d3-contour (marching squares, Lorensen & Cline); RFC 7946 §3.1.6–3.1.7.
 *
 * @param grid the layer's grid (metres of its CRS; row 0 = north)
 * @param mask 1 = blind site cell, else 0; `width × height`, row-major (not modified)
 * @param seed a cell of the patch (a blind area's interior point)
 * @param toLatLon grid metres → WGS84 degrees
 * @param scratch `width × height` zeros, reused across calls (left all zero again); default a new one
 * @returns the polygons and the patch's cell count, or null when `seed` is not blind
 */
export function blindAreaPolygon(
  grid: RasterGrid,
  mask: Uint8Array,
  seed: GridCell,
  toLatLon: (x: number, y: number) => LatLon,
  scratch: Uint8Array = new Uint8Array(grid.width * grid.height),
): { coordinates: Position[][][]; cells: number } | null {
  const patch = patchAround(grid, mask, seed, scratch);
  if (!patch) return null;
  const [outline] = contours().size([patch.boxWidth, patch.boxHeight]).thresholds([0.5]).smooth(false)(patch.values);
  const yTop = grid.yll + grid.height * grid.cellSize;
  const toLonLat = ([px, py]: Position): Position => {
    const x = grid.xll + (patch.col0 + px) * grid.cellSize;
    const y = yTop - (patch.row0 + py) * grid.cellSize;
    const { lonDeg, latDeg } = toLatLon(x, y);
    return [lonDeg, latDeg];
  };
  const coordinates: Position[][][] = [];
  for (const polygon of (outline?.coordinates ?? []) as Position[][][]) {
    const [outer, ...holes] = polygon.map((ring, i) => rfc7946Ring(dropCollinear(ring).map(toLonLat), i === 0));
    if (outer) coordinates.push([outer, ...holes.filter((h): h is Position[] => h !== null)]);
  }
  return { coordinates, cells: patch.cells };
}

import { contours } from 'd3-contour';
import type { LatLon } from '@/shared/geo/types';
import type { GridSpec } from '@/shared/terrain/grid-spec';
import { rfc7946Ring, type Position } from './geojson-rings';

/** A cell of a grid: column from the west, row from the north. */
export interface GridCell {
  readonly col: number;
  readonly row: number;
}

/** The outline of one blind patch: RFC 7946 MultiPolygon coordinates and the patch's cell count. */
export interface BlindPatchOutline {
  coordinates: Position[][][];
  cells: number;
}

/**
 * Labels the 8-connected patch of `mask` cells (value 1) around each seed
 * with the seed's number (1, 2, …) — the same connectivity as the coverage
 * statistics' blind areas. A seed off the mask, or in a patch an earlier
 * seed labelled, labels nothing. Returns each seed's cell count (0 for
 * those) and the bounding box of every labelled cell.
 */
function labelPatches(grid: GridSpec, mask: Uint8Array, seeds: readonly GridCell[], labels: Int32Array) {
  const { width: W, height: H } = grid;
  const counts = seeds.map(() => 0);
  const box = { minCol: W, maxCol: -1, minRow: H, maxRow: -1 };
  const stack: number[] = [];
  seeds.forEach((seed, k) => {
    const start = seed.row * W + seed.col;
    if (seed.col < 0 || seed.col >= W || seed.row < 0 || seed.row >= H || mask[start] !== 1 || labels[start] !== 0) return;
    labels[start] = k + 1;
    stack.push(start);
    while (stack.length > 0) {
      const i = stack.pop()!;
      counts[k] = counts[k]! + 1;
      const col = i % W;
      const row = (i - col) / W;
      if (col < box.minCol) box.minCol = col;
      if (col > box.maxCol) box.maxCol = col;
      if (row < box.minRow) box.minRow = row;
      if (row > box.maxRow) box.maxRow = row;
      for (let r = Math.max(0, row - 1); r <= Math.min(H - 1, row + 1); r++) {
        for (let c = Math.max(0, col - 1); c <= Math.min(W - 1, col + 1); c++) {
          const j = r * W + c;
          if (mask[j] === 1 && labels[j] === 0) {
            labels[j] = k + 1;
            stack.push(j);
          }
        }
      }
    }
  });
  return { counts, box };
}

/** Drops vertices that lie on the straight line between their neighbours (exact: contour vertices are on a half-cell lattice). */
function dropCollinear(ring: readonly Position[]): Position[] {
  const open = ring.slice(0, -1);
  return open.filter((p, i) => {
    const a = open[(i - 1 + open.length) % open.length]!;
    const b = open[(i + 1) % open.length]!;
    return (p[0] - a[0]) * (b[1] - a[1]) - (p[1] - a[1]) * (b[0] - a[0]) !== 0;
  });
}

/**
 * The outlines of the blind patches of `mask` that hold the `seeds` (one per
 * listed blind area, e.g. its interior point), traced with d3-contour's
 * marching squares at the 0.5 level and put into WGS84 by `toLatLon` (the
 * terrain CRS → latitude/longitude), as RFC 7946 MultiPolygon coordinates
 * (exterior rings counter-clockwise, holes clockwise, closed, 6 decimals).
 *
 * The seeds' patches are labelled first (8-connected flood fill), then one
 * contour pass runs over the box around all of them with every other cell
 * cleared, and each polygon goes to the patch of the blind cell beside its
 * first vertex. Cell (col, row) is the square [col, col + 1] × [row, row + 1]
 * in d3-contour's frame (x east, y south, origin at the box's north-west
 * corner); without smoothing every vertex is the middle of an edge between a
 * blind cell and a cell that is not, so the outline cuts the corners of the
 * cell squares and always contains each blind cell's centre. Two cells that
 * only touch at a corner (one patch by 8-connectivity) may come out as two
 * polygons of the MultiPolygon.
 *
 * Source: d3-contour (marching squares); RFC 7946 §3.1.6–3.1.7.
 *
 * @param grid the layer's grid (metres of its CRS; row 0 = north)
 * @param mask 1 = blind site cell, else 0; `width × height`, row-major (not modified)
 * @param seeds a cell of each wanted patch
 * @param toLatLon grid metres → WGS84 degrees
 * @returns per seed its outline, or null when the seed is not a blind cell (or its patch was an earlier seed's)
 * @example
 * const [outline] = blindAreaPolygons(grid, blindMask, [{ col: 120, row: 48 }], projection.toLatLon);
 */
export function blindAreaPolygons(
  grid: GridSpec,
  mask: Uint8Array,
  seeds: readonly GridCell[],
  toLatLon: (x: number, y: number) => LatLon,
): (BlindPatchOutline | null)[] {
  const { width: W } = grid;
  const labels = new Int32Array(grid.width * grid.height);
  const { counts, box } = labelPatches(grid, mask, seeds, labels);
  const outlines: (BlindPatchOutline | null)[] = counts.map((n) => (n > 0 ? { coordinates: [], cells: n } : null));
  if (box.maxCol < 0) return outlines;

  // One empty cell around the box, so every contour closes inside it.
  const col0 = box.minCol - 1;
  const row0 = box.minRow - 1;
  const boxWidth = box.maxCol - box.minCol + 3;
  const boxHeight = box.maxRow - box.minRow + 3;
  const values = new Uint8Array(boxWidth * boxHeight);
  const labelAt = (col: number, row: number) =>
    col < 0 || row < 0 || col >= W || row >= grid.height ? 0 : labels[row * W + col]!;
  for (let r = 1; r < boxHeight - 1; r++) {
    for (let c = 1; c < boxWidth - 1; c++) if (labelAt(col0 + c, row0 + r) > 0) values[r * boxWidth + c] = 1;
  }
  const [outline] = contours().size([boxWidth, boxHeight]).thresholds([0.5]).smooth(false)(values as unknown as number[]);

  const yTop = grid.yll + grid.height * grid.cellSize;
  const toLonLat = ([px, py]: Position): Position => {
    const { lonDeg, latDeg } = toLatLon(grid.xll + (col0 + px) * grid.cellSize, yTop - (row0 + py) * grid.cellSize);
    return [lonDeg, latDeg];
  };
  // The patch of a polygon: the labelled cell on either side of its first vertex (an edge middle).
  const labelOf = ([px, py]: Position) => {
    if (Number.isInteger(px)) {
      const row = row0 + Math.floor(py);
      return labelAt(col0 + px - 1, row) || labelAt(col0 + px, row);
    }
    const col = col0 + Math.floor(px);
    return labelAt(col, row0 + py - 1) || labelAt(col, row0 + py);
  };
  for (const polygon of (outline?.coordinates ?? []) as Position[][][]) {
    const first = polygon[0]?.[0];
    const label = first ? labelOf(first) : 0;
    const target = label > 0 ? outlines[label - 1] : null;
    if (!target) continue;
    const [outer, ...holes] = polygon.map((ring, i) => rfc7946Ring(dropCollinear(ring).map(toLonLat), i === 0));
    if (outer) target.coordinates.push([outer, ...holes.filter((h): h is Position[] => h !== null)]);
  }
  return outlines;
}

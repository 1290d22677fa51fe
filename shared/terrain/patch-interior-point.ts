import { TerrainInputError } from './terrain-input-error';

/** The cell of a patch farthest from its edge. */
export interface PatchInteriorPoint {
  /** Column and row of the cell (row 0 = north, as the mask). */
  readonly col: number;
  readonly row: number;
  /**
   * Distance from the cell's centre to the centre of the nearest cell outside
   * the patch (or just beyond the grid's edge), in cells: 1 for a cell on the
   * patch's edge.
   */
  readonly edgeDistanceCells: number;
}

const INF = 1e20;
/** Columns transformed together in the first pass (8 doubles = one 64-byte cache line). */
const COLUMN_BLOCK = 8;

/**
 * A point surely inside a patch of cells: the cell farthest from the patch's
 * edge (the maximum of its Euclidean distance transform). Unlike the centroid,
 * which can fall outside a C- or U-shaped patch, this cell always belongs to
 * the patch. Cells beyond the grid count as outside. Ties go to the cell
 * nearest the patch's centroid, then to the first in row order.
 *
 * Exact squared Euclidean distance transform by lower envelopes of parabolas,
 * one pass over the columns and one over the rows: P. F. Felzenszwalb and
 * D. P. Huttenlocher, "Distance Transforms of Sampled Functions", Theory of
 * Computing 8 (2012) 415–428. O(width × height).
 *
 * @param mask row-major, `width × height`; non-zero = in the patch (not modified)
 * @param width columns
 * @param height rows
 * @returns the interior cell, or null when the mask is empty
 * @throws TerrainInputError `invalid-raster` when the size does not match the mask
 * @example
 * // A 3 × 3 block in a 5 × 5 grid: its middle cell, 2 cells from the nearest outside cell.
 * patchInteriorPoint(mask5x5, 5, 5); // { col: 2, row: 2, edgeDistanceCells: 2 }
 */
export function patchInteriorPoint(mask: ArrayLike<number>, width: number, height: number): PatchInteriorPoint | null {
  if (!Number.isInteger(width) || width < 1 || !Number.isInteger(height) || height < 1 || mask.length !== width * height) {
    throw new TerrainInputError(
      'invalid-raster',
      `The mask must have width × height cells, got ${mask.length} for ${width} × ${height}.`,
    );
  }
  let cells = 0;
  let sumCol = 0;
  let sumRow = 0;
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      if (mask[r * width + c] === 0) continue;
      cells++;
      sumCol += c;
      sumRow += r;
    }
  }
  if (cells === 0) return null;
  const d = squaredEdgeDistances(mask, width, height);
  const W = width + 2;

  const meanCol = sumCol / cells;
  const meanRow = sumRow / cells;
  let best = -1;
  let bestD = -1;
  let bestTie = Infinity;
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      if (mask[r * width + c] === 0) continue;
      const dist = d[(r + 1) * W + (c + 1)] as number;
      const tie = (c - meanCol) ** 2 + (r - meanRow) ** 2;
      if (dist > bestD || (dist === bestD && tie < bestTie)) {
        best = r * width + c;
        bestD = dist;
        bestTie = tie;
      }
    }
  }
  return { col: best % width, row: Math.floor(best / width), edgeDistanceCells: Math.sqrt(bestD) };
}

/**
 * Squared Euclidean distance from every cell of a mask to the centre of the
 * nearest cell outside it (0 outside the mask), on the grid with one cell of
 * padding all round (`(width + 2) × (height + 2)`, cell (c, r) at
 * `(r + 1) × (width + 2) + c + 1`): cells beyond the grid count as outside.
 * Exact (integers in doubles); the two passes of {@link patchInteriorPoint}.
 *
 * For 8-connected patches the distance within the union of all patches is
 * each patch's own (other patches counted as outside): a nearest outside
 * cell in another patch would be reached from the cell by a line of cells,
 * each strictly nearer and so all in the patch, making the two patches one.
 * So one transform of all patches serves every patch.
 *
 * @param mask row-major, `width × height`; non-zero = inside (not modified)
 */
export function squaredEdgeDistances(mask: ArrayLike<number>, width: number, height: number): Float64Array {
  // One cell of padding all round: the grid's edge is the patch's edge.
  const W = width + 2;
  const H = height + 2;
  const d = new Float64Array(W * H);
  // The padding stays 0 (a new array is zero-filled).
  for (let r = 0; r < height; r++) {
    const from = r * width;
    const to = (r + 1) * W + 1;
    for (let c = 0; c < width; c++) {
      if (mask[from + c] === 0) continue;
      d[to + c] = INF;
    }
  }
  const n = Math.max(W, H);
  const f = new Float64Array(n);
  const out = new Float64Array(n);
  const v = new Int32Array(n);
  const z = new Float64Array(n + 1);
  // Columns in blocks of COLUMN_BLOCK, gathered and scattered row by row: one
  // column at a time would stride across the whole grid for every cell.
  const fs = Array.from({ length: COLUMN_BLOCK }, () => new Float64Array(H));
  const outs = Array.from({ length: COLUMN_BLOCK }, () => new Float64Array(H));
  for (let c0 = 0; c0 < W; c0 += COLUMN_BLOCK) {
    const nb = Math.min(COLUMN_BLOCK, W - c0);
    for (let r = 0; r < H; r++) {
      const at = r * W + c0;
      for (let b = 0; b < nb; b++) (fs[b] as Float64Array)[r] = d[at + b] as number;
    }
    for (let b = 0; b < nb; b++) transform1d(fs[b] as Float64Array, H, outs[b] as Float64Array, v, z);
    for (let r = 0; r < H; r++) {
      const at = r * W + c0;
      for (let b = 0; b < nb; b++) d[at + b] = (outs[b] as Float64Array)[r] as number;
    }
  }
  for (let r = 0; r < H; r++) {
    for (let c = 0; c < W; c++) f[c] = d[r * W + c] as number;
    transform1d(f, W, out, v, z);
    for (let c = 0; c < W; c++) d[r * W + c] = out[c] as number;
  }

  return d;
}

/**
 * Squared distance transform of one row or column `f[0 … n-1]` into `out`
 * (Felzenszwalb & Huttenlocher, algorithm DT(f)). `f[0]` is finite (the
 * padding); infinite samples add no parabola, so no sum of two infinities is
 * ever compared.
 */
function transform1d(f: Float64Array, n: number, out: Float64Array, v: Int32Array, z: Float64Array): void {
  let k = 0;
  v[0] = 0;
  z[0] = -INF;
  z[1] = INF;
  for (let q = 1; q < n; q++) {
    if ((f[q] as number) >= INF) continue;
    let s: number;
    for (;;) {
      const p = v[k] as number;
      s = ((f[q] as number) + q * q - ((f[p] as number) + p * p)) / (2 * q - 2 * p);
      if (s <= (z[k] as number) && k > 0) k--;
      else break;
    }
    k++;
    v[k] = q;
    z[k] = s;
    z[k + 1] = INF;
  }
  k = 0;
  for (let q = 0; q < n; q++) {
    while ((z[k + 1] as number) < q) k++;
    const p = v[k] as number;
    out[q] = (q - p) * (q - p) + (f[p] as number);
  }
}

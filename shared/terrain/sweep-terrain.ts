import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** Height given to nodata cells inside the sweep: so low that they never block sight. */
export const NEVER_BLOCKS = Math.fround(-1e30);

/**
 * A terrain laid out for the viewshed sweep: the heights twice, row-major and
 * column-major, with nodata replaced by {@link NEVER_BLOCKS}. Build it once
 * with {@link prepareSweepTerrain} and pass it to many
 * `computeHiddenHeightRaster` calls on the same terrain (the worker pool does).
 */
export interface SweepTerrain {
  /** The terrain it was made from (not copied). */
  readonly source: TerrainRaster;
  /** Heights, metres, index `row * width + col`; nodata → NEVER_BLOCKS. */
  readonly rowMajor: Float32Array;
  /** Heights, metres, index `col * height + row`; nodata → NEVER_BLOCKS. */
  readonly columnMajor: Float32Array;
  /** Whether any cell is nodata. */
  readonly hasNodata: boolean;
}

/** Edge of the square blocks of the cache-friendly transposition, cells. */
const BLOCK = 64;

/**
 * Lays a terrain out for the viewshed sweep (see {@link SweepTerrain}). The
 * sweep walks every octant along contiguous memory — rows for the octants
 * whose main direction is north–south, the column-major copy for east–west —
 * which keeps it fast on large grids, where strided access would stall on
 * memory. The row-major array is the input's own array when it has no nodata.
 *
 * Source: blocked matrix transposition (common practice, no source).
 *
 * @param terrain ground heights, metres (not modified)
 * @param allocate makes the Float32Arrays of the copies; default `new Float32Array(n)`
 *   (the worker pool passes one over a SharedArrayBuffer)
 * @returns the prepared terrain
 * @example
 * const sweep = prepareSweepTerrain(terrain);
 * const a = computeHiddenHeightRaster(terrain, postA, {}, sweep);
 * const b = computeHiddenHeightRaster(terrain, postB, {}, sweep);
 */
export function prepareSweepTerrain(
  terrain: TerrainRaster,
  allocate: (length: number) => Float32Array = (length) => new Float32Array(length),
): SweepTerrain {
  const { width: W, height: H, heights: source } = terrain;
  const marker = terrain.nodata ?? NaN;
  const hasNodata = firstNodata(source, marker) >= 0;
  let rowMajor = source;
  if (hasNodata) {
    rowMajor = allocate(source.length);
    replaceNodata(source, rowMajor, marker);
  }
  const columnMajor = allocate(source.length);
  // Small blocks in a small function: V8 optimises it after a few calls.
  for (let r0 = 0; r0 < H; r0 += BLOCK) {
    const r1 = Math.min(H, r0 + BLOCK);
    for (let c0 = 0; c0 < W; c0 += BLOCK) {
      transposeBlock(rowMajor, columnMajor, W, H, r0, r1, c0, Math.min(W, c0 + BLOCK));
    }
  }
  return { source: terrain, rowMajor, columnMajor, hasNodata };
}

function firstNodata(values: Float32Array, marker: number): number {
  for (let i = 0; i < values.length; i++) {
    const v = values[i] as number;
    if (v !== v || v === marker) return i;
  }
  return -1;
}

function replaceNodata(source: Float32Array, target: Float32Array, marker: number): void {
  for (let i = 0; i < source.length; i++) {
    const v = source[i] as number;
    target[i] = v !== v || v === marker ? NEVER_BLOCKS : v;
  }
}

function transposeBlock(
  rowMajor: Float32Array,
  columnMajor: Float32Array,
  W: number,
  H: number,
  r0: number,
  r1: number,
  c0: number,
  c1: number,
): void {
  for (let c = c0; c < c1; c++) {
    const base = c * H;
    for (let r = r0; r < r1; r++) columnMajor[base + r] = rowMajor[r * W + c] as number;
  }
}

import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** Height given to nodata cells inside the sweep: so low that they never block sight. */
export const NEVER_BLOCKS = Math.fround(-1e30);

/**
 * A terrain laid out for the viewshed sweep: the row-major heights with
 * nodata replaced by {@link NEVER_BLOCKS}. Build it once with
 * {@link prepareSweepTerrain} and pass it to many `computeHiddenHeightRaster`
 * calls on the same terrain (the worker pool does).
 */
export interface SweepTerrain {
  /** The terrain it was made from (not copied). */
  readonly source: TerrainRaster;
  /**
   * Heights, metres, index `row * width + col`; nodata → NEVER_BLOCKS. The
   * terrain's own array when it has no nodata (then nothing is copied).
   */
  readonly heights: Float32Array;
  /** Whether any cell is nodata. */
  readonly hasNodata: boolean;
}

/**
 * Lays a terrain out for the viewshed sweep (see {@link SweepTerrain}): one
 * pass that looks for nodata (eight cells per test when nodata is NaN), and a
 * copy with nodata replaced only when there is some. The sweep reads this one row-major array in every octant (it walks
 * the east–west octants grid row by grid row), so no transposed copy is made.
 *
 * Source: sentinel value for missing data (common practice, no source).
 *
 * @param terrain ground heights, metres (not modified)
 * @param allocate makes the Float32Array of the copy when one is needed;
 *   default `new Float32Array(n)`
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
  const source = terrain.heights;
  const marker = terrain.nodata ?? NaN;
  const first = firstNodata(source, marker);
  if (first < 0) return { source: terrain, heights: source, hasNodata: false };
  const heights = allocate(source.length);
  heights.set(source.subarray(0, first));
  replaceNodata(source, heights, marker, first);
  return { source: terrain, heights, hasNodata: true };
}

function firstNodata(values: Float32Array, marker: number): number {
  if (marker !== marker) return firstNaN(values);
  for (let i = 0; i < values.length; i++) {
    const v = values[i] as number;
    if (v !== v || v === marker) return i;
  }
  return -1;
}

/**
 * Index of the first NaN, or −1. Eight values at a time: their sum is NaN if
 * any of them is (or if it mixes +∞ and −∞, which the exact look then clears),
 * so the common case is one test per eight cells.
 */
function firstNaN(values: Float32Array): number {
  const n = values.length;
  const n8 = n - (n % 8);
  let i = 0;
  for (; i < n8; i += 8) {
    const sum =
      (values[i] as number) +
      (values[i + 1] as number) +
      (values[i + 2] as number) +
      (values[i + 3] as number) +
      (values[i + 4] as number) +
      (values[i + 5] as number) +
      (values[i + 6] as number) +
      (values[i + 7] as number);
    if (sum !== sum) {
      for (let k = i; k < i + 8; k++) if ((values[k] as number) !== (values[k] as number)) return k;
    }
  }
  for (; i < n; i++) if ((values[i] as number) !== (values[i] as number)) return i;
  return -1;
}

function replaceNodata(source: Float32Array, target: Float32Array, marker: number, from: number): void {
  for (let i = from; i < source.length; i++) {
    const v = source[i] as number;
    target[i] = v !== v || v === marker ? NEVER_BLOCKS : v;
  }
}

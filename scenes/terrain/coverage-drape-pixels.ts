import { paletteLookup, type ClassPalette } from '@/components/map/class-palettes';
import type { ClassRasterGrid } from '@/components/map/class-raster-pixels';

/** RGBA pixels of a class raster for a three.js `DataTexture`, and the picture's size. */
export interface DrapePixels {
  readonly width: number;
  readonly height: number;
  /** width × height × 4 bytes, row 0 = the **south** edge (three.js puts a data texture's first row at v = 0). */
  readonly rgba: Uint8Array;
}

/**
 * Paints a coverage layer's class codes for draping over the 3D terrain: one
 * pixel per cell in the palette's colours and opacity (undrawn and unknown
 * codes transparent), rows turned so the first row is the south one, as a
 * `DataTexture` (flipY off) lays it over texture coordinates with v = 0 in
 * the south. A raster wider or taller than `maxSize` is sampled every
 * `step` cells (the code at each block's middle, never blended, so a class
 * stays a class) to keep the texture within what the GPU accepts.
 *
 * @param values one code per cell, row-major, row 0 = north (not modified)
 * @param grid the raster's width and height, cells
 * @param maxSize largest texture side, pixels (default 4096)
 * @example
 * const { width, height, rgba } = drapePixels(values, raster, POSTS_PER_CELL_PALETTE);
 * const texture = new DataTexture(rgba, width, height, RGBAFormat);
 */
export function drapePixels(
  values: Uint8Array,
  grid: Pick<ClassRasterGrid, 'width' | 'height'>,
  palette: ClassPalette,
  maxSize = 4096,
): DrapePixels {
  const { width: W, height: H } = grid;
  if (values.length !== W * H) throw new RangeError(`Expected ${W * H} codes for ${W} × ${H} cells, got ${values.length}.`);
  if (!(maxSize >= 1)) throw new RangeError(`maxSize must be at least 1, got ${maxSize}.`);
  const step = Math.max(1, Math.ceil(Math.max(W, H) / maxSize));
  const width = Math.ceil(W / step);
  const height = Math.ceil(H / step);
  const table = paletteLookup(palette);
  const rgba = new Uint8Array(width * height * 4);
  const half = Math.floor(step / 2);
  for (let r = 0; r < height; r++) {
    const sourceRow = Math.min(r * step + half, H - 1);
    const outRow = height - 1 - r; // north row last: v grows northwards
    for (let c = 0; c < width; c++) {
      const sourceCol = Math.min(c * step + half, W - 1);
      const t = (values[sourceRow * W + sourceCol] as number) * 4;
      const o = (outRow * width + c) * 4;
      rgba[o] = table[t] as number;
      rgba[o + 1] = table[t + 1] as number;
      rgba[o + 2] = table[t + 2] as number;
      rgba[o + 3] = table[t + 3] as number;
    }
  }
  return { width, height, rgba };
}

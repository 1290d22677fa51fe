import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { HillshadeRaster } from '@/shared/terrain/hillshade';

/** Default longest edge of the base-layer image, pixels. */
export const DEFAULT_HILLSHADE_MAX_EDGE = 2048;

/** A grey-and-alpha picture of a hillshade, ready to encode (e.g. as PNG). */
export interface HillshadeImage {
  /** Pixels across (west → east). */
  readonly width: number;
  /** Pixels down (north → south). */
  readonly height: number;
  /** Cells per pixel along each axis (1 = full resolution). */
  readonly factor: number;
  /** Two bytes per pixel, row 0 = north: grey 0 … 255, then alpha (255 = all cells have data, 0 = none). */
  readonly greyAlpha: Uint8Array;
}

/**
 * Turns a hillshade raster into an image no larger than `maxEdge` pixels on
 * its longer side: the smallest whole number of cells per pixel, `factor =
 * ceil(max(width, height) / maxEdge)`, and each pixel the mean shade of the
 * cells with data in its `factor × factor` block (the last column and row of
 * pixels may cover fewer cells, so the picture spans the grid exactly up to
 * less than one pixel). Alpha is the share of the block's cells that have
 * data, so nodata is transparent. Pixel (0, 0) is the north-west corner.
 *
 * Source: box-filter downsampling (common practice, no source).
 *
 * @param relief shade values 1 … 255, 0 = nodata (not modified)
 * @param maxEdge longest edge of the result, pixels; default 2048
 * @returns a new image
 * @throws TerrainInputError `invalid-option` when maxEdge is not a positive integer
 * @example
 * const image = hillshadeImage(computeHillshade(terrain)); // 4000 × 4000 cells → 2000 × 2000 px
 */
export function hillshadeImage(relief: HillshadeRaster, maxEdge: number = DEFAULT_HILLSHADE_MAX_EDGE): HillshadeImage {
  if (!Number.isInteger(maxEdge) || maxEdge < 1) {
    throw new TerrainInputError(
      'invalid-option',
      `The longest image edge must be a positive whole number of pixels, got ${maxEdge}.`,
    );
  }
  const { width: W, height: H, shade } = relief;
  const factor = Math.max(1, Math.ceil(Math.max(W, H) / maxEdge));
  const width = Math.ceil(W / factor);
  const height = Math.ceil(H / factor);
  const greyAlpha = new Uint8Array(width * height * 2);
  if (factor === 1) {
    for (let i = 0; i < W * H; i++) {
      const v = shade[i] as number;
      greyAlpha[2 * i] = v;
      greyAlpha[2 * i + 1] = v === 0 ? 0 : 255;
    }
    return { width, height, factor, greyAlpha };
  }
  const sum = new Float64Array(width);
  const count = new Uint32Array(width);
  const cells = new Uint32Array(width);
  for (let py = 0; py < height; py++) {
    sum.fill(0);
    count.fill(0);
    cells.fill(0);
    const rowEnd = Math.min(H, (py + 1) * factor);
    for (let r = py * factor; r < rowEnd; r++) {
      const base = r * W;
      for (let c = 0; c < W; c++) {
        const px = (c / factor) | 0;
        cells[px] = (cells[px] as number) + 1;
        const v = shade[base + c] as number;
        if (v === 0) continue;
        sum[px] = (sum[px] as number) + v;
        count[px] = (count[px] as number) + 1;
      }
    }
    for (let px = 0; px < width; px++) {
      const n = count[px] as number;
      const o = 2 * (py * width + px);
      greyAlpha[o] = n === 0 ? 0 : Math.round((sum[px] as number) / n);
      greyAlpha[o + 1] = Math.round((255 * n) / (cells[px] as number));
    }
  }
  return { width, height, factor, greyAlpha };
}

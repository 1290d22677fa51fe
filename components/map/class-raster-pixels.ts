import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { paletteClass, paletteLookup, type ClassPalette } from './class-palettes';
import type { GridRect } from './map-camera';

/** The grid fields of a class raster (as in `EncodedClassRaster`): size, cell side and lower-left corner in metres. */
export type ClassRasterGrid = Pick<EncodedClassRaster, 'width' | 'height' | 'cellSize' | 'xll' | 'yll'>;

/** The rectangle a class raster covers, grid metres: its picture's edges. */
export function classRasterBounds(grid: ClassRasterGrid): GridRect {
  return {
    west: grid.xll,
    south: grid.yll,
    east: grid.xll + grid.width * grid.cellSize,
    north: grid.yll + grid.height * grid.cellSize,
  };
}

/**
 * Paints decoded class codes as RGBA pixels, one pixel per cell, in the
 * raster's own order: pixel (col, row) is cell (col, row), so row 0 — the
 * north row — is the picture's top line and column 0 its west edge. Drawn
 * over {@link classRasterBounds} north up, every pixel lands on its cell.
 *
 * @param values one code per cell, row-major, row 0 = north (not modified)
 * @returns `width × height × 4` bytes for an `ImageData`
 */
export function paintClassRaster(
  values: Uint8Array,
  grid: Pick<ClassRasterGrid, 'width' | 'height'>,
  palette: ClassPalette,
): Uint8ClampedArray {
  if (values.length !== grid.width * grid.height) {
    throw new RangeError(
      `Expected ${grid.width * grid.height} codes for ${grid.width} × ${grid.height} cells, got ${values.length}.`,
    );
  }
  const table = paletteLookup(palette);
  const rgba = new Uint8ClampedArray(values.length * 4);
  for (let i = 0; i < values.length; i++) {
    const t = (values[i] as number) * 4;
    const o = i * 4;
    rgba[o] = table[t] as number;
    rgba[o + 1] = table[t + 1] as number;
    rgba[o + 2] = table[t + 2] as number;
    rgba[o + 3] = table[t + 3] as number;
  }
  return rgba;
}

/** The cell (col, row) holding a grid point, or null outside the raster. */
export function cellAt(grid: ClassRasterGrid, x: number, y: number): { col: number; row: number } | null {
  const col = Math.floor((x - grid.xll) / grid.cellSize);
  const row = Math.floor((grid.yll + grid.height * grid.cellSize - y) / grid.cellSize);
  if (col < 0 || row < 0 || col >= grid.width || row >= grid.height || !Number.isFinite(col) || !Number.isFinite(row))
    return null;
  return { col, row };
}

/** The class code at a grid point, or null outside the raster. */
export function classAt(grid: ClassRasterGrid, values: Uint8Array, x: number, y: number): number | null {
  const cell = cellAt(grid, x, y);
  return cell ? (values[cell.row * grid.width + cell.col] as number) : null;
}

/** A horizontal run of one drawn class along a row. */
export interface ClassRun {
  readonly row: number;
  readonly col: number;
  readonly length: number;
  readonly code: number;
}

/**
 * The drawn cells as horizontal runs of one code per row (for drawing without
 * a canvas, e.g. as SVG rectangles). Codes the palette leaves undrawn are
 * skipped.
 */
export function classRuns(
  values: Uint8Array,
  grid: Pick<ClassRasterGrid, 'width' | 'height'>,
  palette: ClassPalette,
): ClassRun[] {
  const drawn = new Set(palette.classes.filter((c) => c.color !== null).map((c) => c.code));
  const runs: ClassRun[] = [];
  for (let row = 0; row < grid.height; row++) {
    const base = row * grid.width;
    let col = 0;
    while (col < grid.width) {
      const code = values[base + col] as number;
      let end = col + 1;
      while (end < grid.width && values[base + end] === code) end++;
      if (drawn.has(code)) runs.push({ row, col, length: end - col, code });
      col = end;
    }
  }
  return runs;
}

/** What the read-out says about a layer at a grid point: "Posts that see the target: 2 posts" (or "outside the layer"). */
export function classLabelAt(grid: ClassRasterGrid, values: Uint8Array, palette: ClassPalette, x: number, y: number): string {
  const code = classAt(grid, values, x, y);
  if (code === null) return `${palette.title}: outside the layer`;
  return `${palette.title}: ${paletteClass(palette, code)?.label ?? `code ${code}`}`;
}

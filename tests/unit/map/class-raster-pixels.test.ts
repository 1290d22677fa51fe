import { POSTS_PER_CELL_PALETTE } from '@/components/map/class-palettes';
import {
  cellAt,
  classAt,
  classLabelAt,
  classRasterBounds,
  classRuns,
  paintClassRaster,
} from '@/components/map/class-raster-pixels';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';

// An invented 4 × 3 raster of 25 m cells; row 0 = north (the RasterGrid convention of the core).
const grid = { width: 4, height: 3, cellSize: 25, xll: 600_000, yll: 5_760_000, crs: { epsg: 32633, wkt: null } };
const { unseen: U, onePost: A, twoPosts: B, threeOrMorePosts: C, noData: N } = COVERAGE_LAYER;
const values = Uint8Array.from([C, U, U, U, A, A, B, N, N, U, U, U]);

describe('overlay pixel placement', () => {
  test('the picture spans the raster’s grid rectangle', () => {
    expect(classRasterBounds(grid)).toEqual({ west: 600_000, south: 5_760_000, east: 600_100, north: 5_760_075 });
  });

  test('decoded from kenning-rle8/1, the north-west cell is the first pixel (top-left), the south-east the last', () => {
    const encoded = encodeClassRaster(grid, values);
    const decoded = decodeClassRaster(encoded);
    const rgba = paintClassRaster(decoded, encoded, POSTS_PER_CELL_PALETTE);
    expect(rgba.length).toBe(4 * 3 * 4);
    const px = (col: number, row: number) => [...rgba.slice((row * 4 + col) * 4, (row * 4 + col) * 4 + 4)];
    const alpha = Math.round(0.72 * 255);
    expect(px(0, 0)).toEqual([0x1b, 0x3a, 0x6b, alpha]); // 3+ posts, north-west
    expect(px(2, 1)).toEqual([0x4f, 0x86, 0xc0, alpha]); // 2 posts
    expect(px(3, 1)[3]).toBe(0); // no data: transparent
    expect(px(3, 2)).toEqual([0xe6, 0x9f, 0x2e, alpha]); // unseen, south-east
  });

  test('a grid point finds its cell: the top row is the northern one', () => {
    // The north-west cell's centre: x = xll + 12.5, y = yll + 3·25 − 12.5.
    expect(cellAt(grid, 600_012.5, 5_760_062.5)).toEqual({ col: 0, row: 0 });
    expect(classAt(grid, values, 600_012.5, 5_760_062.5)).toBe(C);
    expect(classAt(grid, values, 600_060, 5_760_030)).toBe(B); // col 2, row 1
    expect(classAt(grid, values, 600_099, 5_760_001)).toBe(U); // south-east cell
    // Edges: west and north edges belong to the raster, east and south just beyond do not.
    expect(cellAt(grid, 600_000, 5_760_074.999)).toEqual({ col: 0, row: 0 });
    expect(cellAt(grid, 600_100, 5_760_030)).toBeNull();
    expect(cellAt(grid, 600_050, 5_759_999.9)).toBeNull();
    expect(classAt(grid, values, 599_999, 5_760_030)).toBeNull();
    expect(classLabelAt(grid, values, POSTS_PER_CELL_PALETTE, 600_060, 5_760_030)).toBe('Posts that see the target: 2 posts');
    expect(classLabelAt(grid, values, POSTS_PER_CELL_PALETTE, 0, 0)).toBe('Posts that see the target: outside the layer');
  });

  test('runs per row skip undrawn codes and never cross a row end', () => {
    expect(classRuns(values, grid, POSTS_PER_CELL_PALETTE)).toEqual([
      { row: 0, col: 0, length: 1, code: C },
      { row: 0, col: 1, length: 3, code: U },
      { row: 1, col: 0, length: 2, code: A },
      { row: 1, col: 2, length: 1, code: B },
      { row: 2, col: 1, length: 3, code: U },
    ]);
  });

  test('refuses codes that do not fit the grid', () => {
    expect(() => paintClassRaster(new Uint8Array(5), grid, POSTS_PER_CELL_PALETTE)).toThrow(RangeError);
  });
});

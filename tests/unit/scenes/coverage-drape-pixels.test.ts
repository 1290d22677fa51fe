import { CROSS_BEARING_PALETTE, POSTS_PER_CELL_PALETTE } from '@/components/map/class-palettes';
import { drapePixels } from '@/scenes/terrain/coverage-drape-pixels';
import { CROSS_BEARING_CLASS } from '@/shared/terrain/cross-bearing-quality';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';

// An invented 3 × 2 layer, row 0 = north: [3+, unseen, no data] over [1, 2, unseen].
const { unseen: U, onePost: A, twoPosts: B, threeOrMorePosts: C, noData: N } = COVERAGE_LAYER;
const values = Uint8Array.from([C, U, N, A, B, U]);
const grid = { width: 3, height: 2 };
const alpha = Math.round(POSTS_PER_CELL_PALETTE.opacity * 255);

/** The RGBA of texture pixel (col, row), row 0 = the texture's first row. */
const px = (rgba: Uint8Array, width: number, col: number, row: number) => [
  ...rgba.slice((row * width + col) * 4, (row * width + col) * 4 + 4),
];

describe('drapePixels', () => {
  test('the south row comes first (three.js data textures start at v = 0), colours from the palette', () => {
    const { width, height, rgba } = drapePixels(values, grid, POSTS_PER_CELL_PALETTE);
    expect([width, height]).toEqual([3, 2]);
    // Colours: class-palettes.ts (Kenning's own scheme).
    expect(px(rgba, 3, 0, 0)).toEqual([0xa9, 0xcb, 0xea, alpha]); // south-west: 1 post
    expect(px(rgba, 3, 1, 0)).toEqual([0x4f, 0x86, 0xc0, alpha]); // 2 posts
    expect(px(rgba, 3, 2, 0)).toEqual([0xe6, 0x9f, 0x2e, alpha]); // unseen (amber)
    expect(px(rgba, 3, 0, 1)).toEqual([0x1b, 0x3a, 0x6b, alpha]); // north-west: 3+ posts
    expect(px(rgba, 3, 2, 1)).toEqual([0, 0, 0, 0]); // no data: not drawn
  });

  test('another palette paints the same codes differently; unknown codes are transparent', () => {
    const codes = Uint8Array.from([CROSS_BEARING_CLASS.good, 200]);
    const { rgba } = drapePixels(codes, { width: 2, height: 1 }, CROSS_BEARING_PALETTE);
    expect(px(rgba, 2, 0, 0).slice(0, 3)).toEqual([0x3e, 0x21, 0x70]);
    expect(px(rgba, 2, 1, 0)[3]).toBe(0);
  });

  test('a raster over maxSize is sampled at block middles, never blended', () => {
    // 4 × 4, each 2 × 2 block one code; maxSize 2 → 2 × 2 pixels, one per block.
    const big = Uint8Array.from([C, C, U, U, C, C, U, U, A, A, B, B, A, A, B, B]);
    const { width, height, rgba } = drapePixels(big, { width: 4, height: 4 }, POSTS_PER_CELL_PALETTE, 2);
    expect([width, height]).toEqual([2, 2]);
    expect(px(rgba, 2, 0, 0).slice(0, 3)).toEqual([0xa9, 0xcb, 0xea]); // south-west block: 1 post
    expect(px(rgba, 2, 1, 0).slice(0, 3)).toEqual([0x4f, 0x86, 0xc0]); // south-east: 2 posts
    expect(px(rgba, 2, 0, 1).slice(0, 3)).toEqual([0x1b, 0x3a, 0x6b]); // north-west: 3+
    expect(px(rgba, 2, 1, 1).slice(0, 3)).toEqual([0xe6, 0x9f, 0x2e]); // north-east: unseen
  });

  test('does not modify its input and refuses a wrong count of codes', () => {
    const copy = Uint8Array.from(values);
    drapePixels(values, grid, POSTS_PER_CELL_PALETTE);
    expect(values).toEqual(copy);
    expect(() => drapePixels(values, { width: 4, height: 2 }, POSTS_PER_CELL_PALETTE)).toThrow(/Expected 8 codes/);
    expect(() => drapePixels(values, grid, POSTS_PER_CELL_PALETTE, 0)).toThrow(/maxSize/);
  });
});

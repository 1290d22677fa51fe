import { blindAreaOutline } from '@/components/map/blind-area-outline';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';

const { unseen: U, onePost: S } = COVERAGE_LAYER;
/** 4 × 3 grid of 10 m cells, south-west corner (0, 0): an L-shaped blind area and a lone blind cell. */
const values = Uint8Array.from([U, S, S, U, U, S, S, S, U, U, S, S]);
const grid = { width: 4, height: 3, cellSize: 10, xll: 0, yll: 0 };

/** The edges as sorted strings, for comparison. */
const edges = (s: Float64Array) => {
  const out: string[] = [];
  for (let i = 0; i < s.length; i += 4) out.push(`${s[i]},${s[i + 1]}-${s[i + 2]},${s[i + 3]}`);
  return out.sort();
};

describe('blindAreaOutline', () => {
  it('outlines the 8-connected blind area holding the point, along its cell edges', () => {
    const o = blindAreaOutline(values, grid, null, { x: 5, y: 25 })!; // top-left cell
    expect(o.cells).toBe(4);
    // Perimeter of the L (4 cells): 10 unit edges (common practice, no source: count of exposed cell sides).
    expect(o.segments.length / 4).toBe(10);
    expect(edges(o.segments)).toContain('0,30-10,30'); // north edge of the top-left cell
    expect(edges(o.segments)).toContain('20,0-20,10'); // east edge of (1, 2)
  });

  it('answers null on seen ground and outside the grid', () => {
    expect(blindAreaOutline(values, grid, null, { x: 15, y: 25 })).toBeNull();
    expect(blindAreaOutline(values, grid, null, { x: -5, y: 5 })).toBeNull();
  });

  it('keeps to the site: blind cells outside the boundary are not part of the area', () => {
    // The site is the west half (x < 20): the top-right blind cell is outside it.
    const site = [
      { x: 0, y: 0 },
      { x: 20, y: 0 },
      { x: 20, y: 30 },
      { x: 0, y: 30 },
    ];
    expect(blindAreaOutline(values, grid, site, { x: 35, y: 25 })).toBeNull();
    expect(blindAreaOutline(values, grid, site, { x: 5, y: 5 })!.cells).toBe(4);
  });
});

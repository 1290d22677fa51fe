import { pickTerrainCandidates } from '@/shared/terrain/pick-terrain-candidates';
import { createTerrainRaster } from '@/shared/terrain/terrain-raster';

const W = 40;
const H = 30;
const CELL = 25;

/** Two cone hills (summits at (10, 10), 300 m, and (30, 20), 200 m) and an east–west ridge along row 5 on a 100 m plain. */
function hills() {
  const heights = new Float32Array(W * H);
  for (let row = 0; row < H; row++) {
    for (let col = 0; col < W; col++) {
      const a = 300 - 20 * Math.hypot(col - 10, row - 10);
      const b = 200 - 15 * Math.hypot(col - 30, row - 20);
      const ridge = col >= 20 ? 180 - 40 * Math.abs(row - 5) - Math.abs(col - 30) : 0;
      heights[row * W + col] = Math.max(100, a, b, ridge);
    }
  }
  return createTerrainRaster({ heights, width: W, height: H, cellSize: CELL, xll: 0, yll: 0, crs: null });
}

describe('pickTerrainCandidates', () => {
  it('finds the summits first, highest first', () => {
    // Source: a summit is a cell higher than its eight neighbours (Peucker & Douglas 1975, from memory).
    const picked = pickTerrainCandidates(hills(), { spacingM: 100, maxCandidates: 2, allowed: null });
    expect(picked.map((p) => [p.col, p.row, p.summit])).toEqual([
      [10, 10, true],
      [30, 20, true],
    ]);
    // The flanks of a rounded hill are not ridges; the crest of the ridge is.
    const all = pickTerrainCandidates(hills(), { spacingM: 1, maxCandidates: 1000, allowed: null });
    expect(all.some((p) => p.col === 10 && p.row === 6)).toBe(false);
    expect(all.some((p) => p.col === 25 && p.row === 5 && !p.summit)).toBe(true);
    expect(picked[0]!.elevationM).toBeCloseTo(300, 5);
  });

  it('keeps every pair at least the spacing apart, and stays inside the allowed cells', () => {
    // common practice, no source: thinning by a least distance.
    const terrain = hills();
    const allowed = new Uint8Array(W * H);
    for (let row = 0; row < H; row++) for (let col = 20; col < W; col++) allowed[row * W + col] = 1;
    const picked = pickTerrainCandidates(terrain, { spacingM: 200, maxCandidates: 50, allowed });
    expect(picked.length).toBeGreaterThan(1);
    for (const p of picked) expect(p.col).toBeGreaterThanOrEqual(20);
    expect(picked[0]).toMatchObject({ col: 30, row: 20, summit: true });
    for (let i = 0; i < picked.length; i++)
      for (let j = i + 1; j < picked.length; j++)
        expect(Math.hypot(picked[i]!.col - picked[j]!.col, picked[i]!.row - picked[j]!.row) * CELL).toBeGreaterThanOrEqual(200);
    // Never on the grid's edge; no flat plain cell (no crest there).
    for (const p of picked) {
      expect(p.col > 0 && p.col < W - 1 && p.row > 0 && p.row < H - 1).toBe(true);
      expect(p.elevationM).toBeGreaterThan(100);
    }
  });

  it('refuses a spacing of zero', () => {
    expect(() => pickTerrainCandidates(hills(), { spacingM: 0, maxCandidates: 1, allowed: null })).toThrow(/spacing/);
  });
});

import { gridLines } from '@/components/map/grid-lines';

// Plain arithmetic of Kenning's own background grid (common practice, no source).
describe('gridLines', () => {
  it('picks the finest round spacing at least 60 px apart and covers the view and its margin', () => {
    // 0.1 px per metre: 500 m would be 50 px apart, 1 km 100 px.
    const g = gridLines({ centerX: 500_000, centerY: 6_000_000, pxPerM: 0.1 }, { width: 400, height: 200 }, 100);
    expect(g.spacingM).toBe(1000);
    // The view with its margin is 600 × 400 px = 6 km × 4 km around the centre.
    expect(g.eastings).toEqual([497_000, 498_000, 499_000, 500_000, 501_000, 502_000, 503_000]);
    expect(g.northings).toEqual([5_998_000, 5_999_000, 6_000_000, 6_001_000, 6_002_000]);
  });

  it('goes finer when zoomed in', () => {
    expect(gridLines({ centerX: 0, centerY: 0, pxPerM: 1 }, { width: 100, height: 100 }, 0).spacingM).toBe(100);
  });
});

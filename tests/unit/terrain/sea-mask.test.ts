import { seaMaskOf } from '@/server/domain/coverage/compute-coverage';
import { createTerrainRaster } from '@/shared/terrain/terrain-raster';

// A 4 × 3 coast: heights rise from the sea in the west (−1 m) to a cliff in the east (30 m); one cell without data.
const heights = Float32Array.from([-1, 0.5, 3, 30, -1, 1.9, 2.1, 30, -1, 0, NaN, 30]);
const terrain = createTerrainRaster({ heights, width: 4, height: 3, cellSize: 100, xll: 500_000, yll: 6_000_000 });
const site = (seaLevelMaxM: number | null, seaArea: [number, number][] | null) => ({
  site: { boundary: null, zones: [], seaLevelMaxM, seaArea },
});
// The grid's own coordinates stand in for [lon, lat] here: the ring is passed through unchanged.
const asIs = (ring: [number, number][]) => ring;

describe('seaMaskOf', () => {
  test('heights at or below the stated sea level are sea; land and cells without data are not', () => {
    // common practice, no source: a land/sea mask from an elevation threshold.
    const mask = seaMaskOf(site(2, null), terrain, asIs)!;
    expect(Array.from(mask)).toEqual([1, 1, 0, 0, 1, 1, 0, 0, 1, 1, 0, 0]);
  });
  test('a drawn sea area and a sea level together keep only the cells in both', () => {
    // The western half of the grid (x < 500 200 m): cell centres at 500 050 and 500 150 are inside.
    const west: [number, number][] = [
      [500_000, 6_000_000],
      [500_200, 6_000_000],
      [500_200, 6_000_300],
      [500_000, 6_000_300],
      [500_000, 6_000_000],
    ];
    expect(Array.from(seaMaskOf(site(null, west), terrain, asIs)!)).toEqual([1, 1, 0, 0, 1, 1, 0, 0, 1, 1, 0, 0]);
    expect(Array.from(seaMaskOf(site(0, west), terrain, asIs)!)).toEqual([1, 0, 0, 0, 1, 0, 0, 0, 1, 1, 0, 0]);
  });
  test('no sea level and no sea area: no mask (the whole site counts)', () => {
    expect(seaMaskOf(site(null, null), terrain, asIs)).toBeNull();
  });
});

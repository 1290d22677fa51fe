import { bilinearSample } from '@/shared/terrain/bilinear-sample';
import { gridBoundsM, gridSpecFromM, gridSpecToM, type GridSpec } from '@/shared/terrain/grid-spec';

// An invented 4 × 3 grid of 25 m cells in UTM zone 33N.
const core: GridSpec = { width: 4, height: 3, cellSize: 25, xll: 600_000, yll: 5_760_000, crs: { epsg: 32633, wkt: null } };

describe('GridSpec ↔ its API form', () => {
  it('names the same numbers with their unit and back', () => {
    // common practice, no source: the API names metres in the field name (cellSizeM, xllM, yllM).
    const api = gridSpecToM(core);
    expect(api).toEqual({ width: 4, height: 3, cellSizeM: 25, xllM: 600_000, yllM: 5_760_000 });
    expect(gridSpecFromM(api, core.crs)).toEqual(core);
  });

  it('gives the outer cell edges of the grid', () => {
    // ESRI ASCII grid layout: xllcorner/yllcorner is the lower-left corner of the lower-left cell (from memory).
    expect(gridBoundsM(gridSpecToM(core))).toEqual({ west: 600_000, south: 5_760_000, east: 600_100, north: 5_760_075 });
  });
});

describe('bilinearSample', () => {
  // 2 × 2 heights, row 0 = north: NW 100, NE 110, SW 120, SE 130.
  const heights = new Float32Array([100, 110, 120, 130]);

  it('is the node value at a cell centre and the weighted mean between them', () => {
    // Bilinear interpolation on a regular grid: common practice, no source.
    expect(bilinearSample(heights, 2, 2, null, 0, 0)).toBe(100);
    expect(bilinearSample(heights, 2, 2, null, 1, 1)).toBe(130);
    expect(bilinearSample(heights, 2, 2, null, 0.25, 0)).toBeCloseTo(102.5, 12);
    expect(bilinearSample(heights, 2, 2, null, 0.5, 0.5)).toBeCloseTo(115, 12);
  });

  it('is flat beyond the outermost centres', () => {
    // common practice, no source: positions are clamped to the grid.
    expect(bilinearSample(heights, 2, 2, null, -3, -3)).toBe(100);
    expect(bilinearSample(heights, 2, 2, null, 5, 0)).toBe(110);
  });

  it('is NaN when a node it uses has no data, and ignores a node of weight zero', () => {
    const holes = new Float32Array([100, 110, 120, -9999]);
    expect(bilinearSample(holes, 2, 2, -9999, 0.5, 0.5)).toBeNaN();
    expect(bilinearSample(holes, 2, 2, -9999, 0, 0)).toBe(100);
    expect(bilinearSample(new Float32Array([100, NaN, 120, 130]), 2, 2, null, 0.5, 0)).toBeNaN();
  });

  it('does not change its input', () => {
    const copy = Float32Array.from(heights);
    bilinearSample(heights, 2, 2, null, 0.3, 0.7);
    expect(heights).toEqual(copy);
  });
});

import {
  defaultExaggeration,
  meshElevationAt,
  sceneFrame,
  terrainSurface,
  toScene,
  type MeshGrid,
} from '@/scenes/terrain/terrain-geometry';

// An invented 3 × 2 mesh of 100 m cells; row 0 = north. Plane h = 500 + x_off/10 + 2·y_off/10 is
// recovered exactly by bilinear interpolation (common practice, no source).
const plane = (x: number, y: number) => 500 + (x - 10_000) / 10 + (2 * (y - 20_000)) / 10;
const cellCentre = (c: number, r: number) => ({ x: 10_000 + (c + 0.5) * 100, y: 20_000 + 200 - (r + 0.5) * 100 });
const mesh: MeshGrid = {
  width: 3,
  height: 2,
  cellSizeM: 100,
  xllM: 10_000,
  yllM: 20_000,
  minElevationM: 0,
  maxElevationM: 0,
  heights: Float32Array.from([0, 1, 2, 3, 4, 5], (_, i) => {
    const { x, y } = cellCentre(i % 3, Math.floor(i / 3));
    return plane(x, y);
  }),
};
const withRange: MeshGrid = { ...mesh, minElevationM: Math.min(...mesh.heights), maxElevationM: Math.max(...mesh.heights) };

describe('terrain scene geometry', () => {
  test('the frame is centred on the grid; north is −z, east +x, up +y (km, exaggerated)', () => {
    const frame = sceneFrame(withRange, 3);
    expect([frame.originX, frame.originY, frame.halfWidth, frame.halfDepth]).toEqual([10_150, 20_100, 0.15, 0.1]);
    const [x, y, z] = toScene(frame, 10_250, 20_200, frame.baseElevationM + 100);
    expect(x).toBeCloseTo(0.1, 12);
    expect(y).toBeCloseTo(0.3, 12); // 100 m × 3 = 0.3 km
    expect(z).toBeCloseTo(-0.1, 12); // 100 m north → away from the viewer
  });

  test('one vertex per cell at its centre; the north-west cell first; uv over the texture rectangle', () => {
    const frame = sceneFrame(withRange, 1);
    const bounds = { west: 10_000, south: 20_000, east: 10_300, north: 20_200 };
    const s = terrainSurface(withRange, frame, bounds);
    expect(s.positions.length).toBe(6 * 3);
    expect(s.positions[0]).toBeCloseTo((10_050 - 10_150) / 1000, 6);
    expect(s.positions[2]).toBeCloseTo(-(20_150 - 20_100) / 1000, 6);
    expect(s.positions[1]).toBeCloseTo((withRange.heights[0]! - withRange.minElevationM) / 1000, 6);
    expect(s.uvs[0]).toBeCloseTo(50 / 300, 6);
    expect(s.uvs[1]).toBeCloseTo(150 / 200, 6);
    expect(s.uvs[10]).toBeCloseTo(250 / 300, 6); // south-east vertex
    expect(s.uvs[11]).toBeCloseTo(50 / 200, 6);
    expect([...s.indices]).toEqual([0, 3, 1, 1, 3, 4, 1, 4, 2, 2, 4, 5]);
  });

  test('triangles face up (counter-clockwise seen from above)', () => {
    const frame = sceneFrame(withRange, 1);
    const s = terrainSurface(withRange, frame, { west: 10_000, south: 20_000, east: 10_300, north: 20_200 });
    for (let t = 0; t < s.indices.length; t += 3) {
      const p = [0, 1, 2].map((k) => Array.from(s.positions.slice(s.indices[t + k]! * 3, s.indices[t + k]! * 3 + 3)));
      const u = [p[1]![0]! - p[0]![0]!, p[1]![1]! - p[0]![1]!, p[1]![2]! - p[0]![2]!];
      const v = [p[2]![0]! - p[0]![0]!, p[2]![1]! - p[0]![1]!, p[2]![2]! - p[0]![2]!];
      const normalY = u[2]! * v[0]! - u[0]! * v[2]!;
      expect(normalY).toBeGreaterThan(0);
    }
  });

  test('cells next to nodata are left out of the surface', () => {
    const holes = { ...withRange, heights: Float32Array.from(withRange.heights, (h, i) => (i === 2 ? NaN : h)) };
    const s = terrainSurface(holes, sceneFrame(holes, 1), { west: 10_000, south: 20_000, east: 10_300, north: 20_200 });
    expect([...s.indices]).toEqual([0, 3, 1, 1, 3, 4]);
    expect(Number.isNaN(s.positions[2 * 3 + 1]!)).toBe(false);
  });

  test('meshElevationAt is bilinear between cell centres and exact on a plane', () => {
    for (const [x, y] of [
      [10_050, 20_150],
      [10_123, 20_077],
      [10_200, 20_100],
    ] as const) {
      expect(meshElevationAt(mesh, x, y)).toBeCloseTo(plane(x, y), 3);
    }
    const holes = { ...mesh, heights: Float32Array.from(mesh.heights, (h, i) => (i === 0 ? NaN : h)) };
    expect(meshElevationAt(holes, 10_060, 20_140)).toBeNull();
  });

  test('default exaggeration: relief about a tenth of the width, within ×1 … ×5', () => {
    expect(
      defaultExaggeration({ ...mesh, width: 200, height: 200, cellSizeM: 75, minElevationM: 400, maxElevationM: 1000 }),
    ).toBe(3);
    expect(defaultExaggeration({ ...mesh, width: 200, height: 200, cellSizeM: 75, minElevationM: 0, maxElevationM: 3000 })).toBe(
      1,
    );
    expect(defaultExaggeration({ ...mesh, width: 200, height: 200, cellSizeM: 75, minElevationM: 0, maxElevationM: 10 })).toBe(5);
  });
});

// geotiff's CommonJS build requires quick-lru, which ships only as an ES module that
// Jest's CommonJS runtime cannot load; it is used for remote sources only, so a Map stands in.
jest.mock('quick-lru', () => ({ __esModule: true, default: class QuickLRU extends Map {} }));

import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { rasterizePolygon, type PolygonRing } from '@/shared/terrain/rasterize-polygon';
import type { GridSpec as RasterGrid } from '@/shared/terrain/grid-spec';
import { describeWithGdal, gdal, temporaryFolder } from '@/tests/unit/terrain/gdal-tools';
import { seededRandom } from '@/tests/unit/terrain/coverage-fixtures';

/**
 * Reference: the crossing-number point-in-polygon test, one cell centre at a
 * time, with the half-open edge rule.
 * Source: W. Randolph Franklin, PNPOLY — Point Inclusion in Polygon Test (from memory):
 * an edge counts when (yi > y) != (yj > y) and x < the edge's x at y.
 */
function bruteForce(grid: RasterGrid, rings: readonly PolygonRing[]): Uint8Array {
  const { width: W, height: H, cellSize, xll, yll } = grid;
  const mask = new Uint8Array(W * H);
  for (let row = 0; row < H; row++) {
    const y = yll + (H - row - 0.5) * cellSize;
    for (let col = 0; col < W; col++) {
      const x = xll + (col + 0.5) * cellSize;
      let inside = false;
      for (const ring of rings) {
        for (let i = 0; i < ring.length; i++) {
          const [xa, ya] = ring[i]!;
          const [xb, yb] = ring[(i + 1) % ring.length]!;
          if (ya > y !== yb > y && x < ((xb - xa) * (y - ya)) / (yb - ya) + xa) inside = !inside;
        }
      }
      mask[row * W + col] = inside ? 1 : 0;
    }
  }
  return mask;
}

/** A star-shaped (usually concave) ring of `n` corners around (cx, cy). */
function randomStar(random: () => number, cx: number, cy: number, radius: number, n: number): [number, number][] {
  const ring: [number, number][] = [];
  for (let i = 0; i < n; i++) {
    const angle = (2 * Math.PI * (i + 0.2 + 0.6 * random())) / n;
    const r = radius * (0.3 + 0.7 * random());
    ring.push([cx + r * Math.cos(angle), cy + r * Math.sin(angle)]);
  }
  return ring;
}

const differing = (a: Uint8Array, b: Uint8Array) => a.reduce((n, v, i) => n + (v === b[i] ? 0 : 1), 0);

describe('rasterizePolygon', () => {
  const grid: RasterGrid = { width: 90, height: 70, cellSize: 25, xll: 512_000, yll: 5_731_000, crs: null };

  test('the JSDoc example: a square over the south-west four cells', () => {
    const small = { width: 4, height: 4, cellSize: 10, xll: 0, yll: 0, crs: null };
    const ring: PolygonRing = [
      [0, 0],
      [20, 0],
      [20, 20],
      [0, 20],
    ];
    expect(Array.from(rasterizePolygon(small, [ring]))).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 0, 0, 1, 1, 0, 0]);
  });

  test('matches the brute-force crossing test on random concave, self-crossing and holed polygons', () => {
    const random = seededRandom(17);
    for (let t = 0; t < 40; t++) {
      const cx = grid.xll + 200 + random() * 1900;
      const cy = grid.yll + 200 + random() * 1400;
      const rings: PolygonRing[] = [randomStar(random, cx, cy, 300 + random() * 900, 3 + Math.floor(random() * 30))];
      if (t % 3 === 0) rings.push(randomStar(random, cx, cy, 150, 5)); // a hole
      if (t % 5 === 0) {
        // A self-crossing ring (even-odd decides).
        rings.push(
          Array.from({ length: 7 }, () => [cx + (random() - 0.5) * 1500, cy + (random() - 0.5) * 1500] as [number, number]),
        );
      }
      expect(differing(rasterizePolygon(grid, rings), bruteForce(grid, rings))).toBe(0);
    }
  });

  test('edge rule on cell-centre-aligned boundaries: west and south edges in, east and north out', () => {
    // common practice, no source: the half-open rule of the crossing test (see bruteForce).
    const g = { width: 10, height: 10, cellSize: 1, xll: 0, yll: 0, crs: null };
    // Centres at x, y = 0.5 … 9.5; this square's edges run through centres 2.5 and 6.5.
    const ring: PolygonRing = [
      [2.5, 2.5],
      [6.5, 2.5],
      [6.5, 6.5],
      [2.5, 6.5],
    ];
    const mask = rasterizePolygon(g, [ring]);
    expect(mask).toEqual(bruteForce(g, [ring]));
    const at = (x: number, y: number) => mask[(10 - 0.5 - y) * 10 + (x - 0.5)];
    expect(at(2.5, 4.5)).toBe(1); // west edge
    expect(at(4.5, 2.5)).toBe(1); // south edge
    expect(at(6.5, 4.5)).toBe(0); // east edge
    expect(at(4.5, 6.5)).toBe(0); // north edge
    expect(mask.reduce((a, b) => a + b, 0)).toBe(16); // 4 × 4 centres: x and y in {2.5, 3.5, 4.5, 5.5}
    // Two squares sharing the edge x = 6.5 claim its centres exactly once between them.
    const right: PolygonRing = [
      [6.5, 2.5],
      [8.5, 2.5],
      [8.5, 6.5],
      [6.5, 6.5],
    ];
    const other = rasterizePolygon(g, [right]);
    for (let i = 0; i < mask.length; i++) expect((mask[i] as number) + (other[i] as number)).toBeLessThanOrEqual(1);
    expect(other[(10 - 0.5 - 4.5) * 10 + (6.5 - 0.5)]).toBe(1);
  });

  test('an area: a polygon’s cell count approaches its area (shoelace) on a fine grid', () => {
    // Source: shoelace formula for the area of a simple polygon (closed form).
    const g = { width: 400, height: 400, cellSize: 5, xll: 0, yll: 0, crs: null };
    const ring = randomStar(seededRandom(3), 1000, 1000, 900, 12);
    let twice = 0;
    for (let i = 0; i < ring.length; i++) {
      const [xa, ya] = ring[i]!;
      const [xb, yb] = ring[(i + 1) % ring.length]!;
      twice += xa * yb - xb * ya;
    }
    const cells = rasterizePolygon(g, [ring]).reduce((a, b) => a + b, 0);
    // Error bounded by about half a cell along the perimeter (< 2 % here).
    expect(Math.abs((cells * 25) / Math.abs(twice / 2) - 1)).toBeLessThan(0.02);
  });

  test('parts outside the grid are ignored; closed and open rings give the same mask', () => {
    const ring: [number, number][] = [
      [grid.xll - 500, grid.yll - 500],
      [grid.xll + 1000.3, grid.yll + 300.7],
      [grid.xll + 700.1, grid.yll + 5000],
    ];
    const open = rasterizePolygon(grid, [ring]);
    expect(rasterizePolygon(grid, [[...ring, ring[0]!]])).toEqual(open);
    expect(open).toEqual(bruteForce(grid, [ring]));
    expect(open.some((v) => v === 1)).toBe(true);
  });

  test('does not mutate its input', () => {
    const rings: [number, number][][] = [randomStar(seededRandom(5), grid.xll + 1000, grid.yll + 800, 500, 9)];
    const copy = JSON.parse(JSON.stringify(rings));
    rasterizePolygon(grid, rings);
    expect(rings).toEqual(copy);
  });

  test('rejects bad rings and grids with the offending field', () => {
    expect(() => rasterizePolygon(grid, [])).toThrow(expect.objectContaining({ code: 'invalid-polygon', field: 'rings' }));
    expect(() =>
      rasterizePolygon(grid, [
        [
          [0, 0],
          [1, 1],
          [0, 0],
        ],
      ]),
    ).toThrow(expect.objectContaining({ code: 'invalid-polygon', field: 'rings.0' }));
    expect(() =>
      rasterizePolygon(grid, [
        [
          [0, 0],
          [1, 0],
          [1, 1],
        ],
        [
          [0, 0],
          [NaN, 1],
          [1, 1],
        ],
      ]),
    ).toThrow(expect.objectContaining({ code: 'invalid-polygon', field: 'rings.1.1' }));
    expect(() =>
      rasterizePolygon({ ...grid, width: 0 }, [
        [
          [0, 0],
          [1, 0],
          [1, 1],
        ],
      ]),
    ).toThrow(expect.objectContaining({ code: 'invalid-raster' }));
  });
});

describeWithGdal('rasterizePolygon against gdal_rasterize', () => {
  // Source: GDAL gdal_rasterize documentation — without -at, a pixel is burned when its
  // centre is inside the polygon; -te/-tr fix the output grid; -init/-burn the values.
  const grid: RasterGrid = { width: 120, height: 100, cellSize: 25, xll: 512_000, yll: 5_731_000, crs: null };
  const e = (x: number) => grid.xll + x;
  const n = (y: number) => grid.yll + y;
  // Corners placed off the cell-centre lines (… .37, .71) so no centre lies on a boundary.
  const cases: { name: string; rings: [number, number][][] }[] = [
    {
      name: 'a convex quadrilateral',
      rings: [
        [
          [e(110.37), n(140.71)],
          [e(2630.13), n(401.29)],
          [e(2410.77), n(2290.41)],
          [e(330.59), n(2011.83)],
        ],
      ],
    },
    {
      name: 'a concave outline (a bay cut into the east side)',
      rings: [
        [
          [e(200.37), n(200.71)],
          [e(2800.13), n(260.29)],
          [e(2750.77), n(1100.41)],
          [e(1400.59), n(1250.83)],
          [e(2700.21), n(1500.17)],
          [e(2650.63), n(2300.91)],
          [e(260.33), n(2380.47)],
        ],
      ],
    },
    {
      name: 'an outer ring with a hole',
      rings: [
        [
          [e(300.37), n(300.71)],
          [e(2700.13), n(300.29)],
          [e(2700.77), n(2200.41)],
          [e(300.59), n(2200.83)],
        ],
        [
          [e(900.11), n(800.23)],
          [e(1900.47), n(1100.61)],
          [e(1500.89), n(1700.07)],
        ],
      ],
    },
    {
      name: 'a random star running off the grid',
      rings: [randomStar(seededRandom(8), e(2500.3), n(1300.7), 1400, 17)],
    },
  ];
  let folder: ReturnType<typeof temporaryFolder>;
  beforeAll(() => {
    folder = temporaryFolder();
  });
  afterAll(() => folder.remove());

  test.each(cases)('$name', async ({ name, rings }) => {
    const input = path.join(folder.dir, `${name.replace(/\W+/g, '-')}.geojson`);
    const output = input.replace(/\.geojson$/, '.tif');
    const geojson = {
      type: 'FeatureCollection',
      crs: { type: 'name', properties: { name: 'EPSG:32633' } },
      features: [{ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: rings.map((r) => [...r, r[0]]) } }],
    };
    writeFileSync(input, JSON.stringify(geojson));
    gdal('gdal_rasterize', [
      '-q',
      '-burn',
      '1',
      '-init',
      '0',
      '-ot',
      'Byte',
      '-te',
      String(grid.xll),
      String(grid.yll),
      String(grid.xll + grid.width * grid.cellSize),
      String(grid.yll + grid.height * grid.cellSize),
      '-tr',
      String(grid.cellSize),
      String(grid.cellSize),
      input,
      output,
    ]);
    const bytes = readFileSync(output);
    const reference = await readGeoTiff(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
    expect([reference.width, reference.height, reference.xll, reference.yll]).toEqual([
      grid.width,
      grid.height,
      grid.xll,
      grid.yll,
    ]);
    const ours = rasterizePolygon(grid, rings);
    const theirs = Uint8Array.from(reference.heights);
    expect(theirs.reduce((a, b) => a + b, 0)).toBeGreaterThan(100); // the reference burned something
    expect(differing(ours, theirs)).toBe(0);
  });
});

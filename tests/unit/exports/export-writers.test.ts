import { blindAreaPolygons } from '@/server/domain/exports/blind-area-polygons';
import { exportFileName, namePart } from '@/server/domain/exports/export-file-name';
import { geodesicSector, rfc7946Ring, signedArea2 } from '@/server/domain/exports/geojson-rings';
import { csvField } from '@/server/domain/exports/results-csv';

describe('csvField', () => {
  it('quotes only fields that need it and doubles quotes', () => {
    // Source: RFC 4180 §2 rules 5–7.
    expect(csvField('Crane Knoll Tower')).toBe('Crane Knoll Tower');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\r\nlines')).toBe('"two\r\nlines"');
  });
});

describe('rfc7946Ring', () => {
  it('closes a ring and winds the exterior counter-clockwise, holes clockwise', () => {
    // A clockwise square (x east, y north). Source: RFC 7946 §3.1.6.
    const clockwise: [number, number][] = [
      [0, 0],
      [0, 1],
      [1, 1],
      [1, 0],
    ];
    const outer = rfc7946Ring(clockwise, true)!;
    expect(outer).toHaveLength(5);
    expect(outer[0]).toEqual(outer[4]);
    expect(signedArea2(outer)).toBeGreaterThan(0);
    expect(signedArea2(rfc7946Ring(clockwise, false)!)).toBeLessThan(0);
    // Rounded to 6 decimals; repeated positions dropped; degenerate rings refused.
    expect(
      rfc7946Ring(
        [
          [0.12345678, 0],
          [0.12345678, 0],
          [1, 0],
          [1, 1],
        ],
        true,
      )![0],
    ).toEqual([0.123457, 0]);
    expect(
      rfc7946Ring(
        [
          [0, 0],
          [1, 1],
          [2, 2],
        ],
        true,
      ),
    ).toBeNull();
  });

  it('does not modify its input', () => {
    const ring: [number, number][] = [
      [0, 0],
      [0, 1],
      [1, 1],
    ];
    const copy = JSON.stringify(ring);
    rfc7946Ring(ring, true);
    expect(JSON.stringify(ring)).toBe(copy);
  });
});

describe('geodesicSector', () => {
  it('spans the sector clockwise across north', () => {
    const ring = geodesicSector({ latDeg: 51.8, lonDeg: 15.2 }, 350, 10, 10_000)!;
    // Every arc point lies north of the post: bearings 350° … 10° (common practice, no source).
    for (const [, lat] of ring.slice(1, -2)) expect(lat).toBeGreaterThan(51.8);
  });
});

describe('blindAreaPolygons', () => {
  const grid = { width: 5, height: 4, cellSize: 10, xll: 1000, yll: 2000, crs: null };
  const identity = (x: number, y: number) => ({ lonDeg: x, latDeg: y });

  it('outlines one 8-connected patch through the edge middles, around every blind cell centre', () => {
    // Row 0 is north. The patch: (1,1), (2,1) and, touching at a corner, (3,2); (0,3) is another patch.
    const mask = new Uint8Array([0, 0, 0, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0, 1, 0, 1, 0, 0, 0, 0]);
    const [out, repeat, seen] = blindAreaPolygons(
      grid,
      mask,
      [
        { col: 1, row: 1 },
        { col: 3, row: 2 },
        { col: 0, row: 0 },
      ],
      identity,
    );
    if (!out) throw new Error('no outline');
    expect(out.cells).toBe(3);
    // The marching-squares outline of two cells side by side: through the middles of their outer edges.
    // Cell (1,1) spans x 1010–1020, y 2020–2030 (the grid's top is y 2040). Source: d3-contour (marching squares).
    const first = out.coordinates[0]![0]!;
    expect(first).toContainEqual([1010, 2025]);
    expect(first).toContainEqual([1030, 2025]);
    const inside = (x: number, y: number) =>
      out.coordinates.some(([ring]) => {
        let c = false;
        for (let i = 0, j = ring!.length - 1; i < ring!.length; j = i++) {
          const [xi, yi] = ring![i]!;
          const [xj, yj] = ring![j]!;
          if (yi! > y !== yj! > y && x < ((xj! - xi!) * (y - yi!)) / (yj! - yi!) + xi!) c = !c;
        }
        return c;
      });
    for (const [col, row] of [
      [1, 1],
      [2, 1],
      [3, 2],
    ]) {
      expect(inside(1000 + (col! + 0.5) * 10, 2040 - (row! + 0.5) * 10)).toBe(true);
    }
    // The other patch and seen cells stay outside.
    expect(inside(1005, 2005)).toBe(false);
    expect(inside(1045, 2035)).toBe(false);
    // A second seed in the same patch, and a seed on a seen cell: no outline of their own.
    expect(repeat).toBeNull();
    expect(seen).toBeNull();
    // The other patch, seeded on its own, is its own outline (at the grid's edge: closed along it).
    const [other] = blindAreaPolygons(grid, mask, [{ col: 0, row: 3 }], identity);
    expect(other!.cells).toBe(1);
    expect(other!.coordinates).toHaveLength(1);
  });
});

describe('exportFileName', () => {
  it('says site, plan, version, revision and the site’s local date', () => {
    const name = exportFileName({
      siteName: 'Harrowmere Forest District',
      planTitle: 'Fire season: cover/2026',
      planVersion: 2,
      revision: 3,
      // 23:30 UTC is already the next day in Oslo (UTC+1 in winter). Source: IANA tz database (common practice).
      at: '2026-12-03T23:30:00Z',
      timeZone: 'Europe/Oslo',
      what: 'results',
      extension: 'csv',
    });
    expect(name).toBe('Harrowmere-Forest-District_Fire-season-cover-2026_v2_rev3_2026-12-04_results.csv');
    expect(namePart('  \u0007 ')).toBe('unnamed');
  });
});

import { gridProjection } from '@/shared/terrain/grid-projection';
import { gridFootprintRing } from '@/shared/terrain/grid-footprint-ring';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { copyName } from '@/server/domain/sites/manage-sites';

// The fixture grid (tests/fixtures/terrain/README.md): 160 × 150 cells of 30 m, lower-left (425 000, 5 717 000), EPSG:32629.
const GRID = { width: 160, height: 150, cellSize: 30, xll: 425_000, yll: 5_717_000 };
const utm29 = gridProjection({ epsg: 32629, wkt: null });
const toLatLon = (x: number, y: number) => utm29.toLatLon(x, y);

describe('gridFootprintRing', () => {
  it('runs through the outermost cell centres, as GDAL reprojects them', () => {
    const ring = gridFootprintRing(GRID, toLatLon, 2);
    expect(ring).toHaveLength(9);
    // Source: GDAL 3.6.2 gdaltransform -s_srs EPSG:32629 -t_srs EPSG:4326 of (425015, 5717015), (429785, 5717015),
    // (429785, 5721485), (425015, 5721485) — SW, SE, NE, NW — and of the south row's middle (427400, 5717015).
    const expected: [number, number][] = [
      [-10.0826434182533, 51.5991833552387],
      [-10.0482147774602, 51.5994958504581],
      [-10.0137855252758, 51.5997982498853],
    ];
    expected.forEach(([lon, lat], i) => {
      expect(Math.abs(ring[i]![0] - lon)).toBeLessThan(1e-6);
      expect(Math.abs(ring[i]![1] - lat)).toBeLessThan(1e-6);
    });
    expect(Math.abs(ring[4]![0] - -10.0146814441371)).toBeLessThan(1e-6);
    expect(Math.abs(ring[6]![1] - 51.6393683684723)).toBeLessThan(1e-6);
    expect(ring[8]).toEqual(ring[0]);
  });

  it('goes counter-clockwise (positive shoelace area in longitude, latitude)', () => {
    const ring = gridFootprintRing(GRID, toLatLon);
    let twiceArea = 0;
    for (let i = 0; i < ring.length - 1; i++) twiceArea += ring[i]![0] * ring[i + 1]![1] - ring[i + 1]![0] * ring[i]![1];
    expect(twiceArea).toBeGreaterThan(0);
  });

  it('refuses a grid without two cells a side and a bad segment count', () => {
    expect(() => gridFootprintRing({ ...GRID, width: 1 }, toLatLon)).toThrow(TerrainInputError);
    expect(() => gridFootprintRing(GRID, toLatLon, 0)).toThrow(/segmentsPerEdge/);
    expect(() => gridFootprintRing(GRID, toLatLon, 2.5)).toThrow(/segmentsPerEdge/);
  });

  it('does not change the grid it is given', () => {
    const grid = { ...GRID };
    gridFootprintRing(grid, toLatLon);
    expect(grid).toEqual(GRID);
  });
});

describe('copyName', () => {
  it('adds “(copy)”, then numbers the copies, and stays within 120 characters', () => {
    expect(copyName('Gull Point', new Set())).toBe('Gull Point (copy)');
    expect(copyName('Gull Point', new Set(['Gull Point (copy)']))).toBe('Gull Point (copy 2)');
    expect(copyName('Gull Point (copy)', new Set(['Gull Point (copy)', 'Gull Point (copy 2)']))).toBe('Gull Point (copy 3)');
    const long = 'x'.repeat(120);
    expect(copyName(long, new Set())).toHaveLength(120);
    expect(copyName(long, new Set()).endsWith(' (copy)')).toBe(true);
  });
});

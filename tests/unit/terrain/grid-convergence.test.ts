import { utmGridConvergence } from '@/shared/geo/utm';
import { gridConvergence } from '@/shared/terrain/grid-convergence';
import { gridProjection } from '@/shared/terrain/grid-projection';

const DEG = Math.PI / 180;

describe('gridConvergence', () => {
  test.each([
    { latDeg: 51.82, lonDeg: 15.235 }, // the demo district
    { latDeg: 51.6, lonDeg: 17.5 },
    { latDeg: 60.5, lonDeg: 12.2 },
  ])('on WGS 84 / UTM 33N at $latDeg°, $lonDeg° equals utmGridConvergence', (point) => {
    // Source: utmGridConvergence (checked against PROJ's gdaltransform in its own tests).
    const got = gridConvergence(gridProjection({ epsg: 32633, wkt: null }), point);
    expect(Math.abs(got - utmGridConvergence(point, 33))).toBeLessThan(1e-9);
  });

  test('on ETRS89 / UTM 32N (proj4, GRS 80) matches the spherical closed form', () => {
    // Source: γ = atan(tan Δλ · sin φ) for the transverse Mercator (J. P. Snyder, Map
    // Projections — A Working Manual, USGS PP 1395, from memory); within 1e-5 rad in a zone.
    const point = { latDeg: 48.2, lonDeg: 11.4 };
    const expected = Math.atan(Math.tan((11.4 - 9) * DEG) * Math.sin(48.2 * DEG));
    expect(Math.abs(gridConvergence(gridProjection({ epsg: 25832, wkt: null }), point) - expected)).toBeLessThan(1e-5);
  });

  test('on a Lambert conformal conic grid (one standard parallel) it is n·Δλ with n = sin φ0', () => {
    // Source: convergence of the Lambert conformal conic, γ = n (λ − λ0), n = sin φ0 for one
    // standard parallel (Snyder, USGS PP 1395, from memory). An invented grid described by WKT.
    const wkt =
      'PROJCS["Invented LCC",GEOGCS["WGS 84",DATUM["WGS_1984",SPHEROID["WGS 84",6378137,298.257223563]],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],' +
      'PROJECTION["Lambert_Conformal_Conic_1SP"],PARAMETER["latitude_of_origin",50],PARAMETER["central_meridian",10],' +
      'PARAMETER["scale_factor",1],PARAMETER["false_easting",500000],PARAMETER["false_northing",0],UNIT["metre",1]]';
    const projection = gridProjection({ epsg: null, wkt });
    for (const lonDeg of [4, 10, 16]) {
      const expected = Math.sin(50 * DEG) * (lonDeg - 10) * DEG;
      expect(Math.abs(gridConvergence(projection, { latDeg: 51, lonDeg }) - expected)).toBeLessThan(1e-7);
    }
  });

  test('signs: grid north east of true north east of the central meridian (northern hemisphere)', () => {
    // common practice, no source.
    const utm = gridProjection({ epsg: 32633, wkt: null });
    expect(gridConvergence(utm, { latDeg: 50, lonDeg: 16 })).toBeGreaterThan(0);
    expect(gridConvergence(utm, { latDeg: 50, lonDeg: 14 })).toBeLessThan(0);
  });
});

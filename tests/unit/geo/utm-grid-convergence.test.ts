import { execFileSync } from 'node:child_process';

import { utmGridConvergence } from '@/shared/geo/utm';
import { describeWithGdal } from '@/tests/unit/terrain/gdal-tools';

import { expectCoordinateError, expectWithin } from './expect-close';

const DEG = Math.PI / 180;

describe('utmGridConvergence', () => {
  // Source: meridian convergence of the spherical transverse Mercator, γ = atan(tan Δλ · sin φ)
  // (J. P. Snyder, Map Projections — A Working Manual, USGS PP 1395, from memory). On the
  // ellipsoid the difference is of order Δλ³·e′² and stays below 1e-5 rad within a zone.
  test.each([
    { latDeg: 51.6, lonDeg: 16, zone: 33 },
    { latDeg: 51.6, lonDeg: 14, zone: 33 },
    { latDeg: 51.82, lonDeg: 15.235, zone: 33 }, // the demo district
    { latDeg: 10, lonDeg: 17.9, zone: 33 },
    { latDeg: -35, lonDeg: 149.1, zone: 55 },
    { latDeg: 70, lonDeg: -122.5, zone: 10 },
  ])('$latDeg°, $lonDeg° (zone $zone) matches the spherical closed form', ({ latDeg, lonDeg, zone }) => {
    const centralMeridian = -183 + 6 * zone;
    const expected = Math.atan(Math.tan((lonDeg - centralMeridian) * DEG) * Math.sin(latDeg * DEG));
    expectWithin(utmGridConvergence({ latDeg, lonDeg }, zone), expected, 1e-5);
  });

  test('signs: east of the central meridian grid north is east of true north in the north, west of it in the south', () => {
    // common practice, no source: γ has the sign of Δλ · sin φ.
    expect(utmGridConvergence({ latDeg: 50, lonDeg: 16 })).toBeGreaterThan(0);
    expect(utmGridConvergence({ latDeg: 50, lonDeg: 14 })).toBeLessThan(0);
    expect(utmGridConvergence({ latDeg: -30, lonDeg: 16 })).toBeLessThan(0);
    expectWithin(utmGridConvergence({ latDeg: 50, lonDeg: 15 }), 0, 1e-12); // on the central meridian
    expectWithin(utmGridConvergence({ latDeg: 0, lonDeg: 17 }), 0, 1e-9); // on the equator
  });

  test('refuses positions outside the UTM area', () => {
    expectCoordinateError(() => utmGridConvergence({ latDeg: 85, lonDeg: 0 }), 'outside-utm-area');
    expectCoordinateError(() => utmGridConvergence({ latDeg: 50, lonDeg: 15 }, 61), 'unknown-zone');
  });
});

describeWithGdal('utmGridConvergence against PROJ (gdaltransform)', () => {
  // Source: PROJ (through GDAL's gdaltransform, Debian gdal-bin) projecting two points 0.0002°
  // apart on the meridian into EPSG:326zz; the bearing of that grid vector is −γ.
  test.each([
    { latDeg: 51.82, lonDeg: 15.235, zone: 33 },
    { latDeg: 60.5, lonDeg: 11.2, zone: 33 },
    { latDeg: 45, lonDeg: 7.1, zone: 32 },
  ])('$latDeg°, $lonDeg° within 1e-8 rad', ({ latDeg, lonDeg, zone }) => {
    const input = `${lonDeg} ${latDeg - 1e-4}\n${lonDeg} ${latDeg + 1e-4}\n`;
    const output = execFileSync('gdaltransform', ['-s_srs', 'EPSG:4326', '-t_srs', `EPSG:${32600 + zone}`, '-output_xy'], {
      input,
      encoding: 'utf8',
    });
    const [[e0, n0], [e1, n1]] = output
      .trim()
      .split('\n')
      .map((line) => line.trim().split(/\s+/).map(Number)) as [[number, number], [number, number]];
    expectWithin(utmGridConvergence({ latDeg, lonDeg }, zone), -Math.atan2(e1 - e0, n1 - n0), 1e-8);
  });
});

import { geodesicDirect } from '@/shared/geo/geodesic-direct';
import { geodesicInverse } from '@/shared/geo/geodesic-inverse';

describe('geodesicDirect: a point at a distance and bearing from a landmark', () => {
  it('reproduces GeographicLib’s published direct example (JFK, 53.5°, 5850 km)', () => {
    // Source: GeodSolve(1) manual, example "40.63972222 -73.77888889 53.5 5850e3" → 49.01467 2.56106, also
    // geographiclib-geodesic's own test suite (test/geodesictest.js, GeodSolve0), tolerance 0.5e-5°.
    const p = geodesicDirect({ latDeg: 40.63972222, lonDeg: -73.77888889 }, 53.5, 5850e3);
    expect(Math.abs(p.latDeg - 49.01467)).toBeLessThan(0.5e-5);
    expect(Math.abs(p.lonDeg - 2.56106)).toBeLessThan(0.5e-5);
  });

  it('reproduces the first line of Karney’s geodesic test set', () => {
    // Source: geographiclib-geodesic test/geodesictest.js, testcases[0] (from GeodTest.dat, Karney 2013):
    // 35.60777, −139.44815, azi1 111.098748429560326, s12 8935244.5604818305 (rounded to double precision here) → −11.17491, −69.95921.
    const p = geodesicDirect({ latDeg: 35.60777, lonDeg: -139.44815 }, 111.09874842956033, 8935244.56048183);
    expect(p.latDeg).toBeCloseTo(-11.17491, 5);
    expect(p.lonDeg).toBeCloseTo(-69.95921, 5);
  });

  it('"1.2 km at 040°" round-trips through the inverse problem within a millimetre', () => {
    // Source: Karney (2013), inverse problem (geographiclib-geodesic) — the independent check of the direct one.
    const mark = { latDeg: 51.64, lonDeg: 15.27 };
    const p = geodesicDirect(mark, 40, 1200);
    const back = geodesicInverse(mark, p);
    expect(back.distanceM).toBeCloseTo(1200, 3);
    expect(back.azimuthDeg).toBeCloseTo(40, 6);
  });

  it('refuses a negative distance', () => {
    expect(() => geodesicDirect({ latDeg: 0, lonDeg: 0 }, 10, -5)).toThrow(RangeError);
  });
});

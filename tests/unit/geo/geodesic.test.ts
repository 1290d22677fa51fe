import proj4 from 'proj4';
import { projectAzimuthalEquidistant } from '@/shared/geo/azimuthal-equidistant';
import { geodesicInverse } from '@/shared/geo/geodesic-inverse';
import { inSector, ringReach } from '@/shared/geo/ring-reach';

describe('geodesicInverse', () => {
  // Source: GeographicLib's geodesic test set (Karney), the first two cases
  // of test/geodesictest.js in the geographiclib-geodesic package:
  // lat1, lon1, azi1, lat2, lon2, s12.
  it.each([
    [35.60777, -139.44815, 111.09874842956, -11.17491, -69.95921, 8935244.56048183],
    [55.52454, 106.05087, 22.0200598809828, 77.03196, 197.18234, 4105086.17139244],
  ])('solves the published case from (%f, %f)', (lat1, lon1, azi1, lat2, lon2, s12) => {
    const leg = geodesicInverse({ latDeg: lat1, lonDeg: lon1 }, { latDeg: lat2, lonDeg: lon2 });
    expect(Math.abs(leg.distanceM - s12)).toBeLessThan(1e-6);
    expect(Math.abs(leg.azimuthDeg - azi1)).toBeLessThan(1e-9);
  });

  it('gives one degree of longitude on the equator as a × π/180 due east', () => {
    // Source: WGS84 semi-major axis a = 6 378 137 m (NIMA TR8350.2); on the equator a meridian arc of
    // longitude is a circle arc of radius a — common practice, no source.
    const leg = geodesicInverse({ latDeg: 0, lonDeg: 0 }, { latDeg: 0, lonDeg: 1 });
    expect(leg.distanceM).toBeCloseTo((6378137 * Math.PI) / 180, 6);
    expect(leg.azimuthDeg).toBeCloseTo(90, 9);
  });

  it('reports azimuths from 0 to 360, never negative', () => {
    expect(geodesicInverse({ latDeg: 10, lonDeg: 10 }, { latDeg: 10, lonDeg: 9.5 }).azimuthDeg).toBeGreaterThan(180);
  });
});

describe('projectAzimuthalEquidistant', () => {
  it('agrees with proj4’s ellipsoidal azimuthal equidistant projection to a millimetre', () => {
    // Source: proj4 (npm), +proj=aeqd on the WGS84 ellipsoid, an independent implementation.
    const centre = { latDeg: 51.6, lonDeg: 15.2 };
    const points = [
      { latDeg: 51.9, lonDeg: 15.5 },
      { latDeg: 51.2, lonDeg: 14.6 },
      { latDeg: 52.4, lonDeg: 15.2 },
      { latDeg: 51.6, lonDeg: 16.1 },
    ];
    const ref = proj4('WGS84', `+proj=aeqd +lat_0=${centre.latDeg} +lon_0=${centre.lonDeg} +ellps=WGS84 +units=m`);
    projectAzimuthalEquidistant(centre, points).forEach(([x, y], i) => {
      const [rx, ry] = ref.forward([points[i]!.lonDeg, points[i]!.latDeg]);
      expect(Math.abs(x - rx)).toBeLessThan(0.001);
      expect(Math.abs(y - ry)).toBeLessThan(0.001);
    });
  });

  it('does not change its input', () => {
    const points = [{ latDeg: 1, lonDeg: 2 }];
    const copy = structuredClone(points);
    projectAzimuthalEquidistant({ latDeg: 0, lonDeg: 0 }, points);
    expect(points).toEqual(copy);
  });
});

describe('ringReach', () => {
  // A 1 km square centred 10 km north of the lookout.
  const square: [number, number][] = [
    [-500, 9500],
    [500, 9500],
    [500, 10500],
    [-500, 10500],
  ];

  it('measures nearest and farthest distances exactly', () => {
    // common practice, no source: Pythagoras on the square's corners and its near edge.
    const r = ringReach(square, 50_000, null);
    expect(r.nearestM).toBeCloseTo(9500, 9);
    expect(r.farthestM).toBeCloseTo(Math.hypot(500, 10500), 9);
    expect(r.coveredShare).toBe(1);
  });

  it('is 0 beyond the range, and 0 m nearest when the lookout stands inside', () => {
    expect(ringReach(square, 9000, null).coveredShare).toBe(0);
    const around: [number, number][] = [
      [-1000, -1000],
      [1000, -1000],
      [1000, 1000],
      [-1000, 1000],
    ];
    expect(ringReach(around, 10, null).nearestM).toBe(0);
  });

  it('measures the share inside a range circle against the analytic area', () => {
    // A square of side 2 centred on the lookout, range 1: the inscribed disc covers π/4 of it.
    // common practice, no source (area of a circle).
    const unit: [number, number][] = [
      [-1, -1],
      [1, -1],
      [1, 1],
      [-1, 1],
    ];
    expect(ringReach(unit, 1, null).coveredShare).toBeCloseTo(Math.PI / 4, 2);
  });

  it('counts only the viewing sector', () => {
    const unit: [number, number][] = [
      [-1, -1],
      [1, -1],
      [1, 1],
      [-1, 1],
    ];
    // A quarter sector (north-east quadrant) sees a quarter of a square centred on the lookout.
    expect(ringReach(unit, 10, { fromDeg: 0, toDeg: 90 }).coveredShare).toBeCloseTo(0.25, 6);
    // A sector crossing north (300° → 60°) sees a third of the directions.
    expect(ringReach(unit, 10, { fromDeg: 300, toDeg: 60 }).coveredShare).toBeGreaterThan(0.3);
    expect(ringReach(unit, 10, { fromDeg: 300, toDeg: 60 }).coveredShare).toBeLessThan(0.37);
  });

  it('tells sector membership across north', () => {
    expect(inSector(10, { fromDeg: 300, toDeg: 60 })).toBe(true);
    expect(inSector(200, { fromDeg: 300, toDeg: 60 })).toBe(false);
    expect(inSector(123, null)).toBe(true);
    expect(inSector(45, { fromDeg: 0, toDeg: 360 })).toBe(true);
  });

  it('refuses fewer than three corners and a negative range', () => {
    expect(() => ringReach(square.slice(0, 2), 10, null)).toThrow(RangeError);
    expect(() => ringReach(square, -1, null)).toThrow(/≥ 0 m/);
  });
});

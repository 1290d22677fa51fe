import { formatCoordinate, type FormatCoordinateOptions } from '@/shared/geo/format-coordinate';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';
import type { CoordinateFormat, LatLon } from '@/shared/geo/types';

import { expectWithin } from './expect-close';

/*
 * Source for every check in this file: none outside Kenning — these are
 * consistency checks of formatCoordinate against parseCoordinate. Each
 * tolerance is half the last digit written (plus 1e-9 for arithmetic):
 * DD 5 decimals → 0.5e-5°; DDM 3 decimals of minutes → 0.0005′;
 * DMS 1 decimal of seconds → 0.05″; UTM whole metres → 0.5 m in easting
 * and northing (compared on the ground, below).
 */
const HALF_DIGIT_DEG: Readonly<Record<Exclude<CoordinateFormat, 'utm' | 'mgrs'>, number>> = {
  dd: 0.5e-5,
  ddm: 0.0005 / 60,
  dms: 0.05 / 3600,
};

// A deterministic grid over the whole globe plus the edge cases: poles, equator, prime meridian,
// antimeridian, zone and band boundaries, the Norway and Svalbard zones, the southern "band S" window.
const GRID: LatLon[] = [];
for (let lat = -90; lat <= 90; lat += 7.77)
  for (let lon = -180; lon <= 180; lon += 11.31) GRID.push({ latDeg: lat, lonDeg: lon });
const EDGES: LatLon[] = [
  { latDeg: 90, lonDeg: 0 },
  { latDeg: -90, lonDeg: 0 },
  { latDeg: 0, lonDeg: 0 },
  { latDeg: 0, lonDeg: 180 },
  { latDeg: 0, lonDeg: -180 },
  { latDeg: -0.0000001, lonDeg: -0.0000001 },
  { latDeg: 45, lonDeg: 179.99999 },
  { latDeg: -45, lonDeg: -179.99999 },
  { latDeg: 10, lonDeg: -174 },
  { latDeg: 10, lonDeg: -174.0000001 },
  { latDeg: 56, lonDeg: 3 },
  { latDeg: 63.9999, lonDeg: 11.9999 },
  { latDeg: 72, lonDeg: 9 },
  { latDeg: 83.9999, lonDeg: 41.9999 },
  { latDeg: 84, lonDeg: 0 },
  { latDeg: -80, lonDeg: 0 },
  { latDeg: 32, lonDeg: -117 },
  { latDeg: 40, lonDeg: -105 },
  { latDeg: -50, lonDeg: -60 },
  { latDeg: -54, lonDeg: -36.5 },
  { latDeg: -58, lonDeg: 15 },
  { latDeg: 61.2345, lonDeg: -149.8765 },
  { latDeg: 59.99999999, lonDeg: 29.99999999 },
];
const POINTS = [...GRID, ...EDGES];
const IN_UTM = POINTS.filter((p) => p.latDeg >= -80 && p.latDeg <= 84);

/**
 * Ground distance between two nearby positions, metres, on a sphere of the mean radius (6 371 008.8 m, IUGG; from
 * memory) — good to better than 1 % over the metre-sized differences compared here. Longitude differences are
 * taken modulo 360° so 180°E and 180°W coincide.
 */
function groundDistanceM(a: LatLon, b: LatLon): number {
  const radius = 6_371_008.8;
  const rad = Math.PI / 180;
  const dLon = ((((a.lonDeg - b.lonDeg + 180) % 360) + 360) % 360) - 180;
  const x = dLon * rad * Math.cos(((a.latDeg + b.latDeg) / 2) * rad) * radius;
  const y = (a.latDeg - b.latDeg) * rad * radius;
  return Math.hypot(x, y);
}

/**
 * Rounding easting and northing to whole metres moves a point at most 0.5·√2 m on the grid, which is at most
 * that divided by the grid scale on the ground (scale ≥ 0.9996 on the central meridian); 1 % more for the
 * spherical distance above: 0.7071 / 0.9996 × 1.01 < 0.72 m.
 */
const UTM_HALF_METRE_GROUND_M = 0.72;

const DEGREE_CASES: [Exclude<CoordinateFormat, 'utm' | 'mgrs'>, FormatCoordinateOptions][] = [
  ['dd', {}],
  ['dd', { style: 'letters' }],
  ['ddm', {}],
  ['ddm', { style: 'signed' }],
  ['dms', {}],
  ['dms', { style: 'signed' }],
];

describe('round trips', () => {
  it('has enough points to mean something', () => {
    expect(POINTS.length).toBeGreaterThan(700);
    expect(IN_UTM.length).toBeGreaterThan(600);
  });

  it.each(DEGREE_CASES)('%s %j reads back within half the last digit', (format, options) => {
    for (const point of POINTS) {
      const text = formatCoordinate(point, format, options);
      const back = parseCoordinate(text);
      expect(back.format).toBe(format);
      expectWithin(back.latDeg, point.latDeg, HALF_DIGIT_DEG[format] + 1e-9);
      expectWithin(back.lonDeg, point.lonDeg, HALF_DIGIT_DEG[format] + 1e-9);
    }
  });

  it.each([{}, { utmLetter: 'hemisphere' as const }])(
    'utm %j reads back within half a metre of easting and northing',
    (options) => {
      for (const point of IN_UTM) {
        const back = parseCoordinate(formatCoordinate(point, 'utm', options));
        expect(back.format).toBe('utm');
        expect(groundDistanceM(back, point)).toBeLessThanOrEqual(UTM_HALF_METRE_GROUND_M);
      }
    },
  );

  it('reads back at full precision to well under a millimetre', () => {
    for (const point of IN_UTM) {
      const back = parseCoordinate(formatCoordinate(point, 'utm', { decimals: 6 }));
      expect(groundDistanceM(back, point)).toBeLessThanOrEqual(1e-5);
    }
  });

  it('regression: a position on 80°S or 84°N written to the metre reads back (rounding crossed the limit)', () => {
    for (const point of [
      { latDeg: -80, lonDeg: -180 },
      { latDeg: -80, lonDeg: 3 },
      { latDeg: 84, lonDeg: 20 },
    ]) {
      const back = parseCoordinate(formatCoordinate(point, 'utm'));
      expect(groundDistanceM(back, point)).toBeLessThanOrEqual(UTM_HALF_METRE_GROUND_M);
    }
  });

  it('regression: a signed DDM longitude at the end of the text reads back (an empty next character was taken for a second minute mark)', () => {
    expect(parseCoordinate("-90°00.000', -180°00.000'")).toEqual({ latDeg: -90, lonDeg: -180, format: 'ddm' });
  });
});

import proj4 from 'proj4';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { formatMgrs, parseMgrs } from '@/shared/geo/mgrs';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';
import type { LatLon } from '@/shared/geo/types';
import { expectCoordinateError, expectWithin } from './expect-close';

describe('MGRS against the mgrs package’s published examples', () => {
  // Source: proj4js/mgrs 1.0.0, test/test.js ("First MGRS set", "Second MGRS set"), read from the package.
  it('reads 33UXP04 as the middle of its 10 km square and writes it back at 5 and 1 digits', () => {
    const p = parseMgrs('33UXP04');
    expectWithin(p.lonDeg, 16.4145, 0.000001);
    expectWithin(p.latDeg, 48.24949, 0.000001);
    expect(formatMgrs(p, 1)).toBe('33U XP 0 4');
    // The package writes 33UXP0500444998: it rounds the metres. A reference names the square the
    // point is in, so Kenning truncates (NGA.SIG.0012, from memory): the northing is …44997.6 m by proj4.
    const [, n] = proj4('EPSG:4326', '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs', [p.lonDeg, p.latDeg]) as [
      number,
      number,
    ];
    expect(Math.round(n) % 100_000).toBe(44998);
    expect(formatMgrs(p)).toBe(`33U XP 05004 ${String(Math.floor(n) % 100_000).padStart(5, '0')}`);
    expect(formatMgrs(p)).toBe('33U XP 05004 44997');
  });

  it('reads 24XWT783908 near a zone border, and writes it in its own zone 25X at 3 digits', () => {
    const p = parseMgrs('24XWT783908');
    expectWithin(p.lonDeg, -32.66433, 0.00001);
    expectWithin(p.latDeg, 83.62778, 0.00001);
    expect(formatMgrs(p, 3).replace(/ /g, '')).toBe('25XEN041865');
  });

  it('writes the origin and a point 1.1 m north of it with the northing digits the examples give', () => {
    expect(formatMgrs({ latDeg: 0, lonDeg: 0 }).replace(/ /g, '')).toBe('31NAA6602100000');
    expect(formatMgrs({ latDeg: 0.00001, lonDeg: 0 }).replace(/ /g, '')).toBe('31NAA6602100001');
  });
});

/**
 * MGRS built independently: UTM by proj4, then the 100 km square letters by the
 * lettering rules of the standard (columns A–H, J–R, S–Z by zone mod 3; rows
 * A–V without I and O, shifted 5 rows in even zones; bands C–X of 8°, X 12°),
 * and the 1 m digits truncated.
 * Source: NGA.SIG.0012 (MGRS lettering, the "AA" scheme used with WGS 84) — from memory; UTM: proj4 2.x.
 */
function independentMgrs(point: LatLon): string {
  const zone = Math.floor((point.lonDeg + 180) / 6) + 1; // the points below avoid the Norway/Svalbard exceptions
  const south = point.latDeg < 0;
  const [e, n] = proj4('EPSG:4326', `+proj=utm +zone=${zone}${south ? ' +south' : ''} +datum=WGS84 +units=m +no_defs`, [
    point.lonDeg,
    point.latDeg,
  ]) as [number, number];
  const bands = 'CDEFGHJKLMNPQRSTUVWX';
  const band = bands[Math.min(Math.floor((point.latDeg + 80) / 8), 19)]!;
  const columns = ['STUVWXYZ', 'ABCDEFGH', 'JKLMNPQR'][zone % 3]!;
  const column = columns[Math.floor(e / 100_000) - 1]!;
  const rows = 'ABCDEFGHJKLMNPQRSTUV';
  const row = rows[(Math.floor(n / 100_000) + (zone % 2 === 0 ? 5 : 0)) % 20]!;
  const pad = (v: number) => String(Math.floor(v % 100_000)).padStart(5, '0');
  return `${zone}${band} ${column}${row} ${pad(e)} ${pad(n)}`;
}

describe('MGRS against proj4 and the lettering rules', () => {
  // Invented points spread over both hemispheres and several zones (no zone exceptions).
  const POINTS: LatLon[] = [
    { latDeg: 61.2345, lonDeg: -149.8765 },
    { latDeg: -33.8568, lonDeg: 151.2153 },
    { latDeg: 48.8584, lonDeg: 2.2945 },
    { latDeg: 0.5, lonDeg: 36.8 },
    { latDeg: -54.8, lonDeg: -68.3 },
    { latDeg: 52.1, lonDeg: -9.9 },
  ];
  it.each(POINTS)('writes %o as proj4 and the rules give', (point) => {
    expect(formatMgrs(point)).toBe(independentMgrs(point));
  });

  it.each(POINTS)('reads its own MGRS of %o back within the 1 m square (≤ 0.71 m off, as degrees)', (point) => {
    const back = parseMgrs(formatMgrs(point));
    // 1 m ≈ 9.0e-6° of latitude; the middle of a 1 m square is at most √2/2 m from any point in it (geometry, common practice).
    expectWithin(back.latDeg, point.latDeg, 0.71 * 9.0e-6 + 1e-9);
    expectWithin(back.lonDeg, point.lonDeg, (0.71 * 9.0e-6) / Math.cos((point.latDeg * Math.PI) / 180) + 1e-9);
  });
});

describe('MGRS in parseCoordinate and formatCoordinate', () => {
  it('recognises an MGRS reference with or without spaces, in any case', () => {
    // Source: proj4js/mgrs 1.0.0 test/test.js (33UXP0500444998 ↔ 48.24949°N 16.41450°E).
    for (const text of ['33UXP0500444998', '33U XP 05004 44998', ' 33uxp 0500444998 ']) {
      const p = parseCoordinate(text);
      expect(p.format).toBe('mgrs');
      expectWithin(p.latDeg, 48.24949, 0.00001);
      expectWithin(p.lonDeg, 16.4145, 0.00001);
    }
    expect(parseCoordinate('33UXP04', 'mgrs').format).toBe('mgrs');
    expect(formatCoordinate({ latDeg: 48.24949, lonDeg: 16.4145 }, 'mgrs', { mgrsDigits: 3 })).toBe('33U XP 050 449');
  });

  it('still reads UTM with a band letter as UTM', () => {
    expect(parseCoordinate('33U 516200 5741300').format).toBe('utm');
  });

  it('refuses a bad reference, saying what is wrong', () => {
    expect(expectCoordinateError(() => parseMgrs('33UXP0500444'), 'bad-number', 'easting').message).toMatch(
      /as many easting digits/,
    );
    expectCoordinateError(() => parseMgrs('61UXP0500444998'), 'unknown-zone', 'zone');
    // Zone 33 (33 mod 3 = 0) letters its columns S–Z (NGA.SIG.0012, from memory).
    expect(expectCoordinateError(() => parseMgrs('33UAP0500444998'), 'unknown-zone-letter', 'zone').message).toMatch(/S–Z/);
    expectCoordinateError(() => formatMgrs({ latDeg: 85, lonDeg: 0 }), 'outside-utm-area', 'latitude');
    expectCoordinateError(() => formatMgrs({ latDeg: 10, lonDeg: 0 }, 6), 'invalid-option', 'options');
  });
});

import { forward, toPoint } from 'mgrs';
import { checkLatLon } from '@/shared/geo/check-lat-lon';
import { CoordinateError } from '@/shared/geo/coordinate-error';
import { fromUtm } from '@/shared/geo/from-utm';
import { toUtm } from '@/shared/geo/to-utm';
import type { LatLon } from '@/shared/geo/types';

/** An MGRS reference as typed: zone, band, 100 km square, then an even number of digits (spaces optional). */
const MGRS_TEXT = /^(\d{1,2})\s*([C-HJ-NP-X])\s*([A-HJ-NP-Z])([A-HJ-NP-V])\s*(\d*)\s*(\d*)$/i;

/** The 100 km column letters by zone number mod 3 (NGA.SIG.0012: sets of 8, without I and O). */
const COLUMN_LETTERS = ['STUVWXYZ', 'ABCDEFGH', 'JKLMNPQR'] as const;

/** Whether a text is written as an MGRS reference (it may still be wrong; {@link parseMgrs} says why). */
export function looksLikeMgrs(text: string): boolean {
  return MGRS_TEXT.test(text.trim());
}

/**
 * Writes a WGS 84 position as an MGRS (Military Grid Reference System, the
 * same grid as USNG on WGS 84) reference: zone and band, 100 km square, and
 * `digits` digits each of easting and northing, truncated as the standard
 * does (5 digits = the 1 m square the point lies in), e.g. `33U XP 05004 44998`.
 *
 * @param point - latitude 80°S…84°N (MGRS's UTM part; the polar UPS part is not covered)
 * @param digits - 1–5 digits per axis (10 km … 1 m); default 5
 * @throws {CoordinateError} `outside-utm-area` beyond 80°S/84°N, `invalid-option` for bad digits
 *
 * Source: UTM by `toUtm` (proj4); the 100 km square letters by proj4js/mgrs 1.0.0 (`forward`),
 * after NGA's MGRS definition (NGA.SIG.0012).
 *
 * @example
 * formatMgrs({ latDeg: 48.24949, lonDeg: 16.41450 }); // '33U XP 05004 44998'
 */
export function formatMgrs(point: LatLon, digits = 5): string {
  checkLatLon(point.latDeg, point.lonDeg);
  if (!Number.isInteger(digits) || digits < 1 || digits > 5) {
    throw new CoordinateError(
      'invalid-option',
      'options',
      `MGRS digits must be a whole number from 1 to 5, got ${String(digits)}.`,
    );
  }
  if (point.latDeg < -80 || point.latDeg > 84) {
    throw new CoordinateError(
      'outside-utm-area',
      'latitude',
      'MGRS here covers 80°S to 84°N; the polar caps use UPS, which Kenning does not write.',
    );
  }
  // The reference names the square the point lies in, so the metres are truncated (the mgrs package
  // rounds them). The letters come from the package; where its rounding would cross a 100 km line they
  // are taken for a point a quarter metre inside the true 1 m square instead.
  const utm = toUtm(point);
  const e = Math.floor(utm.easting);
  const n = Math.floor(utm.northing);
  const crosses =
    Math.floor(Math.round(utm.easting) / 100_000) !== Math.floor(e / 100_000) ||
    Math.floor(Math.round(utm.northing) / 100_000) !== Math.floor(n / 100_000);
  const at = crosses ? fromUtm({ zone: utm.zone, hemisphere: utm.hemisphere, easting: e + 0.25, northing: n + 0.25 }) : point;
  const m = /^(\d{1,2}[A-Z])([A-Z]{2})\d{10}$/.exec(forward([at.lonDeg, at.latDeg], 5));
  if (!m) throw new CoordinateError('outside-utm-area', 'latitude', 'This position has no MGRS reference here.');
  const five = (v: number) => String(((v % 100_000) + 100_000) % 100_000).padStart(5, '0');
  return `${m[1]} ${m[2]} ${five(e).slice(0, digits)} ${five(n).slice(0, digits)}`;
}

/**
 * Reads an MGRS (or USNG) reference typed with or without spaces, e.g.
 * `33UXP0500444998` or `33U XP 05004 44998`, as the middle of the square it
 * names (a 1 m square for 5 digits, 10 km for 1 digit).
 *
 * @returns `{ latDeg, lonDeg }` WGS 84 degrees
 * @throws {CoordinateError} saying what is wrong: `unknown-zone` (not 1–60),
 *   `bad-number` (an odd count of digits, or more than 10), `unknown-zone-letter` (a
 *   square letter the grid does not use here), `band-mismatch` (the square is not in the band)
 *
 * Source: proj4js/mgrs 1.0.0 (`toPoint`), after NGA.SIG.0012.
 *
 * @example
 * parseMgrs('33UXP04'); // { latDeg: 48.24949, lonDeg: 16.41450 } (the middle of a 10 km square)
 */
export function parseMgrs(text: string): LatLon {
  const m = MGRS_TEXT.exec(text.trim());
  if (!m)
    throw new CoordinateError(
      'unexpected-character',
      'text',
      `“${text.trim()}” is not an MGRS reference (e.g. 33U XP 05004 44998).`,
    );
  const zone = Number(m[1]);
  if (zone < 1 || zone > 60)
    throw new CoordinateError('unknown-zone', 'zone', `MGRS zone ${zone} does not exist; zones run 1 to 60.`);
  const digits = `${m[5] ?? ''}${m[6] ?? ''}`;
  if (digits.length % 2 !== 0 || digits.length > 10) {
    throw new CoordinateError(
      'bad-number',
      'easting',
      `An MGRS reference has as many easting digits as northing digits (2, 4, 6, 8 or 10 in all); “${digits}” has ${digits.length}.`,
    );
  }
  const column = m[3]!.toUpperCase();
  const columns = COLUMN_LETTERS[zone % 3]!;
  if (!columns.includes(column)) {
    throw new CoordinateError(
      'unknown-zone-letter',
      'zone',
      `Column letter ${column} is not used in zone ${zone}; its 100 km squares are lettered ${columns[0]}–${columns[columns.length - 1]}.`,
    );
  }
  const compact = `${zone}${m[2]}${m[3]}${m[4]}${digits}`.toUpperCase();
  let lonLat: [number, number];
  try {
    lonLat = toPoint(compact);
  } catch (e) {
    throw new CoordinateError(
      'unknown-zone-letter',
      'zone',
      `${compact} cannot be placed: ${e instanceof Error ? e.message : 'the 100 km square letters do not fit the zone'}.`,
    );
  }
  const [lonDeg, latDeg] = lonLat;
  if (!Number.isFinite(lonDeg) || !Number.isFinite(latDeg)) {
    throw new CoordinateError(
      'band-mismatch',
      'northing',
      `${compact} cannot be placed: the square is not in band ${m[2]!.toUpperCase()}.`,
    );
  }
  // The 100 km square must lie in the band the letter names (8° of latitude; X is 12°).
  const band = m[2]!.toUpperCase();
  const bands = 'CDEFGHJKLMNPQRSTUVWX';
  const south = -80 + bands.indexOf(band) * 8;
  const north = band === 'X' ? 84 : south + 8;
  if (latDeg < south - 0.5 || latDeg > north + 0.5) {
    throw new CoordinateError(
      'band-mismatch',
      'northing',
      `${compact} falls at ${latDeg.toFixed(3)}°, outside band ${band} (${south}° to ${north}°): check the square letters.`,
    );
  }
  return { latDeg, lonDeg };
}

import { CoordinateError } from '@/shared/geo/coordinate-error';
import { looksLikeMgrs, parseMgrs } from '@/shared/geo/mgrs';
import { parseLatLonText } from '@/shared/geo/parse-lat-lon-text';
import { parseUtmText } from '@/shared/geo/parse-utm-text';
import type { CoordinateFormat, ParsedCoordinate } from '@/shared/geo/types';

/** Longest text accepted, characters: a coordinate fits on a line. */
export const MAX_COORDINATE_TEXT_LENGTH = 120;

const FORMATS: readonly (CoordinateFormat | 'auto')[] = ['dd', 'ddm', 'dms', 'utm', 'mgrs', 'auto'];
const FORMAT_NAMES: Readonly<Record<CoordinateFormat, string>> = {
  dd: 'decimal degrees (DD)',
  ddm: 'degrees and decimal minutes (DDM)',
  dms: 'degrees, minutes and seconds (DMS)',
  utm: 'UTM',
  mgrs: 'MGRS',
};

/**
 * Reads a WGS84 position typed by a person, in any of the usual ways:
 *
 * - DD: `61.2345, -149.8765`, `61.2345N 149.8765W`, `N61.2345 W149.8765`
 * - DDM: `61°14.07'N 149°52.59'W`, `N61 14.070 W149 52.590`
 * - DMS: `61°14'04.2"N 149°52'35.4"W`, with ′ ″ or ' " or spaces
 * - MGRS / USNG: `33U XP 05004 44998`, `33UXP0500444998` (the middle of the square named)
 * - UTM: `33N 500000 6800000`, `33V 500000E 6800000N` (zone with a
 *   hemisphere N/S or an MGRS latitude band letter)
 *
 * Latitude comes first unless the hemisphere letters say otherwise. Spaces
 * at either end, no-break spaces and the Unicode minus sign are accepted.
 * A single `S` after a UTM zone is read as latitude band S (32°N–40°N)
 * when the northing falls there, else as the southern hemisphere.
 *
 * @param text - the text as typed
 * @param format - `'auto'` (default) to recognise the format, or the one
 *   format to accept; text in another format is refused with `format-mismatch`
 *   (or `not-utm`)
 * @returns a new `{ latDeg, lonDeg, format }`: degrees (longitude as
 *   written, −180…180; from UTM, in [−180, 180)) and the format read
 * @throws {CoordinateError} with a stable `code`, the `part` at fault and a
 *   message saying what is wrong and why — e.g. `latitude-out-of-range`
 *   (beyond 90°), `minutes-out-of-range` (60 or more), `unknown-zone`
 *   (not 1–60), `band-mismatch` (northing outside the band letter's latitudes)
 *
 * Source: UTM per DMA TM 8358.1/8358.2 on WGS84, computed by proj4;
 * sexagesimal degrees by definition (common practice).
 *
 * @example
 * parseCoordinate('61°14\'04.2"N 149°52\'35.4"W'); // { latDeg: 61.2345, lonDeg: -149.8765, format: 'dms' }
 * parseCoordinate('38N 444140.54 3684706.36');     // { latDeg: 33.3000000, lonDeg: 44.3999999, format: 'utm' }
 * parseCoordinate('91, 0');                        // throws CoordinateError 'latitude-out-of-range'
 */
export function parseCoordinate(text: string, format: CoordinateFormat | 'auto' = 'auto'): ParsedCoordinate {
  if (!FORMATS.includes(format)) {
    throw new CoordinateError(
      'unknown-format',
      'options',
      `Unknown coordinate format ${String(format)}; use dd, ddm, dms, utm or auto.`,
    );
  }
  if (typeof text !== 'string') {
    throw new CoordinateError('empty', 'text', 'Enter a coordinate as text.');
  }
  const cleaned = text
    .replace(/[\u00a0\u2007\u202f]/g, ' ')
    .replace(/\u2212/g, '-')
    .trim();
  if (cleaned === '')
    throw new CoordinateError('empty', 'text', 'Enter a coordinate: a latitude and longitude, or a UTM position.');
  if (cleaned.length > MAX_COORDINATE_TEXT_LENGTH) {
    throw new CoordinateError(
      'too-long',
      'text',
      `That is too long to be a coordinate (over ${MAX_COORDINATE_TEXT_LENGTH} characters).`,
    );
  }

  if (format === 'mgrs' || (format === 'auto' && looksLikeMgrs(cleaned))) {
    const p = parseMgrs(cleaned);
    return { latDeg: p.latDeg, lonDeg: p.lonDeg, format: 'mgrs' };
  }
  if (format === 'utm' || format === 'auto') {
    const utm = parseUtmText(cleaned, format === 'utm');
    if (utm) return { latDeg: utm.latDeg, lonDeg: utm.lonDeg, format: 'utm' };
  }
  const read = parseLatLonText(cleaned);
  if (format !== 'auto' && read.format !== format) {
    throw new CoordinateError(
      'format-mismatch',
      'text',
      `Expected ${FORMAT_NAMES[format]}, but “${cleaned}” is written in ${FORMAT_NAMES[read.format]}.`,
    );
  }
  return read;
}

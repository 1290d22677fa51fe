import { checkLatLon } from '@/shared/geo/check-lat-lon';
import { CoordinateError } from '@/shared/geo/coordinate-error';
import { isBandSNorthing } from '@/shared/geo/is-band-s-northing';
import { formatMgrs } from '@/shared/geo/mgrs';
import { toUtm } from '@/shared/geo/to-utm';
import type { CoordinateFormat, LatLon } from '@/shared/geo/types';

/** Options of {@link formatCoordinate}. */
export interface FormatCoordinateOptions {
  /**
   * Digits after the decimal point of the last part, integer 0–9.
   * Defaults: DD 5 (1e-5° ≈ 1.1 m), DDM 3 (0.001′ ≈ 1.9 m), DMS 1
   * (0.1″ ≈ 3 m), UTM 0 (whole metres).
   */
  readonly decimals?: number;
  /**
   * How hemispheres are shown in DD, DDM and DMS: `'signed'` (−149.87650)
   * or `'letters'` (149.87650°W). Default: `'signed'` for DD, `'letters'`
   * for DDM and DMS.
   */
  readonly style?: 'signed' | 'letters';
  /**
   * UTM: the letter after the zone — `'band'` (default), the MGRS latitude
   * band (`33V`), or `'hemisphere'`, N or S (`33N`, `33S`). A southern
   * position whose `S` would read back as band S (about 50°S–58°S) is
   * written `33 south` so that it reads back right.
   */
  readonly utmLetter?: 'band' | 'hemisphere';
  /** UTM: write in this zone (1–60) instead of the position's own. */
  readonly zone?: number;
  /** MGRS: digits of easting and of northing, 1–5 (10 km … 1 m squares); default 5. */
  readonly mgrsDigits?: number;
}

const DEFAULT_DECIMALS: Readonly<Record<CoordinateFormat, number>> = { dd: 5, ddm: 3, dms: 1, utm: 0, mgrs: 0 };

/** `value` to `decimals` places, zero-padded to `integerDigits` before the point. */
function fixed(value: number, decimals: number, integerDigits = 1): string {
  const text = value.toFixed(decimals);
  const point = text.indexOf('.');
  const whole = point === -1 ? text.length : point;
  return whole < integerDigits ? '0'.repeat(integerDigits - whole) + text : text;
}

/**
 * Splits |value| into sexagesimal parts after rounding in the smallest unit,
 * so that 59.96″ carries into the minutes instead of showing 60.0″.
 * `parts` is 2 (degrees, minutes) or 3 (degrees, minutes, seconds).
 */
function sexagesimal(valueDeg: number, parts: 2 | 3, decimals: number): { deg: number; min: number; sec: number } {
  const scale = 10 ** decimals;
  const perDegree = (parts === 2 ? 60 : 3600) * scale;
  const total = Math.round(Math.abs(valueDeg) * perDegree);
  const deg = Math.floor(total / perDegree);
  const rest = total - deg * perDegree;
  if (parts === 2) return { deg, min: rest / scale, sec: 0 };
  const min = Math.floor(rest / (60 * scale));
  return { deg, min, sec: (rest - min * 60 * scale) / scale };
}

/** Whether `valueDeg` rounds to zero at the precision written (then it is shown without a minus sign, as N or E). */
function roundsToZero(valueDeg: number, format: 'dd' | 'ddm' | 'dms', decimals: number): boolean {
  const perDegree = format === 'dd' ? 1 : format === 'ddm' ? 60 : 3600;
  return Math.round(Math.abs(valueDeg) * perDegree * 10 ** decimals) === 0;
}

function angle(valueDeg: number, format: 'dd' | 'ddm' | 'dms', decimals: number): string {
  if (format === 'dd') return `${fixed(Math.abs(valueDeg), decimals)}°`;
  const { deg, min, sec } = sexagesimal(valueDeg, format === 'ddm' ? 2 : 3, decimals);
  if (format === 'ddm') return `${deg}°${fixed(min, decimals, 2)}'`;
  return `${deg}°${fixed(min, 0, 2)}'${fixed(sec, decimals, 2)}"`;
}

function axis(
  valueDeg: number,
  positive: string,
  negative: string,
  format: 'dd' | 'ddm' | 'dms',
  decimals: number,
  style: 'signed' | 'letters',
): string {
  const south = valueDeg < 0 && !roundsToZero(valueDeg, format, decimals);
  if (style === 'letters') return `${angle(valueDeg, format, decimals)}${south ? negative : positive}`;
  const text = format === 'dd' ? fixed(Math.abs(valueDeg), decimals) : angle(valueDeg, format, decimals);
  return `${south ? '-' : ''}${text}`;
}

/**
 * Writes a WGS84 position for people, in one of Kenning's formats:
 *
 * | format | default output |
 * | --- | --- |
 * | `dd`  | `61.23450, -149.87650` (or `61.23450°N 149.87650°W` with `style: 'letters'`) |
 * | `ddm` | `61°14.070'N 149°52.590'W` |
 * | `dms` | `61°14'04.2"N 149°52'35.4"W` |
 * | `utm` | `6V 345605 6792306` (zone, band letter, easting, northing in whole metres) |
 *
 * Values are rounded (half away from zero) at the last digit written, with
 * carries into minutes and degrees; a value that rounds to zero is written
 * without a minus sign and as N or E. Every output reads back with
 * `parseCoordinate` to within half its last digit.
 *
 * @param point - `{ latDeg, lonDeg }`, degrees (latitude −90…90, longitude −180…180); not changed
 * @param format - `'dd' | 'ddm' | 'dms' | 'utm' | 'mgrs'`
 * @param options - see {@link FormatCoordinateOptions}
 * @returns the text, ASCII apart from the degree sign
 * @throws {CoordinateError} `not-finite`, `latitude-out-of-range`,
 *   `longitude-out-of-range`, `unknown-format`, `invalid-option`, and for UTM
 *   those of {@link toUtm} (e.g. `outside-utm-area` beyond 80°S/84°N)
 *
 * Source: sexagesimal degrees by definition (common practice); UTM by
 * {@link toUtm} (proj4). Precision defaults: 1e-5° of latitude ≈ 1.1 m
 * (common practice, no source).
 *
 * @example
 * formatCoordinate({ latDeg: 61.2345, lonDeg: -149.8765 }, 'dms'); // '61°14\'04.2"N 149°52\'35.4"W'
 * formatCoordinate({ latDeg: 33.3, lonDeg: 44.4 }, 'utm');         // '38S 444141 3684706'
 */
export function formatCoordinate(point: LatLon, format: CoordinateFormat, options: FormatCoordinateOptions = {}): string {
  if (!(format in DEFAULT_DECIMALS)) {
    throw new CoordinateError(
      'unknown-format',
      'options',
      `Unknown coordinate format ${String(format)}; use dd, ddm, dms, utm or mgrs.`,
    );
  }
  const decimals = options.decimals ?? DEFAULT_DECIMALS[format];
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 9) {
    throw new CoordinateError(
      'invalid-option',
      'options',
      `decimals must be a whole number from 0 to 9, got ${String(decimals)}.`,
    );
  }
  if (options.style !== undefined && options.style !== 'signed' && options.style !== 'letters') {
    throw new CoordinateError('invalid-option', 'options', `style must be 'signed' or 'letters', got ${String(options.style)}.`);
  }
  if (options.utmLetter !== undefined && options.utmLetter !== 'band' && options.utmLetter !== 'hemisphere') {
    throw new CoordinateError(
      'invalid-option',
      'options',
      `utmLetter must be 'band' or 'hemisphere', got ${String(options.utmLetter)}.`,
    );
  }
  const { latDeg, lonDeg } = point;
  checkLatLon(latDeg, lonDeg);

  if (format === 'mgrs') return formatMgrs({ latDeg, lonDeg }, options.mgrsDigits ?? 5);

  if (format === 'utm') {
    const utm = toUtm({ latDeg, lonDeg }, options.zone);
    const easting = utm.easting.toFixed(decimals);
    const northing = utm.northing.toFixed(decimals);
    let letter = utm.band;
    if (options.utmLetter === 'hemisphere') {
      letter = utm.hemisphere;
      if (utm.hemisphere === 'S' && isBandSNorthing(utm.zone, Number(easting), Number(northing))) letter = ' south';
    }
    return `${utm.zone}${letter} ${easting} ${northing}`;
  }

  const style = options.style ?? (format === 'dd' ? 'signed' : 'letters');
  const lat = axis(latDeg, 'N', 'S', format, decimals, style);
  const lon = axis(lonDeg, 'E', 'W', format, decimals, style);
  return style === 'signed' ? `${lat}, ${lon}` : `${lat} ${lon}`;
}

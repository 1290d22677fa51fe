import { BAND_MARGIN_DEG } from '@/shared/geo/band-margin';
import { UTM_POLAR_OVERLAP_DEG } from '@/shared/geo/check-utm-area';
import { CoordinateError } from '@/shared/geo/coordinate-error';
import { fromUtm } from '@/shared/geo/from-utm';
import { isBandSNorthing } from '@/shared/geo/is-band-s-northing';
import { LATITUDE_BANDS } from '@/shared/geo/latitude-band';
import type { Hemisphere, LatLon } from '@/shared/geo/types';

// A number as written in UTM text: digits with an optional decimal part, or
// thousands grouped with commas ("6,800,000").
const NUM = String.raw`(\d{1,3}(?:,\d{3})+(?!\d)(?:\.\d+)?|\d+(?:\.\d+)?)`;
// What may follow an easting or a northing: E, N, mE, mN, or m alone.
const SUFFIX = String.raw`(m?[en]|m)?`;
const SEP = String.raw`[\s,;]+`;
const ZONE = String.raw`(?:utm\s*)?(?:zone\s*)?(\d{1,3})\s*(north|south|[a-z])?`;

const LEADING = new RegExp(String.raw`^${ZONE}${SEP}${NUM}\s*${SUFFIX}${SEP}${NUM}\s*${SUFFIX}$`, 'i');
const TRAILING = new RegExp(String.raw`^${NUM}\s*${SUFFIX}${SEP}${NUM}\s*${SUFFIX}${SEP}${ZONE}$`, 'i');

const EXPECTED = 'Write UTM as zone and letter, easting, northing — for example “33N 500000 6800000” or “33V 500000E 6800000N”.';

interface UtmParts {
  zoneText: string;
  letter: string | undefined;
  first: string;
  firstSuffix: string | undefined;
  second: string;
  secondSuffix: string | undefined;
  /** The zone was written last. */
  zoneLast: boolean;
}

function match(text: string): UtmParts | null {
  const leading = LEADING.exec(text);
  if (leading) {
    const [, zoneText = '', letter, first = '', firstSuffix, second = '', secondSuffix] = leading;
    return { zoneText, letter, first, firstSuffix, second, secondSuffix, zoneLast: false };
  }
  const trailing = TRAILING.exec(text);
  if (trailing) {
    const [, first = '', firstSuffix, second = '', secondSuffix, zoneText = '', letter] = trailing;
    return { zoneText, letter, first, firstSuffix, second, secondSuffix, zoneLast: true };
  }
  return null;
}

const metres = (written: string): number => Number(written.replace(/,/g, ''));
const axisOf = (suffix: string | undefined): 'E' | 'N' | null => {
  const last = suffix?.slice(-1).toUpperCase();
  return last === 'E' || last === 'N' ? last : null;
};

/**
 * Reads UTM text on WGS84: zone (1–60) with a latitude band letter (C–X
 * without I and O), a hemisphere letter (N/S) or word (north/south), then
 * easting and northing in metres — `33N 500000 6800000`,
 * `33V 500000E 6800000N`, `UTM 33 north 500000mE 6800000mN`, or with the
 * zone last, `500000 6800000 33N`. Commas may separate the parts or group
 * thousands. With E/N marks the two numbers may come in either order.
 *
 * Letters: `N` is the northern hemisphere (band N, 0°–8°N, is northern too).
 * `S` is band S (32°N–40°N) when the northing lands there read in the north,
 * and the southern hemisphere otherwise (see `isBandSNorthing`). Any other
 * band letter is checked against the position, within one minute of
 * latitude; grid zones 32X, 34X and 36X do not exist.
 *
 * @param text - trimmed text, any case
 * @param required - true when the caller asked for UTM: text that is not
 *   shaped like UTM then throws `not-utm` instead of returning null
 * @returns the position, or null when the text is not UTM-shaped (and not
 *   required); a text is taken as UTM when both numbers are 1000 m or more,
 *   or when it starts with a zone and letter
 * @throws {CoordinateError} `not-utm`, `unknown-zone`, `missing-zone-letter`,
 *   `unknown-zone-letter`, `polar-zone`, `unused-zone`, `band-mismatch`, and
 *   those of {@link fromUtm}
 *
 * Source: zone and band layout per DMA TM 8358.1, chapter 3; written forms
 * as in GeographicLib's GeoConvert usage text ("38N 444140.54 3684706.36",
 * "444140.54 3684706.36 38N").
 *
 * @example
 * parseUtmText('38N 444140.54 3684706.36', false); // { latDeg: 33.3000000, lonDeg: 44.3999999 }
 * parseUtmText('61.2345 -149.8765', false);        // null
 */
export function parseUtmText(text: string, required: boolean): LatLon | null {
  const parts = match(text);
  if (!parts) {
    if (required) throw new CoordinateError('not-utm', 'text', `“${text}” is not UTM. ${EXPECTED}`);
    return null;
  }
  let easting = metres(parts.first);
  let northing = metres(parts.second);
  const firstAxis = axisOf(parts.firstSuffix);
  const secondAxis = axisOf(parts.secondSuffix);
  const large = easting >= 1000 && northing >= 1000;
  if (!required && !large && (parts.zoneLast || !parts.letter)) return null;

  if (firstAxis !== null && firstAxis === secondAxis) {
    const what = firstAxis === 'E' ? 'eastings (E)' : 'northings (N)';
    throw new CoordinateError(
      'not-utm',
      'text',
      `Both numbers in “${text}” are marked as ${what}; give one easting and one northing.`,
    );
  }
  if (firstAxis === 'N' || secondAxis === 'E') [easting, northing] = [northing, easting];

  const zone = Number(parts.zoneText);
  if (!(zone >= 1 && zone <= 60)) {
    throw new CoordinateError('unknown-zone', 'zone', `UTM zones run from 1 to 60; “${parts.zoneText}” is not one.`);
  }
  if (!parts.letter) {
    throw new CoordinateError(
      'missing-zone-letter',
      'zone',
      `“${text}” has no hemisphere: write the zone with N or S (${zone}N) or with its latitude band letter (such as ${zone}V).`,
    );
  }

  const letter = parts.letter.toUpperCase();
  let hemisphere: Hemisphere;
  let band: string | null = null;
  if (letter === 'NORTH' || letter === 'N') {
    hemisphere = 'N';
  } else if (letter === 'SOUTH') {
    hemisphere = 'S';
  } else if (letter === 'S') {
    band = isBandSNorthing(zone, easting, northing) ? 'S' : null;
    hemisphere = band ? 'N' : 'S';
  } else if (letter === 'A' || letter === 'B' || letter === 'Y' || letter === 'Z') {
    throw new CoordinateError(
      'polar-zone',
      'zone',
      `${letter} is a polar (UPS) zone letter; Kenning reads UTM only (80°S to 84°N). Give the position in latitude and longitude.`,
    );
  } else if (letter === 'I' || letter === 'O') {
    throw new CoordinateError(
      'unknown-zone-letter',
      'zone',
      `There is no latitude band ${letter}: the letters I and O are skipped so they are not taken for 1 and 0.`,
    );
  } else if (letter.length === 1 && LATITUDE_BANDS.includes(letter)) {
    band = letter;
    hemisphere = LATITUDE_BANDS.indexOf(letter) < LATITUDE_BANDS.indexOf('N') ? 'S' : 'N';
  } else {
    throw new CoordinateError(
      'unknown-zone-letter',
      'zone',
      `“${parts.letter}” after the zone is neither a hemisphere (N, S, north, south) nor a latitude band letter (C to X).`,
    );
  }

  if (band === 'X' && (zone === 32 || zone === 34 || zone === 36)) {
    throw new CoordinateError(
      'unused-zone',
      'zone',
      `Grid zone ${zone}X is not used: around Svalbard, zones 31X, 33X, 35X and 37X are widened to cover it. Check the zone number.`,
    );
  }

  const position = fromUtm({ zone, hemisphere, easting, northing });

  if (band !== null) {
    const index = LATITUDE_BANDS.indexOf(band);
    const south = -80 + 8 * index;
    const north = band === 'X' ? 84 : south + 8;
    // Bands C and X reach into the grid's polar overlap.
    const southLimit = band === 'C' ? south - UTM_POLAR_OVERLAP_DEG : south - BAND_MARGIN_DEG;
    const northLimit = band === 'X' ? north + UTM_POLAR_OVERLAP_DEG : north + BAND_MARGIN_DEG;
    if (position.latDeg < southLimit || position.latDeg > northLimit) {
      const at = position.latDeg < 0 ? `${(-position.latDeg).toFixed(2)}°S` : `${position.latDeg.toFixed(2)}°N`;
      const range = (v: number) => (v < 0 ? `${-v}°S` : v === 0 ? '0°' : `${v}°N`);
      throw new CoordinateError(
        'band-mismatch',
        'northing',
        `Band ${band} covers ${range(south)} to ${range(north)}, but northing ${northing} m in zone ${zone} is at ${at}. ` +
          `Check the northing or the band letter.`,
      );
    }
  }
  return position;
}

// Over 300 lines: one grammar for typed coordinates (DD, DDM, DMS, hemisphere letters); its cases share one tokenizer.
import { CoordinateError } from '@/shared/geo/coordinate-error';
import type { CoordinateFormat } from '@/shared/geo/types';

type Unit = 'deg' | 'min' | 'sec';
type Letter = 'N' | 'S' | 'E' | 'W';

interface NumberToken {
  readonly kind: 'number';
  readonly text: string;
  readonly value: number;
  readonly sign: 1 | -1 | null;
  readonly hasFraction: boolean;
  readonly start: number;
  readonly end: number;
}
interface MarkToken {
  readonly kind: 'mark';
  readonly unit: Unit;
  readonly start: number;
  readonly end: number;
}
interface LetterToken {
  readonly kind: 'letter';
  readonly letter: Letter;
  readonly start: number;
  readonly end: number;
}
interface SeparatorToken {
  readonly kind: 'separator';
  readonly start: number;
  readonly end: number;
}
type Token = NumberToken | MarkToken | LetterToken | SeparatorToken;

/** A latitude or longitude read from text, before it is known which. */
interface Half {
  readonly text: string;
  readonly letter: Letter | null;
  readonly valueDeg: number;
  readonly format: Exclude<CoordinateFormat, 'utm' | 'mgrs'>;
}

/** Latitude, longitude and the format they were written in. */
export interface LatLonText {
  readonly latDeg: number;
  readonly lonDeg: number;
  readonly format: Exclude<CoordinateFormat, 'utm' | 'mgrs'>;
}

const DEGREE_MARKS = '°º˚';
const MINUTE_MARKS = "'′’‘´";
const SECOND_MARKS = '"″”“';
const WORDS: Readonly<Record<string, Letter | 'deg'>> = {
  N: 'N',
  NORTH: 'N',
  S: 'S',
  SOUTH: 'S',
  E: 'E',
  EAST: 'E',
  W: 'W',
  WEST: 'W',
  D: 'deg',
  DEG: 'deg',
};
const FORMAT_NAMES: Readonly<Record<Half['format'], string>> = {
  dd: 'decimal degrees (DD)',
  ddm: 'degrees and decimal minutes (DDM)',
  dms: 'degrees, minutes and seconds (DMS)',
};
const UNIT_NAMES: Readonly<Record<Unit, string>> = { deg: 'degrees', min: 'minutes', sec: 'seconds' };
const UNIT_ORDER: readonly Unit[] = ['deg', 'min', 'sec'];

const fail = (code: ConstructorParameters<typeof CoordinateError>[0], part: 'text' | 'latitude' | 'longitude', message: string) =>
  new CoordinateError(code, part, message);

function tokenize(text: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    const ch = text.charAt(i);
    if (/\s/.test(ch) || ch === '/') {
      i += 1;
    } else if (ch === ',' || ch === ';') {
      tokens.push({ kind: 'separator', start: i, end: i + 1 });
      i += 1;
    } else if (/[\d.+\-−]/.test(ch)) {
      const start = i;
      let sign: 1 | -1 | null = null;
      if (ch === '+' || ch === '-' || ch === '−') {
        sign = ch === '+' ? 1 : -1;
        i += 1;
        if (!/[\d.]/.test(text.charAt(i))) {
          throw fail('unexpected-character', 'text', `“${ch}” at position ${start + 1} is not followed by a number.`);
        }
      }
      const digitsStart = i;
      while (i < text.length && /[\d.]/.test(text.charAt(i))) i += 1;
      const digits = text.slice(digitsStart, i);
      if (!/^(\d+\.?\d*|\.\d+)$/.test(digits)) {
        throw fail('bad-number', 'text', `“${text.slice(start, i)}” is not a number.`);
      }
      tokens.push({
        kind: 'number',
        text: text.slice(start, i),
        value: Number(digits),
        sign,
        hasFraction: /\.\d/.test(digits),
        start,
        end: i,
      });
    } else if (DEGREE_MARKS.includes(ch)) {
      tokens.push({ kind: 'mark', unit: 'deg', start: i, end: i + 1 });
      i += 1;
    } else if (MINUTE_MARKS.includes(ch)) {
      // Two minute marks in a row ('' or ′′) stand for a second mark.
      const next = text.charAt(i + 1);
      const double = next !== '' && MINUTE_MARKS.includes(next);
      tokens.push({ kind: 'mark', unit: double ? 'sec' : 'min', start: i, end: i + (double ? 2 : 1) });
      i += double ? 2 : 1;
    } else if (SECOND_MARKS.includes(ch)) {
      tokens.push({ kind: 'mark', unit: 'sec', start: i, end: i + 1 });
      i += 1;
    } else if (/[a-z]/i.test(ch)) {
      const start = i;
      while (i < text.length && /[a-z]/i.test(text.charAt(i))) i += 1;
      const word = text.slice(start, i);
      const meaning = WORDS[word.toUpperCase()];
      if (meaning === undefined) {
        throw fail(
          'unexpected-character',
          'text',
          `“${word}” is not part of a latitude and longitude: mark hemispheres with N, S, E or W.`,
        );
      }
      tokens.push(
        meaning === 'deg' ? { kind: 'mark', unit: 'deg', start, end: i } : { kind: 'letter', letter: meaning, start, end: i },
      );
    } else {
      throw fail('unexpected-character', 'text', `“${ch}” (character ${i + 1}) is not part of a coordinate.`);
    }
  }
  return tokens;
}

const isNumber = (t: Token | undefined): t is NumberToken => t?.kind === 'number';
const isLetter = (t: Token | undefined): t is LetterToken => t?.kind === 'letter';

/** Splits the tokens into the two halves (latitude and longitude, in either order). */
function split(tokens: readonly Token[], text: string): [Token[], Token[]] {
  const cannotSplit = (why: string) =>
    fail(
      'cannot-split',
      'text',
      `Can't tell where the latitude ends and the longitude begins in “${text}” (${why}). ` +
        'Put a comma between them, or mark the hemispheres (N or S, E or W).',
    );

  const separators = tokens.filter((t) => t.kind === 'separator');
  if (separators.length > 1) {
    throw fail(
      'too-many-separators',
      'text',
      `“${text}” has ${separators.length} commas or semicolons. Use one, between latitude and longitude, and a point for decimals (61.2345).`,
    );
  }
  if (separators.length === 1) {
    const at = tokens.findIndex((t) => t.kind === 'separator');
    return [tokens.slice(0, at), tokens.slice(at + 1)];
  }

  const letters = tokens.filter(isLetter);
  if (letters.length > 2) {
    throw fail(
      'hemisphere-conflict',
      'text',
      `“${text}” has ${letters.length} hemisphere letters; give one for the latitude and one for the longitude.`,
    );
  }
  if (letters.length === 2) {
    const second = tokens.indexOf(letters[1] as Token);
    const first = tokens.indexOf(letters[0] as Token);
    const prefix = isLetter(tokens[0]);
    const suffix = isLetter(tokens[tokens.length - 1]);
    if (prefix && !suffix) return [tokens.slice(0, second), tokens.slice(second)];
    if (suffix && !prefix) return [tokens.slice(0, first + 1), tokens.slice(first + 1)];
    throw fail(
      'hemisphere-placement',
      'text',
      `In “${text}” put the hemisphere letters either all before the numbers (N61 W149) or all after them (61N 149W).`,
    );
  }

  // No separator and at most one letter: split the numbers.
  const numbers = tokens.filter(isNumber);
  const degreeMarked = tokens.flatMap((t, i) =>
    t.kind === 'mark' && t.unit === 'deg' && isNumber(tokens[i - 1]) ? [i - 1] : [],
  );
  let at: number;
  if (degreeMarked.length === 2) {
    at = degreeMarked[1] as number;
  } else if (numbers.length >= 2 && numbers.length % 2 === 0 && numbers.length <= 6) {
    at = tokens.indexOf(numbers[numbers.length / 2] as Token);
  } else if (numbers.length < 2) {
    throw fail('missing-number', 'text', `“${text}” needs both a latitude and a longitude.`);
  } else {
    throw cannotSplit(`${numbers.length} numbers`);
  }
  // A lone letter just before the split point belongs to whichever side it touches.
  const before = tokens[at - 1];
  if (isLetter(before) && letters.length === 1) {
    const touchesLeft = at - 2 >= 0 && (tokens[at - 2] as Token).end === before.start;
    const touchesRight = (tokens[at] as Token).start === before.end;
    if (touchesLeft === touchesRight) throw cannotSplit(`the letter ${before.letter} could belong to either`);
    if (touchesRight) at -= 1;
  }
  return [tokens.slice(0, at), tokens.slice(at)];
}

function readHalf(tokens: readonly Token[], text: string): Half {
  const where = `“${text}”`;
  const first = tokens[0];
  const last = tokens[tokens.length - 1];
  let core = tokens;
  let letter: Letter | null = null;
  if (isLetter(first)) {
    letter = first.letter;
    core = core.slice(1);
  } else if (isLetter(last)) {
    letter = last.letter;
    core = core.slice(0, -1);
  }
  if (core.some(isLetter)) {
    throw fail(
      'hemisphere-placement',
      'text',
      `In ${where} the hemisphere letter must come before or after the numbers, not between them.`,
    );
  }
  if (!core.some(isNumber)) throw fail('missing-number', 'text', `${where} has no number.`);

  const parts: { token: NumberToken; unit: Unit | null }[] = [];
  core.forEach((token, i) => {
    if (token.kind === 'number') {
      parts.push({ token, unit: null });
    } else if (token.kind === 'mark') {
      const previous = parts[parts.length - 1];
      if (!previous || !isNumber(core[i - 1])) {
        throw fail('mark-order', 'text', `In ${where} a ${UNIT_NAMES[token.unit]} mark must follow a number.`);
      }
      previous.unit = token.unit;
    }
  });
  if (parts.length > 3) {
    throw fail(
      'too-many-parts',
      'text',
      `${where} has ${parts.length} numbers; a latitude or longitude has at most three (degrees, minutes, seconds).`,
    );
  }
  parts.forEach((part, i) => {
    const expected = UNIT_ORDER[i] as Unit;
    if (part.unit !== null && part.unit !== expected) {
      throw fail(
        'mark-order',
        'text',
        i === 0
          ? `${where} begins with ${UNIT_NAMES[part.unit]}; give the degrees first.`
          : `In ${where} the ${UNIT_NAMES[part.unit]} mark is where the ${UNIT_NAMES[expected]} belong.`,
      );
    }
    if (i > 0 && part.token.sign !== null) {
      throw fail('misplaced-sign', 'text', `In ${where} only the degrees may carry a sign, not the ${UNIT_NAMES[expected]}.`);
    }
    if (i < parts.length - 1 && part.token.hasFraction) {
      throw fail(
        'fraction-not-last',
        'text',
        `In ${where} the ${UNIT_NAMES[expected]} (${part.token.text}) have a decimal part but are followed by ${UNIT_NAMES[UNIT_ORDER[i + 1] as Unit]}; only the last part may have decimals.`,
      );
    }
  });

  const [deg, min, sec] = parts.map((p) => p.token);
  if (min && min.value >= 60) {
    throw fail('minutes-out-of-range', 'text', `In ${where} the minutes are ${min.text}: minutes run from 0 to under 60.`);
  }
  if (sec && sec.value >= 60) {
    throw fail('seconds-out-of-range', 'text', `In ${where} the seconds are ${sec.text}: seconds run from 0 to under 60.`);
  }
  const head = deg as NumberToken;
  if (head.sign === -1 && letter !== null) {
    throw fail(
      'sign-and-hemisphere',
      'text',
      `${where} has both a minus sign and the letter ${letter}; use one or the other (−61.5 or 61.5S).`,
    );
  }
  const magnitude = head.value + (min?.value ?? 0) / 60 + (sec?.value ?? 0) / 3600;
  const negative = head.sign === -1 || letter === 'S' || letter === 'W';
  const format = parts.length === 1 ? 'dd' : parts.length === 2 ? 'ddm' : 'dms';
  return { text, letter, valueDeg: negative ? -magnitude : magnitude, format };
}

const isLatitudeLetter = (letter: Letter | null) => letter === 'N' || letter === 'S';
const isLongitudeLetter = (letter: Letter | null) => letter === 'E' || letter === 'W';

/**
 * Reads a latitude and longitude written in decimal degrees (DD), degrees and
 * decimal minutes (DDM) or degrees, minutes and seconds (DMS):
 * `61.2345, -149.8765`, `61.2345N 149.8765W`, `N61 14.070 W149 52.590`,
 * `61°14'04.2"N 149°52'35.4"W`, `61 14 04.2 N, 149 52 35.4 W`…
 *
 * - Marks: ° (also º, ˚, d, deg), ′ or ' (also ’ ‘ ´) for minutes, ″ or "
 *   (also ” “ and two minute marks) for seconds; all optional.
 * - Hemispheres: N/S/E/W (or north, south, east, west) before or after the
 *   numbers, or a sign on the degrees (not both). With letters, the two may
 *   come in either order; without, latitude comes first.
 * - Latitude and longitude are told apart by a comma or semicolon, by the
 *   hemisphere letters, by the ° marks, or else by splitting the numbers in
 *   two equal groups.
 * - Only the last part of each may have decimals; minutes and seconds must
 *   be under 60; both must use the same format.
 *
 * @param text - the text, trimmed, at most a line long
 * @returns `{ latDeg, lonDeg, format }`, degrees
 * @throws {CoordinateError} with a code naming what is wrong and a message
 *   quoting the part that is (see `CoordinateErrorCode`)
 *
 * Source: the sexagesimal definition of minutes (1/60°) and seconds
 * (1/3600°) of arc (common practice); the written forms are those in common
 * use, e.g. GeographicLib's GeoConvert usage text ("33.3 44.4",
 * "E44.4 N33.3", "33d18'N 44d24'E", "44d24 33d18N" all the same point).
 *
 * @example
 * parseLatLonText('61°14.07\'N 149°52.59\'W'); // { latDeg: 61.2345, lonDeg: -149.8765, format: 'ddm' }
 */
export function parseLatLonText(text: string): LatLonText {
  const tokens = tokenize(text);
  if (tokens.length === 0) throw fail('empty', 'text', 'Enter a latitude and a longitude.');
  const [left, right] = split(tokens, text);
  const slice = (part: readonly Token[]) =>
    part.length === 0 ? '' : text.slice((part[0] as Token).start, (part[part.length - 1] as Token).end).trim();
  if (left.length === 0 || right.length === 0) {
    throw fail('missing-number', 'text', `“${text}” needs both a latitude and a longitude.`);
  }
  const a = readHalf(left, slice(left));
  const b = readHalf(right, slice(right));

  if (
    (isLatitudeLetter(a.letter) && isLatitudeLetter(b.letter)) ||
    (isLongitudeLetter(a.letter) && isLongitudeLetter(b.letter))
  ) {
    const kind = isLatitudeLetter(a.letter) ? 'latitudes (N/S)' : 'longitudes (E/W)';
    throw fail(
      'hemisphere-conflict',
      'text',
      `Both “${a.text}” and “${b.text}” are marked as ${kind}; give one latitude (N/S) and one longitude (E/W).`,
    );
  }
  const swapped = isLongitudeLetter(a.letter) || isLatitudeLetter(b.letter);
  const [lat, lon] = swapped ? [b, a] : [a, b];

  if (lat.format !== lon.format) {
    throw fail(
      'mixed-formats',
      'text',
      `The latitude “${lat.text}” is in ${FORMAT_NAMES[lat.format]} but the longitude “${lon.text}” is in ${FORMAT_NAMES[lon.format]}; ` +
        'write both the same way (a number may be missing).',
    );
  }
  const lettered = a.letter !== null || b.letter !== null;
  if (Math.abs(lat.valueDeg) > 90) {
    const hint =
      !lettered && Math.abs(lon.valueDeg) <= 90 ? ' Did you put the longitude first? Without N/S/E/W, latitude comes first.' : '';
    throw fail(
      'latitude-out-of-range',
      'latitude',
      `Latitude “${lat.text}” is ${+Math.abs(lat.valueDeg).toFixed(6)}°, beyond 90°: latitudes run from 90°S to 90°N.${hint}`,
    );
  }
  if (Math.abs(lon.valueDeg) > 180) {
    throw fail(
      'longitude-out-of-range',
      'longitude',
      `Longitude “${lon.text}” is ${+Math.abs(lon.valueDeg).toFixed(6)}°, beyond 180°: longitudes run from 180°W to 180°E.`,
    );
  }
  return { latDeg: lat.valueDeg, lonDeg: lon.valueDeg, format: lat.format };
}

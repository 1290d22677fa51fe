import { convertLength, type LengthUnit } from '@/shared/units/length';
import { LENGTH_UNIT_WORDS } from '@/shared/units/unit-systems';

/**
 * Significant digits of a typed number, leading zeros and an integer's
 * trailing zeros left out ("300" → 1, "0.050" → 2).
 */
export function significantDigits(text: string): number {
  const t = text.trim().replace(/^[-+]/, '').replace(/e.*$/i, '');
  const digits = t.replace('.', '').replace(/^0+/, '');
  const kept = t.includes('.') ? digits : digits.replace(/0+$/, '');
  return Math.max(kept.length, 1);
}

/**
 * A converted length as text, as precise as what was typed but never below
 * three significant digits: 300 m → "984" ft, 1.75 m → "5.74" ft, 1234.5 m →
 * "4050.2" ft (never "984.252").
 *
 * @example
 * convertedText(convertLength(300, 'm', 'ft'), '300'); // "984"
 */
export function convertedText(value: number, typed: string): string {
  return String(Number(value.toPrecision(Math.min(15, Math.max(3, significantDigits(typed))))));
}

/** A typed number: '' → undefined, '12,5' → 12.5, anything else that is not a number → null. */
export function readNumber(text: string): number | undefined | null {
  const t = text.trim().replace(',', '.');
  if (t === '') return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/**
 * What a person typed in one unit, re-typed in another (a unit switch): the
 * same length, rounded as {@link convertedText}; text that is not a number is
 * left as it is.
 */
export function retypeLength(text: string, from: LengthUnit, to: LengthUnit): string {
  const n = readNumber(text);
  if (n == null || from === to) return text;
  return convertedText(convertLength(n, from, to), text);
}

/**
 * A stored length in metres as text in `unit` for a form: exact in metres
 * ("1.6"), rounded like {@link convertedText} elsewhere (1.6 m → "5.25" ft).
 */
export function lengthText(metres: number | null | undefined, unit: LengthUnit): string {
  if (metres == null) return '';
  if (unit === 'm') return String(metres);
  return convertedText(convertLength(metres, 'm', unit), String(metres));
}

/**
 * Typed text in `unit` to metres for a request: '' → null, a number → metres,
 * anything else unchanged (so the schema says why it is not a number).
 */
export function typedToMetres(text: unknown, unit: LengthUnit): unknown {
  if (text === null || text === undefined) return null;
  if (typeof text !== 'string') return text;
  const n = readNumber(text);
  if (n === undefined) return null;
  if (n === null) return text;
  return convertLength(n, unit, 'm');
}

const NUMBER = String.raw`[-−]?\d{1,3}(?:[ \u00a0\u202f,]\d{3})+(?:\.\d+)?|[-−]?\d+(?:\.\d+)?`;
const LENGTH_IN_TEXT = new RegExp(`(${NUMBER})\\s?(km|m)\\b`, 'g');

/**
 * A message about a length (written in metres or kilometres, as the shared
 * schemas and the server write them) restated in the unit the person typed
 * in: "At most 9 000 m." → "At most 29500 ft."; "must be a number of metres"
 * → "must be a number of feet". Figures are rounded to three significant
 * digits or the digits written, whichever is more.
 */
export function restateLengths(message: string, unit: LengthUnit): string {
  if (unit === 'm' || unit === 'km') {
    // Metric readers get the message as written.
    return message;
  }
  return message
    .replace(LENGTH_IN_TEXT, (_, figure: string, from: 'm' | 'km') => {
      const plain = figure.replace(/[ \u00a0\u202f,]/g, '').replace('−', '-');
      const value = convertLength(Number(plain), from, unit);
      return `${convertedText(value, plain)} ${unit}`;
    })
    .replace(/\b(?:kilo)?metres\b/g, LENGTH_UNIT_WORDS[unit]);
}

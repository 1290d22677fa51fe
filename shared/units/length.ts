import { UnitError } from '@/shared/units/unit-error';

/** Length units accepted at Kenning's edges. */
export type LengthUnit = 'm' | 'km' | 'ft' | 'yd' | 'mi' | 'nmi';

/**
 * Metres in one of each unit. All are exact by definition: the international
 * foot, yard and statute mile (1959 international yard and pound agreement:
 * 1 yd = 0.9144 m), and the international nautical mile (1852 m, adopted by
 * the International Hydrographic Conference, 1929).
 */
export const METRES_PER_LENGTH_UNIT: Readonly<Record<LengthUnit, number>> = Object.freeze({
  m: 1,
  km: 1000,
  ft: 0.3048,
  yd: 0.9144,
  mi: 1609.344,
  nmi: 1852,
});

/**
 * Converts a length between units. Kenning works in metres inside; call this
 * only where a value enters from, or leaves for, a person.
 *
 * @param value - the length in `from` units (any finite number; negative
 *   values are converted as they are, e.g. for differences)
 * @param from - the unit of `value`
 * @param to - the unit wanted (default `'m'`)
 * @returns the length in `to` units
 * @throws {UnitError} `not-finite` for NaN/±Infinity, `unknown-unit` for a
 *   unit name outside {@link LengthUnit}
 *
 * Source: exact definitions listed in {@link METRES_PER_LENGTH_UNIT}.
 *
 * @example
 * convertLength(100, 'ft');          // 30.48 (metres)
 * convertLength(18520, 'm', 'nmi');  // 10
 */
export function convertLength(value: number, from: LengthUnit, to: LengthUnit = 'm'): number {
  if (!Number.isFinite(value)) {
    throw new UnitError('not-finite', `length must be a finite number, got ${String(value)}`);
  }
  const fromMetres = METRES_PER_LENGTH_UNIT[from];
  const toMetres = METRES_PER_LENGTH_UNIT[to];
  if (fromMetres === undefined || toMetres === undefined) {
    throw new UnitError('unknown-unit', `unknown length unit: ${String(fromMetres === undefined ? from : to)}`);
  }
  if (from === to) return value;
  return (value * fromMetres) / toMetres;
}

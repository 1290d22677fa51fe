import { UnitError } from '@/shared/units/unit-error';

/**
 * Angle units accepted at Kenning's edges: radians, degrees, minutes of arc,
 * and NATO mils (6400 to the full circle).
 */
export type AngleUnit = 'rad' | 'deg' | 'arcmin' | 'mil';

/**
 * Units of each kind in a full circle. The NATO mil divides the circle into
 * 6400 (NATO practice); other armies use 6000 or
 * 6300 and are not supported here.
 */
export const ANGLE_UNITS_PER_TURN: Readonly<Record<AngleUnit, number>> = Object.freeze({
  rad: 2 * Math.PI,
  deg: 360,
  arcmin: 360 * 60,
  mil: 6400,
});

/**
 * Converts an angle between units. Kenning works in radians inside; convert
 * only at the edges.
 *
 * @param value - the angle in `from` units (any finite number)
 * @param from - the unit of `value`
 * @param to - the unit wanted (default `'rad'`)
 * @returns the angle in `to` units (no wrapping to a turn)
 * @throws {UnitError} `not-finite` for NaN/±Infinity, `unknown-unit` for a
 *   unit name outside {@link AngleUnit}
 *
 * Source: definitions of the degree and minute of arc (1/360 and 1/21 600 of
 * a turn) and the NATO mil (1/6400 of a turn).
 *
 * @example
 * convertAngle(1, 'arcmin', 'deg'); // 0.016666…
 * convertAngle(90, 'deg', 'mil');   // 1600
 */
export function convertAngle(value: number, from: AngleUnit, to: AngleUnit = 'rad'): number {
  if (!Number.isFinite(value)) {
    throw new UnitError('not-finite', `angle must be a finite number, got ${String(value)}`);
  }
  const fromPerTurn = ANGLE_UNITS_PER_TURN[from];
  const toPerTurn = ANGLE_UNITS_PER_TURN[to];
  if (fromPerTurn === undefined || toPerTurn === undefined) {
    throw new UnitError('unknown-unit', `unknown angle unit: ${String(fromPerTurn === undefined ? from : to)}`);
  }
  if (from === to) return value;
  return (value * toPerTurn) / fromPerTurn;
}

import { UnitError } from '@/shared/units/unit-error';
import type { UnitSystem } from '@/shared/units/unit-systems';

/** Speed units accepted at Kenning's edges (a patrol's speed). */
export type SpeedUnit = 'm/s' | 'km/h' | 'kn' | 'mph';

/**
 * Metres per second in one of each unit, exact by definition: the knot is one
 * international nautical mile (1852 m) an hour, the mile an hour one statute
 * mile (1609.344 m) an hour.
 */
export const MPS_PER_SPEED_UNIT: Readonly<Record<SpeedUnit, number>> = Object.freeze({
  'm/s': 1,
  'km/h': 1000 / 3600,
  kn: 1852 / 3600,
  mph: 1609.344 / 3600,
});

/** The speed unit of each unit system: km/h, knots, miles an hour. */
export const SPEED_UNIT_OF_SYSTEM: Readonly<Record<UnitSystem, SpeedUnit>> = Object.freeze({
  metric: 'km/h',
  nautical: 'kn',
  imperial: 'mph',
});

/**
 * Converts a speed between units (SI inside; convert only at the edges).
 *
 * Source: exact definitions in {@link MPS_PER_SPEED_UNIT}.
 *
 * @param value - the speed in `from` units
 * @param from - its unit
 * @param to - the unit wanted (default m/s)
 * @throws {UnitError} `not-finite`, `unknown-unit`
 * @example
 * convertSpeed(10, 'kn'); // 5.1444… m/s
 */
export function convertSpeed(value: number, from: SpeedUnit, to: SpeedUnit = 'm/s'): number {
  if (!Number.isFinite(value)) throw new UnitError('not-finite', `speed must be a finite number, got ${String(value)}`);
  const a = MPS_PER_SPEED_UNIT[from];
  const b = MPS_PER_SPEED_UNIT[to];
  if (a === undefined || b === undefined)
    throw new UnitError('unknown-unit', `unknown speed unit: ${a === undefined ? from : to}`);
  return from === to ? value : (value * a) / b;
}

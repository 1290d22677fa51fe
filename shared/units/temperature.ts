import { UnitError } from '@/shared/units/unit-error';

/** Temperature scales accepted at Kenning's edges. */
export type TemperatureUnit = 'K' | 'C' | 'F';

/** 0 °C in kelvin (exact, by definition of the Celsius scale). */
export const KELVIN_AT_ZERO_CELSIUS = 273.15;

function toKelvin(value: number, unit: TemperatureUnit): number {
  switch (unit) {
    case 'K':
      return value;
    case 'C':
      return value + KELVIN_AT_ZERO_CELSIUS;
    case 'F':
      return ((value - 32) * 5) / 9 + KELVIN_AT_ZERO_CELSIUS;
    default:
      throw new UnitError('unknown-unit', `unknown temperature unit: ${String(unit)}`);
  }
}

function fromKelvin(kelvin: number, unit: TemperatureUnit): number {
  switch (unit) {
    case 'K':
      return kelvin;
    case 'C':
      return kelvin - KELVIN_AT_ZERO_CELSIUS;
    case 'F':
      return ((kelvin - KELVIN_AT_ZERO_CELSIUS) * 9) / 5 + 32;
    default:
      throw new UnitError('unknown-unit', `unknown temperature unit: ${String(unit)}`);
  }
}

/**
 * Converts an absolute temperature between kelvin, degrees Celsius and
 * degrees Fahrenheit. (Temperature *differences* and gradients convert by
 * scale factor only — do not pass them here.)
 *
 * @param value - the temperature in `from` units
 * @param from - the scale of `value`
 * @param to - the scale wanted (default `'K'`)
 * @returns the temperature in `to` units
 * @throws {UnitError} `not-finite`, `unknown-unit`, or `below-absolute-zero`
 *
 * Source: SI Brochure (BIPM, 9th ed., 2019): T/K = t/°C + 273.15; the
 * Fahrenheit scale t/°F = 1.8 · t/°C + 32.
 *
 * @example
 * convertTemperature(15, 'C');       // 288.15
 * convertTemperature(300, 'K', 'F'); // 80.33
 */
export function convertTemperature(value: number, from: TemperatureUnit, to: TemperatureUnit = 'K'): number {
  if (!Number.isFinite(value)) {
    throw new UnitError('not-finite', `temperature must be a finite number, got ${String(value)}`);
  }
  const kelvin = toKelvin(value, from);
  if (kelvin < 0) {
    throw new UnitError('below-absolute-zero', `temperature ${value} ${from} is below absolute zero`);
  }
  return fromKelvin(kelvin, to);
}

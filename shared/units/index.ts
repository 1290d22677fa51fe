/** Unit conversions for Kenning's edges (the core works in metres, radians and kelvin). */
export { UnitError } from '@/shared/units/unit-error';
export { convertLength, METRES_PER_LENGTH_UNIT, type LengthUnit } from '@/shared/units/length';
export { convertAngle, ANGLE_UNITS_PER_TURN, type AngleUnit } from '@/shared/units/angle';
export { convertTemperature, KELVIN_AT_ZERO_CELSIUS, type TemperatureUnit } from '@/shared/units/temperature';
export {
  UNIT_SYSTEM_IDS,
  UNIT_SYSTEMS,
  LENGTH_UNIT_WORDS,
  lengthUnitOf,
  unitSystemFor,
  unitSystemOr,
  type LengthKind,
  type UnitSystem,
} from '@/shared/units/unit-systems';
export {
  convertedText,
  lengthText,
  readNumber,
  restateLengths,
  retypeLength,
  significantDigits,
  typedToMetres,
} from '@/shared/units/typed-lengths';

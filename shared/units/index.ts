/** Unit conversions for Kenning's edges (the core works in metres, radians and kelvin). */
export { UnitError } from '@/shared/units/unit-error';
export { convertLength, METRES_PER_LENGTH_UNIT, type LengthUnit } from '@/shared/units/length';
export { convertAngle, ANGLE_UNITS_PER_TURN, type AngleUnit } from '@/shared/units/angle';
export { convertTemperature, KELVIN_AT_ZERO_CELSIUS, type TemperatureUnit } from '@/shared/units/temperature';

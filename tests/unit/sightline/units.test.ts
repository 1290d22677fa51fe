import {
  ANGLE_UNITS_PER_TURN,
  convertAngle,
  convertLength,
  convertTemperature,
  METRES_PER_LENGTH_UNIT,
  UnitError,
  type AngleUnit,
  type LengthUnit,
  type TemperatureUnit,
} from '@/shared/units';
import { expectRelative, expectWithin } from '@/tests/unit/sightline/tolerance';

describe('length', () => {
  it.each([
    [1, 'ft', 0.3048],
    [1, 'yd', 0.9144],
    [1, 'mi', 1609.344],
    [1, 'nmi', 1852],
    [1, 'km', 1000],
  ] as const)('%p %s in metres', (value, unit, metres) => {
    // Source: international yard and pound (1959: 1 yd = 0.9144 m exactly, 1 ft = 1/3 yd, 1 mi = 1760 yd); international nautical mile 1852 m (1929); from memory. Tolerance 1e-12 relative.
    expectRelative(convertLength(value, unit), metres, 1e-12);
  });

  it('round-trips every pair of units', () => {
    const units = Object.keys(METRES_PER_LENGTH_UNIT) as LengthUnit[];
    for (const from of units) {
      for (const to of units) {
        for (const value of [0, 1e-3, 2.5, 12_345.678, -40]) {
          // Source: none — round trip. Tolerance 1e-12 relative (1e-15 absolute at 0).
          expectWithin(convertLength(convertLength(value, from, to), to, from), value, Math.max(1e-15, Math.abs(value) * 1e-12));
        }
      }
    }
  });

  it('rejects non-finite values and unknown units', () => {
    // Source: none — input contract.
    expect(() => convertLength(Number.NaN, 'm')).toThrow(UnitError);
    expect(() => convertLength(1, 'furlong' as LengthUnit)).toThrow(UnitError);
  });
});

describe('angle', () => {
  it('degrees, arcminutes, NATO mils and radians', () => {
    // Source: NATO mil = 1/6400 turn; degree = 1/360 turn; minute = 1/60 degree. Tolerance 1e-12.
    expectWithin(convertAngle(90, 'deg', 'mil'), 1600, 1e-12);
    expectWithin(convertAngle(Math.PI, 'rad', 'deg'), 180, 1e-12);
    expectWithin(convertAngle(1, 'deg', 'arcmin'), 60, 1e-12);
    expectWithin(convertAngle(6400, 'mil'), 2 * Math.PI, 1e-12);
  });

  it('round-trips every pair of units', () => {
    const units = Object.keys(ANGLE_UNITS_PER_TURN) as AngleUnit[];
    for (const from of units) {
      for (const to of units) {
        for (const value of [0, 1e-6, 0.75, 359.9, -12]) {
          // Source: none — round trip. Tolerance 1e-12 relative.
          expectWithin(convertAngle(convertAngle(value, from, to), to, from), value, Math.max(1e-15, Math.abs(value) * 1e-12));
        }
      }
    }
  });

  it('rejects unknown units', () => {
    // Source: none — input contract.
    expect(() => convertAngle(1, 'grad' as AngleUnit)).toThrow(UnitError);
  });
});

describe('temperature', () => {
  it('fixed points', () => {
    // Source: SI Brochure (BIPM): T/K = t/°C + 273.15; Fahrenheit: water freezes at 32 °F, boils at 212 °F. Tolerance 1e-9.
    expectWithin(convertTemperature(0, 'C'), 273.15, 1e-9);
    expectWithin(convertTemperature(32, 'F', 'C'), 0, 1e-9);
    expectWithin(convertTemperature(212, 'F', 'C'), 100, 1e-9);
    expectWithin(convertTemperature(-40, 'C', 'F'), -40, 1e-9);
  });

  it('round-trips and refuses temperatures below absolute zero', () => {
    const units: TemperatureUnit[] = ['K', 'C', 'F'];
    for (const from of units) {
      for (const to of units) {
        // Source: none — round trip. Tolerance 1e-9.
        expectWithin(convertTemperature(convertTemperature(300, from, to), to, from), 300, 1e-9);
      }
    }
    // Source: none — input contract.
    expect(() => convertTemperature(-274, 'C')).toThrow(UnitError);
  });
});

import { modelDeclination } from '@/shared/fixes';
import { trueBearingDeg } from '@/shared/fixes/true-bearing';

describe('modelDeclination (World Magnetic Model 2025 through magvar)', () => {
  it('gives NOAA’s published WMM2025 test value at 80° N, 0° E, sea level, 2025.0', () => {
    // Source: NOAA NCEI / BGS, WMM2025 test values (WMM2025_TEST_VALUES.txt): 2025.0, h = 0 km, 80° N 0° E, D = 1.28°.
    const d = modelDeclination(80, 0, new Date('2025-01-01T00:00:00Z'));
    expect(d.declinationDeg).toBeCloseTo(1.28, 2);
    expect(d.withinModelYears).toBe(true);
  });

  it('agrees with an independent implementation’s worked example (1 000 m, 42.283° N 71.35° W, 4 July 2028)', () => {
    // Source: MathWorks Aerospace Toolbox documentation, wrldmagm example with WMM2025: DEC = −13.6891°.
    const d = modelDeclination(42.283, -71.35, new Date('2028-07-04T00:00:00Z'), 1000);
    expect(d.declinationDeg).toBeCloseTo(-13.6891, 1);
  });

  it('says when a date is outside the model’s years', () => {
    // Source: NOAA NCEI, WMM2025 is valid from 2025.0 to 2030.0.
    expect(modelDeclination(50, 10, new Date('2031-03-01T00:00:00Z')).withinModelYears).toBe(false);
    expect(modelDeclination(50, 10, new Date('2024-12-31T23:00:00Z')).withinModelYears).toBe(false);
  });

  it('turns a compass bearing into a true one with it (true = magnetic + declination, east positive)', () => {
    // Common practice, no source: west declination is subtracted from a magnetic bearing.
    const d = modelDeclination(42.283, -71.35, new Date('2028-07-04T00:00:00Z'), 1000).declinationDeg;
    expect(trueBearingDeg(100, 'magnetic', d)).toBeCloseTo(100 + d, 9);
  });
});

import { scaleBar } from '@/components/map/scale-bar';

describe('scaleBar', () => {
  // common practice, no source: scale bars show 1, 2 or 5 × 10ⁿ of a unit.
  test.each([
    [12.3, 120, 1000, '1 km'],
    [50, 120, 5000, '5 km'],
    [1, 120, 100, '100 m'],
    [0.3, 100, 20, '20 m'],
    [100, 100, 10_000, '10 km'],
    [2.5, 200, 500, '500 m'],
    [40, 50, 2000, '2 km'],
  ])('%f m/px within %i px → %i m (%s)', (metresPerPx, maxPx, metres, label) => {
    const bar = scaleBar(metresPerPx, maxPx);
    expect(bar.metres).toBeCloseTo(metres, 9);
    expect(bar.label).toBe(label);
    expect(bar.px).toBeCloseTo(metres / metresPerPx, 9);
    expect(bar.px).toBeLessThanOrEqual(maxPx + 1e-9);
    // The next round length would not fit: the bar uses at least 40 % of the room (5 → 10 is × 2, 2 → 5 is × 2.5).
    expect(bar.px).toBeGreaterThan(maxPx * 0.4 - 1e-9);
  });

  test('an exact fit is kept (5 km in exactly 100 px)', () => {
    expect(scaleBar(50, 100).label).toBe('5 km');
  });

  test('nautical miles for coast sites: 1 NM = 1852 m (definition)', () => {
    // Source: 1 international nautical mile = 1852 m (International Hydrographic Conference, 1929).
    const bar = scaleBar(30, 120, 'nautical'); // 3.6 km of room → 1 NM
    expect(bar.label).toBe('1 NM');
    expect(bar.metres).toBe(1852);
    expect(scaleBar(300, 120, 'nautical').label).toBe('10 NM');
    expect(scaleBar(0.5, 100, 'nautical').label).toBe('50 m'); // below 0.1 NM, metres
  });

  test('imperial: feet below a quarter mile, miles above; 1 mi = 1609.344 m', () => {
    // Source: international yard and pound agreement (1959): 1 ft = 0.3048 m, 1 mi = 5280 ft.
    expect(scaleBar(1, 100, 'imperial').label).toBe('200 ft');
    const miles = scaleBar(40, 100, 'imperial'); // 4 km of room
    expect(miles.label).toBe('2 mi');
    expect(miles.metres).toBeCloseTo(3218.688, 9);
  });

  test('refuses a scale that is not a positive number', () => {
    expect(() => scaleBar(0, 100)).toThrow(RangeError);
    expect(() => scaleBar(10, Number.NaN)).toThrow(RangeError);
  });
});

import { COMPASS_POINTS, compassPoint } from '@/shared/geo/compass-point';

describe('compassPoint', () => {
  // Common practice, no source: 16 points 22.5° apart, N at 0°, E at 90°, S at 180°, W at 270°.
  it.each([
    [0, 'N'],
    [22.5, 'NNE'],
    [45, 'NE'],
    [90, 'E'],
    [135, 'SE'],
    [180, 'S'],
    [202.5, 'SSW'],
    [270, 'W'],
    [315, 'NW'],
    [337.5, 'NNW'],
    [360, 'N'],
  ])('%d° → %s', (deg, point) => {
    expect(compassPoint(deg)).toBe(point);
  });

  it('puts each boundary in the clockwise sector', () => {
    expect(compassPoint(11.2499)).toBe('N');
    expect(compassPoint(11.25)).toBe('NNE');
    expect(compassPoint(348.7499)).toBe('NNW');
    expect(compassPoint(348.75)).toBe('N');
  });

  it('wraps bearings outside one turn', () => {
    expect(compassPoint(-90)).toBe('W');
    expect(compassPoint(720 + 45)).toBe('NE');
  });

  it('gives every point to exactly 22.5° of the circle', () => {
    const counts = new Map<string, number>();
    for (let tenth = 0; tenth < 3600; tenth++) {
      const p = compassPoint(tenth / 10 + 0.05);
      counts.set(p, (counts.get(p) ?? 0) + 1);
    }
    expect([...counts.keys()].sort()).toEqual([...COMPASS_POINTS].sort());
    for (const n of counts.values()) expect(n).toBe(225);
  });

  it('refuses a bearing that is not a number', () => {
    expect(() => compassPoint(Number.NaN)).toThrow(RangeError);
  });
});

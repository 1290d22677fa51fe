import { CoordinateTextSchema, LatLonSchema } from '@/shared/schemas/coordinate';

describe('CoordinateTextSchema', () => {
  it('accepts any format parseCoordinate reads and trims the text', () => {
    // Source: none — schema contract; texts as in the parse tests (invented example and GeographicLib usage text).
    expect(CoordinateTextSchema.parse('  61.2345, -149.8765 ')).toBe('61.2345, -149.8765');
    expect(CoordinateTextSchema.parse(`61°14'04.2"N 149°52'35.4"W`)).toBe(`61°14'04.2"N 149°52'35.4"W`);
    expect(CoordinateTextSchema.parse('38N 444140.54 3684706.36')).toBe('38N 444140.54 3684706.36');
  });

  it.each([
    // Source: none — the issue carries the CoordinateError's message and code.
    ['91.5, 10', 'latitude-out-of-range', /^Latitude “91\.5” is 91\.5°, beyond 90°/],
    ["61°60.0'N 149°52.59'W", 'minutes-out-of-range', /minutes run from 0 to under 60/],
    ['61N 500000 6800000', 'unknown-zone', /^UTM zones run from 1 to 60; “61” is not one\./],
    ['', 'empty', /^Enter a coordinate/],
  ])('reports %j with the CoordinateError message', (text, code, message) => {
    const result = CoordinateTextSchema.safeParse(text);
    expect(result.success).toBe(false);
    if (result.success) return;
    expect(result.error.issues).toHaveLength(1);
    const [issue] = result.error.issues;
    expect(issue?.message).toMatch(message);
    expect(issue?.code).toBe('custom');
    expect((issue as { params?: { code?: string } } | undefined)?.params?.code).toBe(code);
  });

  it('refuses a non-string', () => {
    // Source: none — schema contract.
    const result = CoordinateTextSchema.safeParse(61.2);
    expect(result.success).toBe(false);
    expect(result.success ? '' : result.error.issues[0]?.message).toBe('Enter a coordinate as text.');
  });
});

describe('LatLonSchema', () => {
  it('accepts the full range, ends included', () => {
    // Source: latitude −90…90°, longitude −180…180° (common practice, no source).
    for (const value of [
      { latDeg: 90, lonDeg: 180 },
      { latDeg: -90, lonDeg: -180 },
      { latDeg: 0, lonDeg: 0 },
    ]) {
      expect(LatLonSchema.parse(value)).toEqual(value);
    }
    // Values pass through unchanged (no rounding).
    expect(LatLonSchema.parse({ latDeg: 61.2345, lonDeg: -149.8765 })).toEqual({ latDeg: 61.2345, lonDeg: -149.8765 });
  });

  it.each([
    // Source: none — schema contract.
    ['latitude above 90°', { latDeg: 90.0001, lonDeg: 0 }, 'latDeg', 'Latitude must be at most 90° (90°N).'],
    ['latitude below −90°', { latDeg: -91, lonDeg: 0 }, 'latDeg', 'Latitude must be at least −90° (90°S).'],
    ['longitude above 180°', { latDeg: 0, lonDeg: 180.5 }, 'lonDeg', 'Longitude must be at most 180° (180°E).'],
    ['longitude below −180°', { latDeg: 0, lonDeg: -181 }, 'lonDeg', 'Longitude must be at least −180° (180°W).'],
    ['latitude as text', { latDeg: '61', lonDeg: 0 }, 'latDeg', 'Latitude must be a number of degrees.'],
    ['NaN longitude', { latDeg: 0, lonDeg: Number.NaN }, 'lonDeg', 'Longitude must be a number of degrees.'],
    ['infinite latitude', { latDeg: Number.POSITIVE_INFINITY, lonDeg: 0 }, 'latDeg', 'Latitude must be a number of degrees.'],
    ['missing longitude', { latDeg: 0 }, 'lonDeg', 'Longitude must be a number of degrees.'],
  ])('refuses %s', (_what, input, path, message) => {
    const result = LatLonSchema.safeParse(input);
    expect(result.success).toBe(false);
    if (result.success) return;
    expect(result.error.issues.map((issue) => [issue.path.join('.'), issue.message])).toEqual([[path, message]]);
  });

  it('refuses unknown fields', () => {
    // Source: none — strict object, like the other request schemas.
    expect(LatLonSchema.safeParse({ latDeg: 0, lonDeg: 0, altM: 5 }).success).toBe(false);
  });
});

import { bearingFromText, formatBearing, formatBytes } from '@/components/attachments/format';

describe('formatBearing', () => {
  // Common practice, no source: bearings are read as three digits (045, not 45) with the compass point.
  it.each([
    [0, '000° N'],
    [45, '045° NE'],
    [92, '092° E'],
    [202.4, '202° SSW'],
    [359.6, '360° N'],
  ])('%d → %s', (deg, text) => {
    expect(formatBearing(deg)).toBe(text);
  });
});

describe('bearingFromText', () => {
  it('reads degrees, a decimal comma and a trailing degree sign; empty is no bearing', () => {
    expect(bearingFromText(' 45 ')).toBe(45);
    expect(bearingFromText('22,5')).toBe(22.5);
    expect(bearingFromText('315°')).toBe(315);
    expect(bearingFromText('')).toBeNull();
    expect(bearingFromText('north')).toBeNaN();
  });
});

describe('formatBytes', () => {
  it('uses the units the limits are stated in (1 MB = 1 048 576 bytes)', () => {
    expect(formatBytes(900)).toBe('900 bytes');
    expect(formatBytes(12_345)).toBe('12 kB');
    expect(formatBytes(15 * 1024 * 1024)).toBe('15.0 MB');
  });
});

import { areaText, visibilityIndexMapLayer } from '@/components/map/visibility-index-layer';
import type { VisibilityIndexMapLayer } from '@/shared/schemas/visibility-index';

describe('areaText', () => {
  test.each([
    // Source: international nautical mile = 1852 m and statute mile = 1609.344 m exactly (international yard and pound agreement, 1959).
    [12_500_000, 'km', '12.5 km²'],
    [1852 ** 2 * 3.6, 'nmi', '3.60 nmi²'],
    [1609.344 ** 2 * 250, 'mi', '250 mi²'],
    [0, 'km', '0 km²'],
  ] as const)('%d m² in %s is %s', (m2, unit, text) => {
    expect(areaText(m2, unit)).toBe(text);
  });
});

describe('visibilityIndexMapLayer', () => {
  const layer: VisibilityIndexMapLayer = {
    raster: { format: 'kenning-rle8/1', width: 1, height: 1, cellSize: 25, xll: 0, yll: 0, epsg: 32633, data: 'AQE=' },
    classUpperM2: [1e6, 2e6, 3e6],
    maxSeenM2: 2.9e6,
  };

  test('labels each class by its bounds in the person’s area unit, lightest first, and leaves no data undrawn', () => {
    const { palette } = visibilityIndexMapLayer(layer, '20 m', 'km');
    expect(palette.classes.map((c) => c.label)).toEqual([
      'up to 1.00 km²',
      '1.00 km² – 2.00 km²',
      '2.00 km² – 3.00 km²',
      'Not assessed',
    ]);
    expect(palette.classes.map((c) => c.code)).toEqual([1, 2, 3, 0]);
    expect(palette.classes.at(-1)?.color).toBeNull();
    // common practice, no source: an ordered scale gets darker as the value grows (relative luminance of the sRGB hex).
    const luminance = (hex: string) => {
      const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
      return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
    };
    const drawn = palette.classes.filter((c) => c.color !== null).map((c) => luminance(c.color!));
    for (let i = 1; i < drawn.length; i++) expect(drawn[i]).toBeLessThan(drawn[i - 1]!);
  });

  test('nautical units restate the bounds in nmi²', () => {
    const { palette } = visibilityIndexMapLayer(layer, '66 ft', 'nmi');
    expect(palette.classes[0]?.label).toBe(`up to ${(1e6 / 1852 ** 2).toFixed(2)} nmi²`);
    expect(palette.classes[0]?.meaning).toMatch(/^A 66 ft tower here/);
  });
});

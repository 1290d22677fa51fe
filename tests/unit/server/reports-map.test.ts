import { PNG } from 'pngjs';
import { METRES_PER_POINT, fitFrame, gridValues, roundStep, toPaper } from '@/server/domain/reports/map-frame';
import { CROSS_BEARING_PRINT, POSTS_PER_CELL_PRINT, mapPicture, type PrintPalette } from '@/server/domain/reports/map-picture';

// Printed maps: the stated scale, grid ticks, and classes that stay apart in greyscale.

describe('fitFrame', () => {
  it('picks the smallest listed scale that fits and keeps the stated scale true on paper', () => {
    // A point is 1/72 in = 0.3528 mm. Source: PostScript/PDF point definition (PDF 32000-1 §8.3.2.3), 25.4 mm to the inch.
    expect(METRES_PER_POINT * 1000).toBeCloseTo(0.35278, 5);
    // 15 km across 500 pt (176.4 mm): 1 : 85 000 needed, so 1 : 100 000 — 1 mm on paper is 100 m on the ground.
    // Source: definition of a representative fraction (common practice, no source).
    const frame = fitFrame({ west: 0, south: 0, east: 15_000, north: 10_000 }, { x: 50, y: 100, width: 500, height: 400 });
    expect(frame.scale).toBe(100_000);
    const oneMm = 1 / (METRES_PER_POINT * 1000);
    const [x0] = toPaper(frame, 7_500, 5_000);
    const [x1] = toPaper(frame, 7_600, 5_000);
    expect(x1 - x0).toBeCloseTo(oneMm, 6);
    // Centred on what was asked, north up (larger northing = higher on the page, smaller y).
    expect(toPaper(frame, 7_500, 5_000)).toEqual([300, 300]);
    expect(toPaper(frame, 7_500, 6_000)[1]).toBeLessThan(300);
  });

  it('goes to a smaller scale when the ground does not fit', () => {
    const frame = fitFrame({ west: 0, south: 0, east: 40_000, north: 1_000 }, { x: 0, y: 0, width: 500, height: 400 });
    // 40 km over 176 mm needs 1 : 227 000: the next listed scale is 1 : 250 000.
    expect(frame.scale).toBe(250_000);
  });
});

describe('roundStep and gridValues', () => {
  it('steps by 1, 2 or 5 × 10ⁿ and lists the lines strictly inside', () => {
    expect(roundStep(15_000, 5)).toBe(2_000);
    expect(roundStep(20_000, 5)).toBe(5_000);
    expect(roundStep(14_000, 5)).toBe(2_000);
    expect(roundStep(700, 5)).toBe(100);
    expect(gridValues(512_300, 527_100, 5_000)).toEqual([515_000, 520_000, 525_000]);
    expect(gridValues(515_000, 520_000, 5_000)).toEqual([]);
  });
});

/** CIE L* of an sRGB colour. Source: IEC 61966-2-1 (sRGB transfer), CIE 1976 L* from Y (CIE 15:2004). */
function lightness([r, g, b]: [number, number, number]) {
  const lin = (c: number) => {
    const v = c / 255;
    return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4;
  };
  const y = 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
  return y > 216 / 24389 ? 116 * Math.cbrt(y) - 16 : (24389 / 27) * y;
}

describe.each([POSTS_PER_CELL_PRINT, CROSS_BEARING_PRINT])('print palette $title', (palette: PrintPalette) => {
  it('darkens along the ordered classes by at least 10 L* so a greyscale copy keeps them apart', () => {
    // The hatched class (nobody sees it) is told apart by its pattern; the others by lightness alone.
    const plain = palette.classes.filter((c) => c.rgb && !c.hatched).map((c) => lightness(c.rgb!));
    for (let i = 1; i < plain.length; i++) expect(plain[i - 1]! - plain[i]!).toBeGreaterThanOrEqual(10);
    expect(palette.classes.filter((c) => c.hatched)).toHaveLength(1);
  });
});

describe('mapPicture', () => {
  it('samples the layer north-up at its grid position over the hillshade', () => {
    // A 2 × 2 layer of 10 m cells at (0, 0): row 0 is the north row.
    const codes = Uint8Array.from([2, 4, 2, 4]);
    const png = PNG.sync.read(
      mapPicture({
        extent: { west: 0, south: 0, east: 40, north: 20 },
        widthPx: 4,
        heightPx: 2,
        hillshade: null,
        layer: {
          raster: { width: 2, height: 2, cellSizeM: 10, xllM: 0, yllM: 0, codes },
          palette: POSTS_PER_CELL_PRINT,
        },
      }),
    );
    const at = (i: number, j: number) => Array.from(png.data.subarray((j * 4 + i) * 4, (j * 4 + i) * 4 + 3));
    const one = POSTS_PER_CELL_PRINT.classes.find((c) => c.code === 2)!.rgb!;
    const three = POSTS_PER_CELL_PRINT.classes.find((c) => c.code === 4)!.rgb!;
    // Without a hillshade the paper is white (shade 1), so the class colour is drawn unchanged.
    expect(at(0, 0)).toEqual(one);
    expect(at(1, 1)).toEqual(three);
    // East of the layer only the paper shows.
    expect(at(3, 0)).toEqual([255, 255, 255]);
  });
});

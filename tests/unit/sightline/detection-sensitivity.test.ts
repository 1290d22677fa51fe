import { SightlineRequestSchema } from '@/shared/schemas/sightline';
import { detectionSensitivity, SENSITIVITY_BAND_K } from '@/shared/sightline/detection-sensitivity';

const R = 6_371_008.8;
const request = (over: Record<string, unknown>) =>
  SightlineRequestSchema.parse({ observerHeightM: 20, targetHeightM: 5, distanceM: 10_000, conditions: [{ k: 0.13 }], ...over });

describe('detectionSensitivity', () => {
  test('where the horizon decides, the band runs from the geographic range at k = 0 to that at k = 0.3', () => {
    // Source: geographic range √(2R′h) + √(2R′T) with R′ = R/(1 − k) — common practice, no source
    // (the navigation manuals' distance-of-the-horizon tables); R = 6 371 008.8 m (IUGG mean radius).
    const band = detectionSensitivity(request({ targetSizeM: 100 }));
    const geographic = (k: number) => Math.sqrt((2 * R * 20) / (1 - k)) + Math.sqrt((2 * R * 5) / (1 - k));
    expect(band.ks).toEqual(SENSITIVITY_BAND_K);
    expect(band.limitedBy).toEqual(['horizon']);
    expect(band.detectionRangeM!.kAtMin).toBe(0);
    expect(band.detectionRangeM!.kAtMax).toBe(0.3);
    expect(Math.abs(band.detectionRangeM!.min / geographic(0) - 1)).toBeLessThan(1e-3);
    expect(Math.abs(band.detectionRangeM!.max / geographic(0.3) - 1)).toBeLessThan(1e-3);
    // (1 − √0.7) = 16.3 % spread, the share the horizon moves between k 0 and 0.3.
    expect(band.spreadPct!).toBeCloseTo(100 * (1 - Math.sqrt(0.7)), 1);
  });

  test('where the visibility decides throughout, refraction does not move the answer', () => {
    // Source: Koschmieder's law, contrast threshold 5 %: a large dark object is made out to the MOR
    // (WMO-No. 8, Guide to Instruments and Methods of Observation, visibility chapter, from memory).
    const band = detectionSensitivity(request({ targetHeightM: 200, targetSizeM: 100, visibilityM: 5000 }));
    expect(band.limitedBy).toEqual(['visibility']);
    expect(band.detectionRangeM!.min).toBeCloseTo(band.detectionRangeM!.max, 6);
    expect(band.spreadPct).toBeCloseTo(0, 9);
    expect(band.geographicRangeM!.max).toBeGreaterThan(band.geographicRangeM!.min);
  });

  test('the caller’s own k joins the band, a duct and non-finite values are left out, and both limits are named', () => {
    // 20 m eye, 5 m target: geographic range ≈ 24 km at k = 0 and ≈ 29 km at k = 0.3 (formula above),
    // so a 28 km visibility caps it from some k on and both limits appear.
    const band = detectionSensitivity(request({ targetSizeM: 100, visibilityM: 28_000 }), [0.13, 0.5, 1.2, NaN]);
    expect(band.ks).toEqual([0, 0.05, 0.1, 0.13, 0.15, 0.2, 0.25, 0.3, 0.5]);
    expect(band.limitedBy).toEqual(['horizon', 'visibility']);
    expect(band.detectionRangeM!.max).toBeCloseTo(28_000, 0);
    expect(band.detectionRangeM!.kAtMin).toBe(0);
  });
});

import {
  firstSightingRange,
  geographicRange,
  hiddenHeight,
  hiddenHeightApprox,
  horizonDistance,
  refractionPreset,
  SightlineInputError,
  visibleHeight,
} from '@/shared/sightline';
import { convertLength } from '@/shared/units';
import { deepFreeze, expectRelative, expectWithin } from '@/tests/unit/sightline/tolerance';

describe('hidden height against the levelling correction', () => {
  it.each([0.5, 1, 2, 5, 10])('c + r ≈ 0.0675 K² m with refraction 1/7 of curvature, K = %p km', (km) => {
    // Source: combined curvature-and-refraction correction of levelling, c + r = 0.0675 K² m (K in km), standard surveying texts (also quoted as 0.0673). Tolerance 0.5 %.
    expectRelative(hiddenHeight(0, km * 1000, { k: 1 / 7 }).value, 0.0675 * km * km, 0.005);
    expectRelative(hiddenHeightApprox(0, km * 1000, { k: 1 / 7 }).value, 0.0675 * km * km, 0.005);
  });

  it('curvature alone is ≈ 0.0785 K² m and refraction takes off one seventh of it', () => {
    const curvature = hiddenHeight(0, 3000, { k: 0 }).value ?? NaN;
    const combined = hiddenHeight(0, 3000, { k: 1 / 7 }).value ?? NaN;
    // Source: levelling curvature correction 0.0785 K² m (K in km), standard surveying texts. Tolerance 0.2 %.
    expectRelative(curvature, 0.0785 * 9, 0.002);
    // Source: refraction correction ≈ 1/7 of the curvature correction, standard surveying texts. Tolerance 1e-4 relative.
    expectRelative((curvature - combined) / curvature, 1 / 7, 1e-4);
  });

  it('a line 8 km long drops about 5 m below the tangent (R = 6 400 km, no refraction)', () => {
    // common practice, no source. Tolerance 0.05 m.
    expectWithin(hiddenHeight(0, 8000, { k: 0, earthRadiusM: 6_400_000 }).value, 5, 0.05);
  });
});

describe('hidden height properties', () => {
  it('is 0 inside the horizon and at the horizon', () => {
    const dh = horizonDistance(25).value ?? NaN;
    // Source: none — definition (nothing is below the tangent line before the tangent point).
    expect(hiddenHeight(25, dh * 0.5).value).toBe(0);
    expectWithin(hiddenHeight(25, dh).value, 0, 1e-9);
  });

  it('grows monotonically with distance beyond the horizon', () => {
    const values = [5, 10, 20, 40, 80].map((km) => hiddenHeight(3, km * 1000).value ?? NaN);
    // Source: none — monotonicity of R′/cos θ − R′.
    for (let i = 1; i < values.length; i += 1) expect(values[i]).toBeGreaterThan(values[i - 1] ?? Infinity);
  });

  it('vanishes in the flat-earth limit', () => {
    // Source: none — limit R → ∞. Tolerance 1 µm.
    expectWithin(hiddenHeight(2, 50_000, { k: 0, earthRadiusM: 1e15 }).value, 0, 1e-6);
    // Source: none — at k = 1 the effective surface is flat.
    expect(hiddenHeight(2, 50_000, { k: 1 })).toEqual({ value: 0, reason: null });
    expect(hiddenHeight(2, 50_000, { k: 3 })).toEqual({ value: 0, reason: null });
  });

  it('approximation agrees with the exact form to 1e-4 at lookout ranges', () => {
    for (const km of [10, 30, 60]) {
      // Source: none — the parabola's relative error ≈ 5θ²/12 plus the √(2R′h) horizon error. Tolerance 1e-4 relative.
      expectRelative(hiddenHeightApprox(30, km * 1000).value, hiddenHeight(30, km * 1000).value ?? NaN, 1e-4);
    }
  });

  it('does not exist past a quarter of the effective circumference', () => {
    // k = −10 gives R′ = R/11 ≈ 579 km, so π/2·R′ ≈ 910 km.
    // Source: none — Kenning's contract (the tangent line never returns).
    expect(hiddenHeight(10, 1_500_000, { k: -10 })).toEqual({ value: null, reason: 'beyond-effective-quarter' });
    expect(visibleHeight(10, 5000, 1_500_000, { k: -10 })).toEqual({ value: 0, reason: null });
  });

  it('rejects negative distances and heights', () => {
    // Source: none — input contract.
    expect(() => hiddenHeight(10, -1)).toThrow(SightlineInputError);
    expect(() => visibleHeight(10, -2, 100)).toThrow(SightlineInputError);
  });
});

describe('visible part, geographic range and first-sighting range', () => {
  const tables = { k: refractionPreset('nautical-tables').k, earthRadiusM: convertLength(3440.1, 'nmi', 'm') };

  it('geographic range of a 100 ft object from a 25 ft eye ≈ 1.17(√25 + √100) nmi', () => {
    const range = geographicRange(convertLength(25, 'ft', 'm'), convertLength(100, 'ft', 'm'), tables).value ?? NaN;
    // Source: The American Practical Navigator (Bowditch): geographic range = sum of the horizon distances of eye and object, Table 12 (D = 1.17 √h). Tolerance 0.3 %.
    expectRelative(convertLength(range, 'm', 'nmi'), 1.17 * (5 + 10), 0.003);
  });

  it('is symmetric in the two heights', () => {
    // Source: none — symmetry of horizon(h) + horizon(H). Tolerance 1e-9 m.
    expectWithin(geographicRange(3, 40).value, geographicRange(40, 3).value ?? NaN, 1e-9);
  });

  it('at the first-sighting range exactly the required part shows', () => {
    for (const [h, big, part] of [
      [2, 30, 0],
      [10, 40, 10],
      [300, 12, 4],
      [1200, 60, 60],
    ] as const) {
      const d = firstSightingRange(h, big, part).value ?? NaN;
      // Source: none — model identity: hidden height at horizon(h) + horizon(H − p) is H − p. Tolerance 1 mm.
      expectWithin(visibleHeight(h, big, d).value, part, 1e-3);
    }
  });

  it('first-sighting range with p = 0 is the geographic range; p > H has no range', () => {
    // Source: none — definition. Tolerance 1e-9 m.
    expectWithin(firstSightingRange(5, 50).value, geographicRange(5, 50).value ?? NaN, 1e-9);
    expect(firstSightingRange(5, 50, 60)).toEqual({ value: null, reason: 'required-part-exceeds-target' });
  });

  it('under ducting the target is fully visible and has no geometric range', () => {
    // Source: none — Kenning's contract for k ≥ 1.
    expect(visibleHeight(2, 30, 200_000, { k: 1.3 })).toEqual({ value: 30, reason: null });
    expect(geographicRange(2, 30, { k: 1.3 })).toEqual({ value: null, reason: 'ducting' });
    expect(firstSightingRange(2, 30, 5, { k: 1 })).toEqual({ value: null, reason: 'ducting' });
  });

  it('visible part is never negative and never exceeds the target', () => {
    for (const km of [0, 5, 20, 50, 200]) {
      const v = visibleHeight(5, 25, km * 1000).value ?? NaN;
      // Source: none — bounds of max(0, H − hidden).
      expect(v).toBeGreaterThanOrEqual(0);
      expect(v).toBeLessThanOrEqual(25);
    }
  });

  it('does not mutate its options', () => {
    const options = deepFreeze({ k: 0.13 });
    visibleHeight(5, 25, 20_000, options);
    firstSightingRange(5, 25, 3, options);
    // Source: none — purity contract.
    expect(options).toEqual({ k: 0.13 });
  });
});

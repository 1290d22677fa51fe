import {
  effectiveRadius,
  horizonApproxRelativeError,
  horizonDip,
  horizonDistance,
  horizonDistanceApprox,
  horizonSag,
  localRadiusOfCurvature,
  refractionPreset,
  SightlineInputError,
  tangentLength,
} from '@/shared/sightline';
import { convertAngle, convertLength } from '@/shared/units';
import { deepFreeze, expectRelative, expectWithin } from '@/tests/unit/sightline/tolerance';

const FT = (feet: number) => convertLength(feet, 'ft', 'm');
const NMI = (metres: number) => convertLength(metres, 'm', 'nmi');
const ARCMIN = (rad: number) => convertAngle(rad, 'rad', 'arcmin');
const DEG = (rad: number) => convertAngle(rad, 'rad', 'deg');

/** Bowditch Table 12 constants: r₀ = 3440.1 nmi, refraction factor β₀ = 0.8279. */
const BOWDITCH = { k: 1 - 0.8279, earthRadiusM: convertLength(3440.1, 'nmi', 'm') };

describe('horizon distance against The American Practical Navigator (Bowditch)', () => {
  it.each([5, 10, 25, 50, 100, 500, 1000])('D ≈ 1.17 √h nmi for h = %p ft', (feet) => {
    const d = horizonDistance(FT(feet), BOWDITCH).value;
    // Source: The American Practical Navigator (Bowditch), Table 12 "Distance of the Horizon", D = 1.17 √h(ft) nmi with r₀ = 3440.1 nmi, β₀ = 0.8279 (formula and constants as quoted in secondary references read for this test). Tolerance 0.3 % (1.17 is rounded from 1.169).
    expectRelative(NMI(d ?? NaN), 1.17 * Math.sqrt(feet), 0.003);
  });

  it('gives the consistent metric coefficient ≈ 2.12, not the misprinted 2.07', () => {
    const perRootMetre = NMI(horizonDistance(1, BOWDITCH).value ?? NaN);
    // Source: Bowditch 1995/2002 editions print D = 2.07 √h(m); converting their own 1.17 √h(ft) gives 1.17/√0.3048 = 2.119 (the misprint is documented in navigation discussion of those editions). Tolerance 0.5 %.
    expectRelative(perRootMetre, 1.17 / Math.sqrt(0.3048), 0.005);
    // Source: same — the printed 2.07 is more than 2 % below the consistent value.
    expect(Math.abs(perRootMetre - 2.07) / 2.07).toBeGreaterThan(0.02);
  });

  it.each([10, 50, 100, 400])('radar horizon with the 4/3 earth ≈ 1.23 √h(ft) nmi for h = %p ft', (feet) => {
    const d = horizonDistanceApprox(FT(feet), { k: 0.25 }).value;
    // Source: radar-horizon rule 1.23 √h(ft) nmi for the 4/3 effective earth (from memory; the same figure appears in secondary radar references). Tolerance 0.5 %.
    expectRelative(NMI(d ?? NaN), 1.23 * Math.sqrt(feet), 0.005);
  });
});

describe('dip of the horizon', () => {
  const tables = { k: refractionPreset('nautical-tables').k };

  it.each([1, 2, 5, 10, 20, 40])('≈ 1.76′ √h(m) under standard navigational refraction, h = %p m', (metres) => {
    // Source: The Nautical Almanac, dip of the sea horizon, dip = 1.76′ √h(m) (standard conditions). Tolerance 1 % (the almanac's refraction differs slightly from Bowditch's β₀ = 0.8279 used here).
    expectRelative(ARCMIN(horizonDip(metres, tables).value ?? NaN), 1.76 * Math.sqrt(metres), 0.01);
  });

  it.each([5, 20, 50, 100])('≈ 0.97′ √h(ft), h = %p ft', (feet) => {
    // Source: The Nautical Almanac / navigation glossaries: dip = 0.97′ √h(ft). Tolerance 1 %.
    expectRelative(ARCMIN(horizonDip(FT(feet), tables).value ?? NaN), 0.97 * Math.sqrt(feet), 0.01);
  });

  const sphere6400 = { k: 0, earthRadiusM: 6_400_000 };

  it('from an eye 2 m above the sea, R = 6 400 km and no refraction, is about 0.045°', () => {
    // common practice, no source. Tolerance 0.001°.
    expectWithin(DEG(horizonDip(2, sphere6400).value ?? NaN), 0.045, 0.001);
  });

  it('from near 8 850 m is about 3°', () => {
    // common practice, no source. Tolerance 0.05°.
    expectWithin(DEG(horizonDip(8850, sphere6400).value ?? NaN), 3, 0.05);
  });

  it('equals the central angle to the tangent point (dip · R′ = arc distance)', () => {
    // Source: none — model identity (the tangent at the horizon is perpendicular to the radius). Tolerance 1e-9 relative.
    const r = effectiveRadius({ k: 0.13 }).value ?? NaN;
    expectRelative((horizonDip(300, { k: 0.13 }).value ?? NaN) * r, horizonDistance(300, { k: 0.13 }).value ?? NaN, 1e-9);
  });

  it('decreases as refraction increases (dip ∝ √(1 − k) for small h)', () => {
    const d0 = horizonDip(10, { k: 0 }).value ?? NaN;
    const d13 = horizonDip(10, { k: 0.13 }).value ?? NaN;
    // Source: small-angle dip √(2h(1 − k)/R) (effective-radius model; surveying/navigation texts). Tolerance 1e-5 relative.
    expectRelative(d13 / d0, Math.sqrt(1 - 0.13), 1e-5);
  });
});

describe('horizon sag across a photograph', () => {
  it('across a 74° field of view from 2 m is about 0.011°, under one pixel of a 4 000-pixel, 53°-tall frame', () => {
    const sag = DEG(horizonSag(2, convertAngle(74, 'deg'), { k: 0, earthRadiusM: 6_400_000 }).value ?? NaN);
    // common practice, no source. Tolerance 0.001°.
    expectWithin(sag, 0.011, 0.001);
    // common practice, no source: one pixel of 4 000 across 53° is 0.01325°.
    expect(sag).toBeLessThan(53 / 4000);
  });

  it('is zero at a vanishing field of view and grows with it', () => {
    const narrow = horizonSag(10, 1e-6).value ?? NaN;
    const wide = horizonSag(10, convertAngle(120, 'deg')).value ?? NaN;
    // Source: none — property (cos(φ/2) → 1). Tolerance 1e-12 rad.
    expectWithin(narrow, 0, 1e-12);
    expect(wide).toBeGreaterThan(horizonSag(10, convertAngle(60, 'deg')).value ?? Infinity);
  });
});

describe('approximation √(2R′h) and its error', () => {
  it('overstates the exact arc by about 5h/(12R′)', () => {
    const h = 8850;
    const r = effectiveRadius({ k: 0 }).value ?? NaN;
    // Source: Taylor series acos(1/(1 + ε)) = √(2ε)(1 − 5ε/12 + …), ε = h/R′. Tolerance 2 % of the error itself.
    expectRelative(horizonApproxRelativeError(h, { k: 0 }).value, (5 * h) / (12 * r), 0.02);
  });

  it('is 0 at the surface and grows with height', () => {
    // Source: none — property. Tolerance exact zero allowed within 1e-15.
    expectWithin(horizonApproxRelativeError(0).value, 0, 1e-15);
    const errors = [1, 10, 100, 1000, 10_000].map((h) => horizonApproxRelativeError(h).value ?? NaN);
    for (let i = 1; i < errors.length; i += 1) expect(errors[i]).toBeGreaterThan(errors[i - 1] ?? Infinity);
  });

  it('is below 10⁻³ for any lookout up to 10 km', () => {
    // Source: none — bound from the series above (5·10 000/(12·6.37e6) ≈ 6.5e-4).
    expect(horizonApproxRelativeError(10_000, { k: 0 }).value).toBeLessThan(1e-3);
  });
});

describe('tangent length and arc distance', () => {
  it.each([0.5, 2, 30, 1500, 9000])('tangent² = 2R′h + h² and tangent > arc for h = %p m', (h) => {
    const r = effectiveRadius({ k: 0.13 }).value ?? NaN;
    const t = tangentLength(h, { k: 0.13 }).value ?? NaN;
    // Source: Pythagoras in the triangle centre–eye–tangent point. Tolerance 1e-12 relative.
    expectRelative(t * t, 2 * r * h + h * h, 1e-12);
    expect(t).toBeGreaterThan(horizonDistance(h, { k: 0.13 }).value ?? Infinity);
  });

  it('is monotonic in height and in k below 1', () => {
    const byHeight = [0, 1, 10, 100, 1000].map((h) => horizonDistance(h).value ?? NaN);
    const byK = [-0.5, 0, 0.13, 0.25, 0.5, 0.9].map((k) => horizonDistance(10, { k }).value ?? NaN);
    // Source: none — monotonicity properties of R′·acos(R′/(R′ + h)).
    for (let i = 1; i < byHeight.length; i += 1) expect(byHeight[i]).toBeGreaterThan(byHeight[i - 1] ?? Infinity);
    for (let i = 1; i < byK.length; i += 1) expect(byK[i]).toBeGreaterThan(byK[i - 1] ?? Infinity);
  });
});

describe('effective radius', () => {
  it('is about 8 500 km for the 4/3 earth', () => {
    // Source: IEC 60050-705 (705-05-41) effective radius of the Earth, 4/3 of the actual radius, ≈ 8 500 km (the 8 500 km figure from memory). Tolerance 0.2 %.
    expectRelative(effectiveRadius({ k: 0.25 }).value, 8_500_000, 0.002);
  });

  it('defaults to k = 0.13 on the IUGG mean radius', () => {
    // Source: GRS 80 mean radius R₁ = 6 371 008.7714 m; R′ = R/(1 − 0.13). Tolerance 1 m.
    expectWithin(effectiveRadius().value, 6_371_008.7714 / 0.87, 1);
  });
});

describe('ducting and bad input', () => {
  it.each([1, 1.0000001, 1.5, 10])('k = %p gives flagged nulls, never NaN or Infinity', (k) => {
    for (const result of [
      effectiveRadius({ k }),
      horizonDistance(10, { k }),
      tangentLength(10, { k }),
      horizonDip(10, { k }),
      horizonDistanceApprox(10, { k }),
      horizonApproxRelativeError(10, { k }),
      horizonSag(10, 1, { k }),
    ]) {
      // Source: none — Kenning's contract for k ≥ 1 (no geometric horizon).
      expect(result).toEqual({ value: null, reason: 'ducting' });
    }
  });

  it('stays finite just below k = 1', () => {
    const d = horizonDistance(10, { k: 1 - 1e-15 }).value;
    // Source: none — numerical robustness of the atan2 form.
    expect(Number.isFinite(d)).toBe(true);
  });

  it.each([
    ['negative height', () => horizonDistance(-1)],
    ['NaN height', () => horizonDip(Number.NaN)],
    ['infinite height', () => tangentLength(Number.POSITIVE_INFINITY)],
    ['NaN k', () => horizonDistance(1, { k: Number.NaN })],
    ['zero radius', () => horizonDistance(1, { earthRadiusM: 0 })],
    ['latitude past the pole', () => localRadiusOfCurvature(2, 0)],
  ])('%s throws SightlineInputError', (_label, call) => {
    // Source: none — input contract.
    expect(call).toThrow(SightlineInputError);
  });

  it('does not mutate its options', () => {
    const options = deepFreeze({ k: 0.2, earthRadiusM: 6_378_000 });
    horizonDistance(10, options);
    horizonDip(10, options);
    // Source: none — purity contract.
    expect(options).toEqual({ k: 0.2, earthRadiusM: 6_378_000 });
  });
});

describe('local radius of curvature on WGS 84', () => {
  it('is b²/a along the meridian at the equator and a²/b at the pole', () => {
    // Source: GRS 80 derived constants (equatorial radius of curvature for a meridian b²/a = 6 335 439.3271 m; polar radius of curvature a²/b = 6 399 593.6259 m); WGS 84 differs from GRS 80 by ~0.1 mm here. Tolerance 0.01 m.
    expectWithin(localRadiusOfCurvature(0, 0), 6_335_439.3271, 0.01);
    expectWithin(localRadiusOfCurvature(Math.PI / 2, 1.234), 6_399_593.6259, 0.01);
  });

  it('is a along the equator (prime vertical) and lies between M and N otherwise', () => {
    // Source: NIMA TR8350.2: N = a at φ = 0; Euler's theorem gives M ≤ R_α ≤ N. Tolerance 1e-6 m.
    expectWithin(localRadiusOfCurvature(0, Math.PI / 2), 6_378_137, 1e-6);
    const lat = convertAngle(45, 'deg');
    const m = localRadiusOfCurvature(lat, 0);
    const n = localRadiusOfCurvature(lat, Math.PI / 2);
    const mid = localRadiusOfCurvature(lat, Math.PI / 4);
    expect(mid).toBeGreaterThan(m);
    expect(mid).toBeLessThan(n);
    // Source: Euler's theorem at α = 45°: 1/R = (1/M + 1/N)/2. Tolerance 1e-6 m.
    expectWithin(mid, 2 / (1 / m + 1 / n), 1e-6);
  });
});

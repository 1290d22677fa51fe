import { MEAN_EARTH_RADIUS_M, horizonDip, horizonDistance, hiddenHeight, refractionPreset } from '@/shared/sightline';
import { evaluateCalibration } from '@/shared/trainer/evaluate-calibration';
import { kFromDip } from '@/shared/trainer/k-from-dip';
import { kFromHiddenHeight } from '@/shared/trainer/k-from-hidden-height';
import { kFromReciprocalZenith } from '@/shared/trainer/k-from-reciprocal-zenith';
import { convertAngle } from '@/shared/units';
import { deepFreeze, expectRelative, expectWithin } from '@/tests/unit/sightline/tolerance';

const R = MEAN_EARTH_RADIUS_M;
const ARCMIN = (arcmin: number) => convertAngle(arcmin, 'arcmin', 'rad');
const ARCSEC = (arcsec: number) => convertAngle(arcsec / 60, 'arcmin', 'rad');

describe('k from a measured dip', () => {
  it.each([
    [2, -0.3],
    [10, 0],
    [25, 0.13],
    [50, 0.17],
    [300, 0.5],
    [3000, 0.9],
    [8000, 0.25],
  ])('returns the k that produced the dip (round trip), h = %p m, k = %p', (h, k) => {
    const dip = horizonDip(h, { k }).value ?? NaN;
    // Source: none — model identity: kFromDip inverts horizonDip exactly. Tolerance 1e-9.
    expectWithin(kFromDip(h, dip), k, 1e-9);
  });

  it('is the exact inversion, not the small-angle one: at 8 000 m they differ, the exact one round-trips', () => {
    const h = 8000;
    const dip = horizonDip(h, { k: 0.13 }).value ?? NaN;
    const smallAngle = 1 - (R * dip * dip) / (2 * h);
    // Source: small-angle dip δ² ≈ 2h(1 − k)/R (navigation and surveying texts, from memory). The small-angle
    // inversion is off by more than 1e-4 at this height, the exact one by less than 1e-9.
    expect(Math.abs(smallAngle - 0.13)).toBeGreaterThan(1e-4);
    expectWithin(kFromDip(h, dip), 0.13, 1e-9);
  });

  it.each([2, 5, 10, 20, 40])('agrees with the navigation-table dip 1.76′ √h(m) for standard refraction, h = %p m', (h) => {
    const tablesK = refractionPreset('nautical-tables').k;
    // Source: The Nautical Almanac / The American Practical Navigator (Bowditch), dip of the sea horizon,
    // dip = 1.76′ √h(m) under standard refraction (from memory; the same rule is checked forward in
    // tests/unit/sightline/horizon.test.ts). Bowditch's refraction β₀ = 0.8279 means k = 0.1721.
    // Tolerance 0.02 in k: 1.76 is rounded (±0.005 → ±0.6 % in dip → ±1.2 % in 1 − k ≈ ±0.01).
    expectWithin(kFromDip(h, ARCMIN(1.76 * Math.sqrt(h))), tablesK, 0.02);
  });

  it('has no k below 1 for a horizon at or above the horizontal', () => {
    // Source: none — model: k ≥ 1 has no geometric horizon (IEC 60050-705 effective radius infinite or negative).
    expect(kFromDip(10, 0)).toBeNull();
    expect(kFromDip(10, -ARCMIN(1))).toBeNull();
  });

  it('refuses a height of eye of 0 with the field named', () => {
    expect(() => kFromDip(0, ARCMIN(5))).toThrow(/eyeHeightM/);
  });
});

describe('k from reciprocal zenith angles', () => {
  it('matches a worked example built from the formula', () => {
    // Source: k = 1 − R(z₁ + z₂ − π)/S — G. Bomford, Geodesy, trigonometrical heighting (from memory). This is
    // not a printed worked example: it is constructed from the formula. A 5 km line, R = 6 371 km, k = 0.13:
    // z₁ + z₂ − 180° = 0.87 × 5 000 / 6 371 000 rad = 140.85″; z₁ = 89°40′00″, z₂ = 90°20′00″ + 140.85″.
    const z1 = convertAngle(89 + 40 / 60, 'deg', 'rad');
    const z2 = convertAngle(90 + 20 / 60, 'deg', 'rad') + ARCSEC(140.85);
    expectWithin(kFromReciprocalZenith(5000, z1, z2, 6_371_000), 0.13, 0.0005);
  });

  it.each([
    [2000, 0, 50, 0.13],
    [10_000, 120, 900, 0.2],
    [20_000, 5, 1500, -0.1],
    [15_000, 400, 30, 0.6],
  ])('recovers k from angles traced along a circular ray, S = %p m, heights %p / %p m, k = %p', (s, hA, hB, k) => {
    // Geometry independent of the formula: stations on a sphere of radius R, the ray a circle of radius R/k
    // through both. Chord zenith angles sum to π + γ (γ = S/R, triangle centre–A–B); the arc leaves each end
    // above the chord by asin(c·k/2R), c the chord length.
    const gamma = s / R;
    const a = R + hA;
    const b = R + hB;
    const chord = Math.sqrt(a * a + b * b - 2 * a * b * Math.cos(gamma));
    const angleAtA = Math.acos((a * a + chord * chord - b * b) / (2 * a * chord)); // between A→O and A→B
    const angleAtB = Math.acos((b * b + chord * chord - a * a) / (2 * b * chord));
    const lift = Math.asin((chord * k) / (2 * R));
    const z1 = Math.PI - angleAtA - lift;
    const z2 = Math.PI - angleAtB - lift;
    // Source: the reciprocal formula (Bomford, from memory) is first order in S/R and h/R; tolerance 1e-3 in k.
    expectWithin(kFromReciprocalZenith(s, z1, z2), k, 1e-3);
  });

  it('gives the range from each angle’s accuracy, both errors adding', () => {
    const zenith = convertAngle(90, 'deg', 'rad') + ARCSEC(50);
    const result = evaluateCalibration({
      method: 'reciprocal',
      distanceM: 10_000,
      zenithAngle1Deg: convertAngle(zenith, 'rad', 'deg'),
      zenithAngle2Deg: convertAngle(zenith, 'rad', 'deg'),
      accuracyArcsec: 2,
    });
    // Source: none — propagation of ±2″ on each angle: Δk = R·2·(2″)/S (worst case), ≈ 0.0124 on 10 km.
    const dk = (R * 2 * ARCSEC(2)) / 10_000;
    expectWithin((result.kMax ?? NaN) - (result.k ?? NaN), dk, 1e-9);
    expectWithin((result.k ?? NaN) - (result.kMin ?? NaN), dk, 1e-9);
    expect(result.resultKind).toBe('estimate');
  });
});

describe('k from a reference mark', () => {
  it.each([
    [10, 30_000, 0.2],
    [2, 20_000, 0.13],
    [50, 60_000, -0.2],
    [5, 40_000, 0.7],
  ])('returns the k whose hidden height was seen (round trip), h = %p m, d = %p m, k = %p', (h, d, k) => {
    const hidden = hiddenHeight(h, d, { k }).value ?? NaN;
    // Source: none — model identity: kFromHiddenHeight inverts hiddenHeight. Tolerance 1e-7.
    expectWithin(kFromHiddenHeight(h, d, hidden), k, 1e-7);
  });

  it('a base just visible bounds k from below where the horizon reaches the mark', () => {
    const k = kFromHiddenHeight(10, 15_000, 0) ?? NaN;
    // Source: none — model: nothing is hidden inside the horizon, so the least such k puts the horizon at d.
    expectRelative(horizonDistance(10, { k }).value, 15_000, 1e-6);
  });

  it('“top visible” is a lower bound, “not visible” an upper bound, at the k that hides the whole mark', () => {
    const shared = { method: 'mark' as const, eyeHeightM: 6, distanceM: 35_000, markHeightM: 40, accuracyM: 0 };
    const seen = evaluateCalibration({ ...shared, markVisible: true });
    const unseen = evaluateCalibration({ ...shared, markVisible: false });
    expect(seen).toMatchObject({ resultKind: 'lower-bound', k: null, kMax: null });
    expect(unseen).toMatchObject({ resultKind: 'upper-bound', k: null, kMin: null });
    const bound = seen.kMin ?? NaN;
    expectWithin(unseen.kMax, bound, 1e-9);
    // Source: none — model: at the bound exactly the whole 40 m is hidden; a little more refraction shows the top.
    expectWithin(hiddenHeight(6, 35_000, { k: bound }).value, 40, 1e-4);
    expect(hiddenHeight(6, 35_000, { k: bound + 0.01 }).value ?? NaN).toBeLessThan(40);
    expect(seen.warnings.map((w) => w.code)).toContain('bound-only');
  });

  it('the visible-from reading ± its accuracy gives kMin < k < kMax', () => {
    const result = evaluateCalibration({
      method: 'mark',
      eyeHeightM: 6,
      distanceM: 35_000,
      markHeightM: 40,
      observedVisibleFromM: 20,
      accuracyM: 2,
    });
    expect(result.resultKind).toBe('estimate');
    expect(result.kMin ?? NaN).toBeLessThan(result.k ?? NaN);
    expect(result.k ?? NaN).toBeLessThan(result.kMax ?? NaN);
    // Source: none — model identity.
    expectWithin(hiddenHeight(6, 35_000, { k: result.k ?? NaN }).value, 20, 1e-4);
  });
});

describe('evaluateCalibration', () => {
  it('gives k, its range, the effective radius and no warning for a standard dip', () => {
    const input = deepFreeze({ method: 'dip' as const, eyeHeightM: 25, observedDipArcmin: 1.76 * 5, accuracyArcmin: 0.2 });
    const result = evaluateCalibration(input);
    expect(result.kMin ?? NaN).toBeLessThan(result.k ?? NaN);
    expect(result.k ?? NaN).toBeLessThan(result.kMax ?? NaN);
    // Source: IEC 60050-705 (705-05-41): R′ = R/(1 − k). Tolerance 1e-9 relative.
    expectRelative(result.effectiveRadiusM, R / (1 - (result.k ?? NaN)), 1e-9);
    expect(result.regime).toBe('standard');
    expect(result.warnings).toEqual([]);
  });

  it('warns of a duct for a horizon above the horizontal, and of a strong inversion for a small dip', () => {
    const duct = evaluateCalibration({ method: 'dip', eyeHeightM: 10, observedDipArcmin: -0.5, accuracyArcmin: 0.2 });
    expect(duct).toMatchObject({ k: null, kMin: 1, kMax: null, resultKind: 'lower-bound', regime: 'ducting' });
    expect(duct.warnings.map((w) => w.code)).toContain('ducting');

    // k = 0.6: dip² = 2h(1 − k)/R.
    const dip = horizonDip(10, { k: 0.6 }).value ?? NaN;
    const inversion = evaluateCalibration({
      method: 'dip',
      eyeHeightM: 10,
      observedDipArcmin: convertAngle(dip, 'rad', 'arcmin'),
      accuracyArcmin: 0.1,
    });
    expect(inversion.regime).toBe('super-refraction');
    expect(inversion.warnings.map((w) => w.code)).toContain('super-refraction');
  });

  it('puts k from the weather readings beside it and warns when they disagree', () => {
    const dip = { method: 'dip' as const, eyeHeightM: 10, observedDipArcmin: 1.76 * Math.sqrt(10), accuracyArcmin: 0.1 };
    const standard = evaluateCalibration(dip, { pressureHpa: 1013.25, temperatureC: 15, lapseRateKPerM: 0.0065 });
    // Source: refractionFromTemperatureGradient's standard-atmosphere value ≈ 0.170 (ISO 2533 sea level,
    // −6.5 K/km; surveying relation k ≈ 503·P/T²·(0.0343 + dT/dh), from memory). Tolerance 0.002.
    expectWithin(standard.kFromWeather, 0.17, 0.002);
    expectWithin(standard.differenceFromWeather, (standard.k ?? NaN) - (standard.kFromWeather ?? NaN), 1e-12);
    expect(standard.warnings.map((w) => w.code)).not.toContain('weather-disagrees');

    const inversion = evaluateCalibration(dip, { pressureHpa: 1013.25, temperatureC: 5, lapseRateKPerM: -0.1 });
    expect(inversion.warnings.map((w) => w.code)).toContain('weather-disagrees');
  });
});

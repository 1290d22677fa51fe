import {
  classifyRefraction,
  effectiveRadius,
  horizonDistance,
  MEAN_EARTH_RADIUS_M,
  radioKFactor,
  REFRACTION_PRESET_IDS,
  REFRACTION_PRESETS,
  refractionBand,
  refractionFromRefractivityGradient,
  refractionFromTemperatureGradient,
  refractionFromTwoTemperatures,
  refractionPreset,
  SightlineInputError,
  type RefractionPresetId,
} from '@/shared/sightline';
import { deepFreeze, expectRelative, expectWithin } from '@/tests/unit/sightline/tolerance';

describe('k from pressure, temperature and temperature gradient', () => {
  it('gives k ≈ 0.171 for the standard atmosphere at sea level', () => {
    const k = refractionFromTemperatureGradient({
      pressureHpa: 1013.25,
      temperatureK: 288.15,
      temperatureGradientKPerM: -0.0065,
    });
    // Source: surveying relation k = 503·P/T²·(0.0343 + dT/dh) (from memory), evaluated by hand: 503 · 1013.25 / 288.15² · 0.0278 = 0.1706, with ISO 2533 sea-level P, T and −6.5 K/km. Tolerance 0.0005.
    expectWithin(k, 0.1706, 0.0005);
  });

  it('gives k = 0 when air density is constant with height (dT/dh = −0.0343 K/m)', () => {
    // Source: autoconvective gradient g/R_air ≈ 0.0342 K/m (constant density, no refraction). Tolerance 1e-12.
    expectWithin(
      refractionFromTemperatureGradient({ pressureHpa: 900, temperatureK: 300, temperatureGradientKPerM: -0.0343 }),
      0,
      1e-12,
    );
  });

  it('rises with an inversion and falls over heated ground', () => {
    const base = { pressureHpa: 1013.25, temperatureK: 288.15 };
    // Source: none — sign behaviour of the relation.
    expect(refractionFromTemperatureGradient({ ...base, temperatureGradientKPerM: 0.05 })).toBeGreaterThan(0.5);
    expect(refractionFromTemperatureGradient({ ...base, temperatureGradientKPerM: -0.1 })).toBeLessThan(0);
  });

  it('two readings give the same k as their gradient at the mean temperature', () => {
    const k2 = refractionFromTwoTemperatures({
      airTemperatureK: 281,
      surfaceTemperatureK: 285,
      airHeightM: 12,
      surfaceHeightM: 2,
      pressureHpa: 990,
    });
    const k1 = refractionFromTemperatureGradient({ pressureHpa: 990, temperatureK: 283, temperatureGradientKPerM: -0.4 });
    // Source: none — finite-difference definition. Tolerance 1e-12.
    expectWithin(k2, k1, 1e-12);
  });

  it('rejects equal heights, zero pressure and temperatures at or below 0 K', () => {
    // Source: none — input contract.
    expect(() =>
      refractionFromTwoTemperatures({ airTemperatureK: 281, surfaceTemperatureK: 285, airHeightM: 2, surfaceHeightM: 2 }),
    ).toThrow(SightlineInputError);
    expect(() => refractionFromTemperatureGradient({ pressureHpa: 0, temperatureK: 280, temperatureGradientKPerM: 0 })).toThrow(
      SightlineInputError,
    );
    expect(() => refractionFromTemperatureGradient({ pressureHpa: 1000, temperatureK: 0, temperatureGradientKPerM: 0 })).toThrow(
      SightlineInputError,
    );
  });
});

describe('k from a refractivity gradient and the radio k-factor', () => {
  it('the standard −40 N/km gives K ≈ 4/3', () => {
    const k = refractionFromRefractivityGradient(-40 / 1000);
    // Source: ITU-R P.453 standard refractivity gradient ≈ −40 N/km in the first kilometre (from memory); IEC 60050-705 (705-05-41) K = 4/3. Tolerance 1 %.
    expectRelative(radioKFactor(k).value, 4 / 3, 0.01);
  });

  it('ducting starts at dN/dh ≈ −157 N/km (k = 1)', () => {
    // Source: ITU-R P.834 / radio meteorology: ducting when dN/dh < −157 N/km (from memory). Tolerance 0.3 %.
    expectRelative(refractionFromRefractivityGradient(-157 / 1000), 1, 0.003);
    expect(classifyRefraction(refractionFromRefractivityGradient(-160 / 1000))).toBe('ducting');
    expect(classifyRefraction(refractionFromRefractivityGradient(-150 / 1000))).toBe('super-refraction');
  });

  it('K = 1/(1 + R·dN/dh·1e-6) equals 1/(1 − k)', () => {
    for (const perKm of [-100, -40, 0, 30]) {
      const k = refractionFromRefractivityGradient(perKm / 1000);
      // Source: ITU-R P.834 k-factor definition. Tolerance 1e-12 relative.
      expectRelative(radioKFactor(k).value, 1 / (1 + MEAN_EARTH_RADIUS_M * (perKm / 1000) * 1e-6), 1e-12);
    }
  });

  it('K and R′ do not exist from k = 1 on', () => {
    // Source: none — Kenning's contract (K infinite at 1, negative beyond).
    expect(radioKFactor(1)).toEqual({ value: null, reason: 'ducting' });
    expect(radioKFactor(2)).toEqual({ value: null, reason: 'ducting' });
    expect(effectiveRadius({ k: 2 })).toEqual({ value: null, reason: 'ducting' });
  });
});

describe('regime classifier', () => {
  it.each([
    [-0.5, 'sub-refraction'],
    [-1e-9, 'sub-refraction'],
    [0, 'standard'],
    [0.13, 'standard'],
    [0.25, 'standard'],
    [0.49, 'standard'],
    [0.5, 'super-refraction'],
    [0.99, 'super-refraction'],
    [1, 'ducting'],
    [4, 'ducting'],
  ] as const)('k = %p is %s', (k, regime) => {
    // Source: band edges 0, 0.5 (≈ −79 N/km), 1 (≈ −157 N/km), radio-meteorology classes (from memory) as documented in classifyRefraction.
    expect(classifyRefraction(k)).toBe(regime);
  });

  it('rejects a non-finite k', () => {
    // Source: none — input contract.
    expect(() => classifyRefraction(Number.NaN)).toThrow(SightlineInputError);
  });
});

describe('named conditions', () => {
  const expected: Record<RefractionPresetId, ReturnType<typeof classifyRefraction>> = {
    'no-refraction': 'standard',
    'standard-optical': 'standard',
    'levelling-one-seventh': 'standard',
    'nautical-tables': 'standard',
    'standard-atmosphere': 'standard',
    'radio-four-thirds': 'standard',
    'sub-refraction-heated-ground': 'sub-refraction',
    'super-refraction-inversion': 'super-refraction',
    'ducting-strong-inversion': 'ducting',
  };

  it('each id is listed once, has a label, definition and source, and falls in its regime', () => {
    expect(REFRACTION_PRESETS.map((p) => p.id)).toEqual([...REFRACTION_PRESET_IDS]);
    for (const preset of REFRACTION_PRESETS) {
      expect(Number.isFinite(preset.k)).toBe(true);
      expect(preset.label.length).toBeGreaterThan(3);
      expect(preset.definition.length).toBeGreaterThan(3);
      expect(preset.source.length).toBeGreaterThan(3);
      // Source: none — the presets are named after their regime.
      expect(classifyRefraction(preset.k)).toBe(expected[preset.id]);
    }
  });

  it('carry the published values', () => {
    // Source: geometric (k = 0); surveying convention 0.13 (common practice, no source); levelling 1/7 (surveying texts); Bowditch β₀ = 0.8279; IEC 60050-705 4/3 earth. Tolerance 1e-12.
    expectWithin(refractionPreset('no-refraction').k, 0, 1e-12);
    expectWithin(refractionPreset('standard-optical').k, 0.13, 1e-12);
    expectWithin(refractionPreset('levelling-one-seventh').k, 1 / 7, 1e-12);
    expectWithin(refractionPreset('nautical-tables').k, 0.1721, 1e-12);
    expectWithin(refractionPreset('radio-four-thirds').k, 0.25, 1e-12);
  });

  it('temperature-defined presets state P, T and dT/dh and match the relation', () => {
    for (const id of [
      'standard-atmosphere',
      'sub-refraction-heated-ground',
      'super-refraction-inversion',
      'ducting-strong-inversion',
    ] as const) {
      const preset = refractionPreset(id);
      const match = /P = ([\d.]+) hPa, T = ([\d.]+) K, dT\/dh = (-?[\d.]+) K\/m/.exec(preset.definition);
      expect(match).not.toBeNull();
      const [, p, t, g] = match ?? [];
      // Source: surveying relation k = 503·P/T²·(0.0343 + dT/dh) (from memory), re-evaluated from the stated inputs. Tolerance 1e-9.
      expectWithin(preset.k, ((503 * Number(p)) / Number(t) ** 2) * (0.0343 + Number(g)), 1e-9);
    }
  });

  it('are frozen and unknown ids throw', () => {
    // Source: none — contract.
    expect(Object.isFrozen(REFRACTION_PRESETS)).toBe(true);
    expect(Object.isFrozen(REFRACTION_PRESETS[0])).toBe(true);
    expect(() => refractionPreset('nope' as RefractionPresetId)).toThrow(SightlineInputError);
  });
});

describe('uncertainty band over k', () => {
  it('sweeps 0 … 0.3 in 0.05 steps and reports the extremes of the horizon distance', () => {
    const band = refractionBand((k) => horizonDistance(10, { k }).value);
    // Source: none — sweep definition (7 points, ends included).
    expect(band.series.map((p) => p.k)).toEqual([0, 0.05, 0.1, 0.15, 0.2, 0.25, 0.3]);
    expect(band.min?.k).toBe(0);
    expect(band.max?.k).toBe(0.3);
    // Source: none — horizon ∝ 1/√(1 − k) for h ≪ R. Tolerance 1e-6 relative.
    expectRelative((band.max?.value ?? NaN) / (band.min?.value ?? NaN), 1 / Math.sqrt(0.7), 1e-6);
  });

  it('keeps nulls through the ducting edge and never holds NaN', () => {
    const band = refractionBand((k) => horizonDistance(10, { k }).value, { kMin: 0.9, kMax: 1.1, step: 0.05 });
    // Source: none — Kenning's contract.
    expect(band.series.map((p) => p.value === null)).toEqual([false, false, true, true, true]);
    expect(band.series.every((p) => p.value === null || Number.isFinite(p.value))).toBe(true);
    const none = refractionBand(() => Number.NaN);
    expect(none.min).toBeNull();
    expect(none.series.every((p) => p.value === null)).toBe(true);
  });

  it('rejects a bad sweep and does not mutate it', () => {
    const sweep = deepFreeze({ kMin: 0, kMax: 0.3, step: 0.1 });
    refractionBand((k) => k, sweep);
    // Source: none — contract.
    expect(sweep).toEqual({ kMin: 0, kMax: 0.3, step: 0.1 });
    expect(() => refractionBand((k) => k, { step: 0 })).toThrow(SightlineInputError);
    expect(() => refractionBand((k) => k, { kMin: 1, kMax: 0 })).toThrow(SightlineInputError);
    expect(() => refractionBand((k) => k, { kMin: 0, kMax: 1, step: 1e-6 })).toThrow(SightlineInputError);
  });
});

import {
  BACKGROUND_LIGHTING_FACTOR,
  detectionRange,
  NAUTICAL_MILE_M,
  NIGHT_THRESHOLD_ILLUMINANCE_LUX,
  ONE_ARCMINUTE_RAD,
  SightlineInputError,
} from '@/shared/sightline';
import { evaluateSightline } from '@/shared/sightline/evaluate-sightline';
import { formatK } from '@/shared/sightline/format-k';
import { luminousRange } from '@/shared/sightline/luminous-range';
import { waveScreenHeight } from '@/shared/sightline/wave-screen';
import { SightlineRequestSchema } from '@/shared/schemas/sightline';
import { deepFreeze, expectRelative, expectWithin } from '@/tests/unit/sightline/tolerance';

const NMI = NAUTICAL_MILE_M;

describe('luminous range (Allard’s law, IALA night threshold)', () => {
  it('a light of about 1 400 cd has a nominal range of 10 nmi', () => {
    // Source: IALA Recommendation E-200-2, nominal range (0.2 µlx, T = 0.74/nmi for 10 nmi visibility), as quoted in the
    // IES definition "nominal range of a light signal"; the 10 nmi ≈ 1 400 cd pair from memory of its table. Tolerance 1 %.
    expectRelative(luminousRange({ intensityCd: 1400 }), 10 * NMI, 0.01);
  });

  it('agrees with two more entries of the nominal-range table (5 and 20 nmi)', () => {
    // Source: IALA Recommendation E-200-2 table of nominal range against intensity — from memory: 5 nmi ≈ 77 cd,
    // 20 nmi ≈ 1.1 × 10⁵ cd (the table is rounded to two figures, so tolerance 3 %).
    expectRelative(luminousRange({ intensityCd: 77 }), 5 * NMI, 0.03);
    expectRelative(luminousRange({ intensityCd: 1.1e5 }), 20 * NMI, 0.03);
  });

  it('puts the threshold illuminance at the eye at the range it returns', () => {
    // Source: Allard's law E = I·T^(d/d₀)/d² with T = 0.05^(d₀/V) (CIE S 017:2020, 17-31-025, note 2). Tolerance 1e-6 relative.
    for (const [intensityCd, visibilityMorM] of [
      [15_000, 5_000],
      [15_000, 40_000],
      [10, 2_000],
      [3e5, 18_520],
    ] as const) {
      const d = luminousRange({ intensityCd, visibilityMorM });
      const illuminance = (intensityCd * 0.05 ** (d / visibilityMorM)) / (d * d);
      expectRelative(illuminance, NIGHT_THRESHOLD_ILLUMINANCE_LUX, 1e-6);
    }
  });

  it('shrinks in haze and against background lights', () => {
    // Source: none — monotonicity of Allard's law in T and in the threshold.
    const clear = luminousRange({ intensityCd: 15_000, visibilityMorM: 30_000 });
    const haze = luminousRange({ intensityCd: 15_000, visibilityMorM: 3_000 });
    const lit = luminousRange({
      intensityCd: 15_000,
      visibilityMorM: 30_000,
      thresholdLux: NIGHT_THRESHOLD_ILLUMINANCE_LUX * BACKGROUND_LIGHTING_FACTOR.much,
    });
    expect(haze).toBeLessThan(clear / 3);
    expect(lit).toBeLessThan(clear);
  });

  it('rejects a non-positive intensity or visibility', () => {
    // Source: none — input contract.
    expect(() => luminousRange({ intensityCd: 0 })).toThrow(SightlineInputError);
    expect(() => luminousRange({ intensityCd: 10, visibilityMorM: -1 })).toThrow(SightlineInputError);
  });
});

describe('wave screen', () => {
  it('is half the significant wave height (crest amplitude of a linear sea)', () => {
    // Source: linear (Airy) wave theory, crest amplitude H/2 (Coastal Engineering Manual EM 1110-2-1100 II-1) — from memory. Tolerance 1e-12 m.
    expectWithin(waveScreenHeight({ significantWaveHeightM: 2 }), 1, 1e-12);
    expectWithin(waveScreenHeight({ significantWaveHeightM: 0 }), 0, 1e-12);
  });

  it('reads a sea-state degree as the upper edge of its WMO code table 3700 range', () => {
    // Source: WMO-No. 306 code table 3700 — from memory: 3 slight 0.5–1.25 m, 5 rough 2.5–4 m, 0 calm (glassy) 0 m. Tolerance 1e-12 m.
    expectWithin(waveScreenHeight({ seaState: 3 }), 0.625, 1e-12);
    expectWithin(waveScreenHeight({ seaState: 5 }), 2, 1e-12);
    expectWithin(waveScreenHeight({ seaState: 0 }), 0, 1e-12);
  });

  it('rejects degrees outside 0–9 and fractions', () => {
    // Source: none — input contract.
    expect(() => waveScreenHeight({ seaState: 10 })).toThrow(SightlineInputError);
    expect(() => waveScreenHeight({ seaState: 2.5 })).toThrow(SightlineInputError);
  });
});

describe('detection range: one model for day, night and sea', () => {
  const person = { observerHeightM: 25, targetHeightM: 0.3, targetSizeM: 0.3, visibilityM: 20_000 } as const;

  it('by day a person in the water is limited by angular size long before visibility', () => {
    const result = detectionRange(person);
    // Source: 1′ acuity of 20/20 vision (Snellen) — d = s / (2 tan(θ/2)). Tolerance 1e-6 relative.
    expectRelative(result.rangeM, 0.3 / (2 * Math.tan(ONE_ARCMINUTE_RAD / 2)), 1e-6);
    expect(result.limitedBy).toBe('angular-size');
    expect(result.rangeLimit).toEqual({ rangeM: result.rangeM, limitedBy: 'angular-size' });
  });

  it('converts a 2 % visibility to the 5 % threshold before using it', () => {
    const r = detectionRange({
      observerHeightM: 25,
      targetHeightM: 10,
      visibilityM: 13_058,
      visibilityKind: 'meteorological-range-2pct',
    });
    // Source: Koschmieder, V_5% = V_2% · ln 0.05 / ln 0.02 (AMS Glossary; CIE S 017 / WMO-No. 8). Tolerance 0.1 %.
    expectRelative(r.limits.visibilityM, (13_058 * Math.log(0.05)) / Math.log(0.02), 0.001);
    expect(r.limitedBy).toBe('visibility');
  });

  it('waves hide a head in a slight sea but not a raft', () => {
    const screen = waveScreenHeight({ seaState: 3 });
    const head = detectionRange({ ...person, waveScreenM: screen });
    // Source: none — the model: 0.3 m of head under 0.625 m crests.
    expect(head).toMatchObject({ rangeM: 0, limitedBy: 'sea-state', reason: 'screened-by-waves' });
    const raft = detectionRange({
      observerHeightM: 25,
      targetHeightM: 1.2,
      targetSizeM: 2,
      visibilityM: 20_000,
      waveScreenM: screen,
    });
    expect(raft.limitedBy).toBe('angular-size');
    expect(raft.rangeM).toBeGreaterThan(1000);
  });

  it('at night a hand flare is limited by the horizon in clear air and by its luminous range in haze', () => {
    // Source: IMO LSA Code 3.2: a hand flare burns at not less than 15 000 cd (read in the code's summary; from memory).
    const flare = { observerHeightM: 25, targetHeightM: 1, lightIntensityCd: 15_000, period: 'night' } as const;
    const clear = detectionRange({ ...flare, visibilityM: 40_000 });
    expect(clear.limitedBy).toBe('horizon');
    expect(clear.rangeM).toBeGreaterThan(10_000);
    const haze = detectionRange({ ...flare, visibilityM: 2_000 });
    expect(haze.limitedBy).toBe('luminous-range');
    expect(haze.rangeM).toBeLessThan(clear.rangeM!);
    expect(haze.rangeM).toBeGreaterThan(2_000);
  });

  it('at night an unlit target is not detected, and the daytime limits do not apply', () => {
    const r = detectionRange({ ...person, period: 'night' });
    // Source: none — the model: only lights are seen at night.
    expect(r).toMatchObject({ rangeM: 0, limitedBy: 'luminous-range', reason: 'unlit-at-night' });
    expect(r.limits.angularSizeM).toBeNull();
    expect(r.limits.visibilityM).toBeNull();
  });

  it('does not mutate its input', () => {
    const input = deepFreeze({ ...person, waveScreenM: 0.1 });
    expect(() => detectionRange(input)).not.toThrow();
  });
});

describe('evaluateSightline with the detection model', () => {
  it('gives detectionRangeM, limitedBy and luminousRangeM for a light at night', () => {
    const request = SightlineRequestSchema.parse({
      observerHeightM: 30,
      targetHeightM: 1,
      lightIntensityCd: 1400,
      period: 'night',
      visibilityM: 10 * NMI,
      conditions: [{ k: 0 }],
    });
    const [result] = evaluateSightline(request).results;
    // Source: IALA nominal range, 1 400 cd ≈ 10 nmi at 10 nmi visibility (as above). Tolerance 1 %.
    expectRelative(result?.luminousRangeM, 10 * NMI, 0.01);
    expect(result?.limitedBy).toBe('luminous-range');
    expect(result?.detectionRangeM).toBe(result?.luminousRangeM);
  });

  it('warns plainly near k = 1 and never prints 0.9996 as 1', () => {
    const [result] = evaluateSightline({ observerHeightM: 10, conditions: [{ k: 0.9996 }] }).results;
    // Source: none — contract.
    expect(result?.regime).toBe('super-refraction');
    expect(result?.warnings.map((w) => w.code)).toContain('near-ducting');
    expect(result?.warnings.find((w) => w.code === 'super-refraction')?.message).toContain('k = 0.9996');
    expect(formatK(0.9996)).toBe('0.9996');
    expect(formatK(0.13)).toBe('0.13');
    expect(formatK(-0.0004)).toBe('-0.0004');
    expect(formatK(1)).toBe('1');
  });

  it('refuses a sea state and a wave height together, and a fractional degree', () => {
    const both = SightlineRequestSchema.safeParse({
      observerHeightM: 5,
      seaState: 2,
      significantWaveHeightM: 1,
      conditions: [{ k: 0 }],
    });
    // Source: none — input contract.
    expect(both.success).toBe(false);
    expect(both.error?.issues[0]?.path).toEqual(['significantWaveHeightM']);
    expect(SightlineRequestSchema.safeParse({ observerHeightM: 5, seaState: 2.5, conditions: [{ k: 0 }] }).success).toBe(false);
  });
});

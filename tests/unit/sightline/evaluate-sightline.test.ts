import { evaluateSightline } from '@/shared/sightline/evaluate-sightline';
import { SightlineResponseSchema, type SightlineRequest, type SightlineResult } from '@/shared/schemas/sightline';
import { geographicRange, hiddenHeight, horizonDistance, refractionPreset } from '@/shared/sightline';
import { convertLength } from '@/shared/units';
import { deepFreeze, expectRelative, expectWithin, numbersIn } from '@/tests/unit/sightline/tolerance';

const NULLABLE_FIELDS = [
  'effectiveRadiusM',
  'horizonDistanceM',
  'tangentLengthM',
  'dipDeg',
  'hiddenHeightM',
  'visibleHeightM',
  'geographicRangeM',
  'detectionRangeM',
] as const satisfies readonly (keyof SightlineResult)[];

const ALL_KINDS: SightlineRequest['conditions'] = [
  { preset: 'standard-optical' },
  { k: 0 },
  { k: 1 },
  { k: 1.6 },
  { k: -10 },
  { preset: 'ducting-strong-inversion' },
  { pressureHpa: 1013.25, temperatureC: 15, lapseRateKPerM: 0.0065 },
  { airTemperatureC: 8, surfaceTemperatureC: 14, airHeightM: 10, surfaceHeightM: 0 },
  { airTemperatureC: 20, surfaceTemperatureC: 4, airHeightM: 30, surfaceHeightM: 0, pressureHpa: 1000 },
  { refractivityGradientNPerKm: -40 },
  { refractivityGradientNPerKm: -300 },
];

const REQUESTS: SightlineRequest[] = [
  { observerHeightM: 12, targetHeightM: 30, distanceM: 25_000, conditions: ALL_KINDS },
  { observerHeightM: 0, conditions: ALL_KINDS },
  { observerHeightM: 2, distanceM: 1_900_000, conditions: ALL_KINDS },
  {
    observerHeightM: 1500,
    targetHeightM: 8,
    distanceM: 90_000,
    requiredVisibleM: 3,
    visibilityM: 40_000,
    visibilityKind: 'meteorological-range-2pct',
    targetSizeM: 4,
    resolutionArcmin: 3,
    earthRadiusM: 6_378_137,
    conditions: ALL_KINDS,
  },
  { observerHeightM: 100_000, targetHeightM: 100_000, distanceM: 2_000_000, conditions: ALL_KINDS },
];

describe('evaluateSightline', () => {
  it.each(REQUESTS.map((r, i) => [i, r] as const))(
    'request %p: every number is finite and every null is explained',
    (_i, request) => {
      const response = evaluateSightline(request);
      // Source: none — Kenning's contract: never NaN/Infinity, null only with a warning.
      for (const value of numbersIn(response)) expect(Number.isFinite(value)).toBe(true);
      const roundTrip = JSON.parse(JSON.stringify(response)) as unknown;
      expect(roundTrip).toEqual(response);
      expect(SightlineResponseSchema.safeParse(response).success).toBe(true);
      expect(response.results).toHaveLength(request.conditions.length);
      for (const result of response.results) {
        const nulls = NULLABLE_FIELDS.filter((field) => result[field] === null);
        if (nulls.length > 0) expect(result.warnings.length).toBeGreaterThan(0);
        if (result.detectionRangeM === null) expect(result.limitedBy).toBeNull();
        else expect(result.limitedBy).not.toBeNull();
      }
    },
  );

  it('always includes the four cautions', () => {
    const codes = evaluateSightline(REQUESTS[1] as SightlineRequest).cautions.map((c) => c.code);
    // Source: none — product requirement.
    expect(codes).toEqual(['estimates-only', 'refraction-varies', 'visibility-not-detection', 'follow-procedures']);
  });

  it('answers each condition in order with the k it implies', () => {
    const ks = evaluateSightline(REQUESTS[0] as SightlineRequest).results.map((r) => r.k);
    // Source: none — order and conversions. Tolerance 1e-12.
    expectWithin(ks[0], refractionPreset('standard-optical').k, 1e-12);
    expectWithin(ks[1], 0, 1e-12);
    expectWithin(ks[3], 1.6, 1e-12);
    expectWithin(ks[5], refractionPreset('ducting-strong-inversion').k, 1e-12);
    // Source: lapse rate Γ = −dT/dh; Γ = 0.0065 K/m at 15 °C, 1013.25 hPa is the ISO 2533 standard atmosphere. Tolerance 1e-9.
    expectWithin(ks[6], refractionPreset('standard-atmosphere').k, 1e-9);
    // Source: warm surface under cool air gives a gradient steeper than −0.0343 K/m, hence sub-refraction (surveying relation).
    expect(ks[7]).toBeLessThan(0);
    // Source: ITU-R P.834 ducting below −157 N/km (from memory).
    expect(ks[10]).toBeGreaterThan(1);
  });

  it('matches the core and the navigation tables for one case', () => {
    const eye = convertLength(25, 'ft', 'm');
    const top = convertLength(100, 'ft', 'm');
    const earthRadiusM = 6_371_008.8;
    const [result] = evaluateSightline({
      observerHeightM: eye,
      targetHeightM: top,
      distanceM: 20_000,
      earthRadiusM,
      conditions: [{ preset: 'nautical-tables' }],
    }).results;
    const sphere = { k: refractionPreset('nautical-tables').k, earthRadiusM };
    // Source: The American Practical Navigator (Bowditch), Table 12: 1.17(√25 + √100) nmi = 17.55 nmi (R here is the IUGG mean, 0.001 % from r₀ = 3440.1 nmi). Tolerance 0.3 %.
    expectRelative(convertLength(result?.geographicRangeM ?? NaN, 'm', 'nmi'), 17.55, 0.003);
    // Source: none — the use case reports the core's values. Tolerance 1e-9 m.
    expectWithin(result?.horizonDistanceM, horizonDistance(eye, sphere).value ?? NaN, 1e-9);
    expectWithin(result?.hiddenHeightM, hiddenHeight(eye, 20_000, sphere).value ?? NaN, 1e-9);
    expectWithin(result?.geographicRangeM, geographicRange(eye, top, sphere).value ?? NaN, 1e-9);
    expect(result?.dipDeg).toBeGreaterThan(0);
    expect(result?.limitedBy).toBe('horizon');
  });

  it('flags ducting with nulls and an explanation', () => {
    const [result] = evaluateSightline({
      observerHeightM: 10,
      targetHeightM: 5,
      distanceM: 50_000,
      conditions: [{ k: 1.2 }],
    }).results;
    // Source: none — Kenning's contract for k ≥ 1.
    expect(result).toMatchObject({
      regime: 'ducting',
      effectiveRadiusM: null,
      horizonDistanceM: null,
      tangentLengthM: null,
      dipDeg: null,
      geographicRangeM: null,
      detectionRangeM: null,
      hiddenHeightM: 0,
      visibleHeightM: 5,
    });
    expect(result?.warnings.map((w) => w.code)).toEqual(['ducting', 'detection-unbounded']);
  });

  it('says why values that were not asked for are missing', () => {
    const [result] = evaluateSightline({ observerHeightM: 10, conditions: [{ k: 0.13 }] }).results;
    // Source: none — contract.
    expect(result?.hiddenHeightM).toBeNull();
    expect(result?.geographicRangeM).toBeNull();
    expect(result?.warnings.map((w) => w.code)).toEqual(['distance-not-given', 'target-height-not-given']);
    expect(result?.horizonDistanceM).not.toBeNull();
  });

  it('reports a target past the effective quarter circle as wholly hidden', () => {
    const [result] = evaluateSightline({
      observerHeightM: 2,
      targetHeightM: 500,
      distanceM: 1_500_000,
      conditions: [{ k: -10 }],
    }).results;
    // Source: none — contract.
    expect(result?.hiddenHeightM).toBeNull();
    expect(result?.visibleHeightM).toBe(0);
    expect(result?.warnings.map((w) => w.code)).toContain('beyond-effective-quarter');
  });

  it('does not mutate the request', () => {
    const request = deepFreeze(structuredClone(REQUESTS[3] as SightlineRequest));
    const copy = structuredClone(request);
    evaluateSightline(request);
    // Source: none — purity contract.
    expect(request).toEqual(copy);
  });
});

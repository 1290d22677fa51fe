import { RefractionPresetListSchema, SightlineRequestSchema, SightlineResponseSchema } from '@/shared/schemas/sightline';
import { REFRACTION_PRESETS } from '@/shared/sightline';

const valid = { observerHeightM: 10, conditions: [{ k: 0.13 }] };

function issuePaths(input: unknown): string[] {
  const result = SightlineRequestSchema.safeParse(input);
  expect(result.success).toBe(false);
  return result.success ? [] : result.error.issues.map((issue) => issue.path.join('.'));
}

describe('SightlineRequestSchema', () => {
  it('accepts a minimal and a full request and narrows conditions', () => {
    // Source: none — schema contract.
    expect(SightlineRequestSchema.parse(valid)).toEqual(valid);
    const full = SightlineRequestSchema.parse({
      observerHeightM: 1500,
      targetHeightM: 8,
      distanceM: 90_000,
      requiredVisibleM: 3,
      earthRadiusM: 6_378_137,
      visibilityM: 40_000,
      visibilityKind: 'mor-5pct',
      targetSizeM: 4,
      resolutionArcmin: 2,
      conditions: [
        { preset: 'radio-four-thirds' },
        { pressureHpa: 1000, temperatureC: 12, lapseRateKPerM: 0.0065 },
        { airTemperatureC: 8, surfaceTemperatureC: 14, airHeightM: 10, surfaceHeightM: 0 },
        { refractivityGradientNPerKm: -40 },
      ],
    });
    expect(full.conditions).toHaveLength(4);
    expect(full.conditions[2]).toEqual({ airTemperatureC: 8, surfaceTemperatureC: 14, airHeightM: 10, surfaceHeightM: 0 });
  });

  it.each([
    ['negative observer height', { ...valid, observerHeightM: -1 }, 'observerHeightM'],
    ['missing observer height', { conditions: [{ k: 0 }] }, 'observerHeightM'],
    ['negative target height', { ...valid, targetHeightM: -5 }, 'targetHeightM'],
    ['absurd height', { ...valid, observerHeightM: 1e7 }, 'observerHeightM'],
    ['absurd distance', { ...valid, distanceM: 3_000_000 }, 'distanceM'],
    ['string distance', { ...valid, distanceM: '12' }, 'distanceM'],
    ['k out of bounds', { ...valid, conditions: [{ k: 20 }] }, 'conditions.0.k'],
    ['unknown preset', { ...valid, conditions: [{ preset: 'fog' }] }, 'conditions.0.preset'],
    ['missing lapse rate', { ...valid, conditions: [{ pressureHpa: 1000, temperatureC: 10 }] }, 'conditions.0.lapseRateKPerM'],
    [
      'missing surface height',
      { ...valid, conditions: [{ airTemperatureC: 5, surfaceTemperatureC: 9, airHeightM: 3 }] },
      'conditions.0.surfaceHeightM',
    ],
    [
      'equal heights',
      { ...valid, conditions: [{ airTemperatureC: 5, surfaceTemperatureC: 9, airHeightM: 3, surfaceHeightM: 3 }] },
      'conditions.0.airHeightM',
    ],
    ['mixed kinds', { ...valid, conditions: [{ k: 0.1, preset: 'no-refraction' }] }, 'conditions.0'],
    ['empty condition', { ...valid, conditions: [{}] }, 'conditions.0'],
    ['unknown field', { ...valid, conditions: [{ k: 0.1, kk: 1 }] }, 'conditions.0'],
    [
      'absurd pressure',
      { ...valid, conditions: [{ pressureHpa: 5000, temperatureC: 10, lapseRateKPerM: 0.0065 }] },
      'conditions.0.pressureHpa',
    ],
    ['no conditions', { ...valid, conditions: [] }, 'conditions'],
    ['required part above target', { ...valid, targetHeightM: 5, requiredVisibleM: 6 }, 'requiredVisibleM'],
    ['required part without target', { ...valid, requiredVisibleM: 1 }, 'requiredVisibleM'],
    ['zero target size', { ...valid, targetSizeM: 0 }, 'targetSizeM'],
    ['bad visibility kind', { ...valid, visibilityM: 5000, visibilityKind: 'fog' }, 'visibilityKind'],
    ['earth radius of the moon', { ...valid, earthRadiusM: 1_737_400 }, 'earthRadiusM'],
    ['NaN height', { ...valid, observerHeightM: Number.NaN }, 'observerHeightM'],
  ])('rejects %s with a field path', (_label, input, path) => {
    // Source: none — schema contract (field errors for the form).
    expect(issuePaths(input)).toContain(path);
  });
});

describe('SightlineResponseSchema and the preset list', () => {
  const result = {
    k: 0.13,
    regime: 'standard',
    effectiveRadiusM: 7_322_998.6,
    horizonDistanceM: 11_000,
    tangentLengthM: 11_000.1,
    dipDeg: 0.09,
    hiddenHeightM: null,
    visibleHeightM: null,
    geographicRangeM: null,
    detectionRangeM: null,
    limitedBy: null,
    warnings: [{ code: 'distance-not-given', message: 'No distance given.' }],
  };

  it('accepts a well-formed response and rejects non-finite numbers', () => {
    // Source: none — schema contract.
    expect(SightlineResponseSchema.safeParse({ results: [result], cautions: [] }).success).toBe(true);
    expect(
      SightlineResponseSchema.safeParse({ results: [{ ...result, dipDeg: Number.POSITIVE_INFINITY }], cautions: [] }).success,
    ).toBe(false);
    expect(
      SightlineResponseSchema.safeParse({ results: [{ ...result, horizonDistanceM: Number.NaN }], cautions: [] }).success,
    ).toBe(false);
  });

  it('describes the preset list endpoint body', () => {
    // Source: none — schema contract.
    expect(RefractionPresetListSchema.safeParse({ presets: REFRACTION_PRESETS }).success).toBe(true);
    expect(
      RefractionPresetListSchema.safeParse({ presets: [{ id: 'fog', label: 'x', k: 0, definition: 'x', source: 'x' }] }).success,
    ).toBe(false);
  });
});

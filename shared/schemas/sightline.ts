// Over 300 lines: the whole sightline request and result contract, field by field with units and docs.
import { z } from 'zod';

import { REFRACTION_PRESET_IDS } from '@/shared/sightline/refraction-presets';

/*
 * Sightline API: request and response of the sightline evaluation, and the
 * list of named refraction conditions. Lengths in metres, angles in degrees
 * at this edge (arcminutes for the eye's resolution), temperatures in °C,
 * pressure in hPa. The computational core behind it works in SI units.
 */

const MAX_HEIGHT_M = 100_000;
const MAX_DISTANCE_M = 2_000_000;

const height = (what: string) =>
  z
    .number({ error: `${what} must be a number of metres.` })
    .min(0, `${what} cannot be negative.`)
    .max(MAX_HEIGHT_M, `${what} must be at most ${MAX_HEIGHT_M} m.`);

// ---------------------------------------------------------------------------
// Named refraction conditions

/** Identifier of one of Kenning's named refraction conditions. */
export const RefractionPresetIdSchema = z.enum(REFRACTION_PRESET_IDS, {
  error: `Unknown condition; use one of: ${REFRACTION_PRESET_IDS.join(', ')}.`,
});
export type RefractionPresetIdValue = z.infer<typeof RefractionPresetIdSchema>;

/** A named refraction condition as the preset list endpoint returns it. */
export const RefractionPresetSchema = z.object({
  id: RefractionPresetIdSchema,
  /** Short label for pickers. */
  label: z.string(),
  /** Refraction coefficient k, dimensionless. */
  k: z.number(),
  /** The physical value that defines it (for temperature cases: P in hPa, T in K, dT/dh in K/m). */
  definition: z.string(),
  /** Where the value or relation comes from. */
  source: z.string(),
});
export type RefractionPresetDto = z.infer<typeof RefractionPresetSchema>;

/** Body of the preset list endpoint: `{ presets: [...] }`. */
export const RefractionPresetListSchema = z.object({ presets: z.array(RefractionPresetSchema) });
export type RefractionPresetList = z.infer<typeof RefractionPresetListSchema>;

// ---------------------------------------------------------------------------
// Refraction conditions of a request

const kValue = z.number({ error: 'k must be a number.' }).min(-10, 'k must be at least −10.').max(10, 'k must be at most 10.');
/** Air pressure, hPa. */
const pressure = z
  .number({ error: 'Pressure must be a number of hPa.' })
  .min(10, 'Pressure must be at least 10 hPa.')
  .max(1100, 'Pressure must be at most 1100 hPa.');
/** Air temperature, °C. */
const airTemperature = z
  .number({ error: 'Temperature must be a number of °C.' })
  .min(-90, 'Temperature must be at least −90 °C.')
  .max(60, 'Temperature must be at most 60 °C.');
/** Surface (ground or water) temperature, °C. */
const surfaceTemperature = z
  .number({ error: 'Temperature must be a number of °C.' })
  .min(-90, 'Temperature must be at least −90 °C.')
  .max(90, 'Temperature must be at most 90 °C.');
/** Lapse rate Γ = −dT/dh, K/m (positive when the air cools with height; standard 0.0065). */
const lapseRate = z
  .number({ error: 'Lapse rate must be a number of K/m.' })
  .min(-10, 'Lapse rate must be at least −10 K/m.')
  .max(10, 'Lapse rate must be at most 10 K/m.');
/** Vertical refractivity gradient dN/dh, N-units per km (standard −40, ducting below −157). */
const refractivityGradient = z
  .number({ error: 'Refractivity gradient must be a number of N-units/km.' })
  .min(-2000, 'Refractivity gradient must be at least −2000 N/km.')
  .max(2000, 'Refractivity gradient must be at most 2000 N/km.');

/** A given refraction coefficient k (dimensionless, −10…10). */
export const KConditionSchema = z.strictObject({ k: kValue });
/** One of the named conditions. */
export const PresetConditionSchema = z.strictObject({ preset: RefractionPresetIdSchema });
/**
 * Pressure (hPa), air temperature (°C) and lapse rate Γ = −dT/dh (K/m,
 * positive when the air cools with height: 0.0065 is the standard
 * atmosphere; negative in an inversion). k from the surveying relation.
 */
export const LapseRateConditionSchema = z.strictObject({
  pressureHpa: pressure,
  temperatureC: airTemperature,
  lapseRateKPerM: lapseRate,
});
/**
 * Air temperature at one height and surface temperature at another (°C,
 * heights in metres above the surface datum; the heights must differ),
 * optional pressure (hPa, default 1013.25). The gradient between the two
 * readings gives k.
 */
export const TwoTemperatureConditionSchema = z.strictObject({
  airTemperatureC: airTemperature,
  surfaceTemperatureC: surfaceTemperature,
  airHeightM: height('Air-temperature height'),
  surfaceHeightM: height('Surface-temperature height'),
  pressureHpa: pressure.optional(),
});
/** A vertical refractivity gradient dN/dh, N-units per km. */
export const RefractivityConditionSchema = z.strictObject({ refractivityGradientNPerKm: refractivityGradient });

const CONDITION_KINDS = [
  { name: 'k', required: ['k'], optional: [] },
  { name: 'preset', required: ['preset'], optional: [] },
  { name: 'lapse rate', required: ['pressureHpa', 'temperatureC', 'lapseRateKPerM'], optional: [] },
  {
    name: 'two temperatures',
    required: ['airTemperatureC', 'surfaceTemperatureC', 'airHeightM', 'surfaceHeightM'],
    optional: ['pressureHpa'],
  },
  { name: 'refractivity gradient', required: ['refractivityGradientNPerKm'], optional: [] },
] as const;

/**
 * Every field any condition kind may carry, each with its bounds, so that
 * bad values are reported against their own field; the refinement then
 * checks that the fields present make up exactly one kind.
 */
const ConditionFieldsSchema = z
  .strictObject({
    k: kValue.optional(),
    preset: RefractionPresetIdSchema.optional(),
    pressureHpa: pressure.optional(),
    temperatureC: airTemperature.optional(),
    lapseRateKPerM: lapseRate.optional(),
    airTemperatureC: airTemperature.optional(),
    surfaceTemperatureC: surfaceTemperature.optional(),
    airHeightM: height('Air-temperature height').optional(),
    surfaceHeightM: height('Surface-temperature height').optional(),
    refractivityGradientNPerKm: refractivityGradient.optional(),
  })
  .superRefine((fields, ctx) => {
    const present = new Set(Object.keys(fields).filter((key) => fields[key as keyof typeof fields] !== undefined));
    // pressureHpa belongs to two kinds, so it alone does not pick one.
    const distinctive = (key: string) => key !== 'pressureHpa';
    const kinds = CONDITION_KINDS.filter((kind) => kind.required.some((key) => distinctive(key) && present.has(key)));
    if (kinds.length === 0 && present.has('pressureHpa')) kinds.push(CONDITION_KINDS[2]);
    if (kinds.length === 0) {
      ctx.addIssue({
        code: 'custom',
        message:
          'Give one refraction condition: { k }, { preset }, { pressureHpa, temperatureC, lapseRateKPerM }, ' +
          '{ airTemperatureC, surfaceTemperatureC, airHeightM, surfaceHeightM }, or { refractivityGradientNPerKm }.',
      });
      return;
    }
    if (kinds.length > 1) {
      ctx.addIssue({
        code: 'custom',
        message: `This condition mixes fields of several kinds (${kinds.map((kind) => kind.name).join(', ')}); give one kind per condition.`,
      });
      return;
    }
    const [kind] = kinds;
    if (kind === undefined) return;
    const allowed = new Set<string>([...kind.required, ...kind.optional]);
    for (const key of kind.required) {
      if (!present.has(key)) ctx.addIssue({ code: 'custom', path: [key], message: `Required for a ${kind.name} condition.` });
    }
    for (const key of present) {
      if (!allowed.has(key)) ctx.addIssue({ code: 'custom', path: [key], message: `Not part of a ${kind.name} condition.` });
    }
    if (kind.name === 'two temperatures' && fields.airHeightM !== undefined && fields.airHeightM === fields.surfaceHeightM) {
      ctx.addIssue({ code: 'custom', path: ['airHeightM'], message: 'The two temperature heights must differ.' });
    }
  });

/** One refraction condition, as the evaluation receives it: exactly one of five kinds. */
export type RefractionCondition =
  | z.infer<typeof KConditionSchema>
  | z.infer<typeof PresetConditionSchema>
  | z.infer<typeof LapseRateConditionSchema>
  | z.infer<typeof TwoTemperatureConditionSchema>
  | z.infer<typeof RefractivityConditionSchema>;

/**
 * One refraction condition. Exactly one of five kinds, told apart by their
 * fields; errors are reported against the offending field (a plain union
 * would report only "invalid input" for the whole condition). Parses to the
 * {@link RefractionCondition} union.
 */
export const RefractionConditionSchema = ConditionFieldsSchema.transform((f, ctx): RefractionCondition => {
  if (f.k !== undefined) return { k: f.k };
  if (f.preset !== undefined) return { preset: f.preset };
  if (f.refractivityGradientNPerKm !== undefined) return { refractivityGradientNPerKm: f.refractivityGradientNPerKm };
  if (
    f.airTemperatureC !== undefined &&
    f.surfaceTemperatureC !== undefined &&
    f.airHeightM !== undefined &&
    f.surfaceHeightM !== undefined
  ) {
    const temperatures = {
      airTemperatureC: f.airTemperatureC,
      surfaceTemperatureC: f.surfaceTemperatureC,
      airHeightM: f.airHeightM,
      surfaceHeightM: f.surfaceHeightM,
    };
    return f.pressureHpa === undefined ? temperatures : { ...temperatures, pressureHpa: f.pressureHpa };
  }
  if (f.pressureHpa !== undefined && f.temperatureC !== undefined && f.lapseRateKPerM !== undefined) {
    return { pressureHpa: f.pressureHpa, temperatureC: f.temperatureC, lapseRateKPerM: f.lapseRateKPerM };
  }
  // Unreachable once the refinement above has passed.
  ctx.addIssue({ code: 'custom', message: 'Unrecognised refraction condition.' });
  return z.NEVER;
});

// ---------------------------------------------------------------------------
// Request

/** Kinds of reported visibility: meteorological range (2 % contrast) or meteorological optical range (5 %). */
export const VisibilityKindSchema = z.enum(['meteorological-range-2pct', 'mor-5pct'], {
  error: 'Visibility kind must be meteorological-range-2pct or mor-5pct.',
});

/** Body of the sightline evaluation request. */
export const SightlineRequestSchema = z
  .object({
    /** Height of eye above the surface (sea level or the plain), metres, 0…100 000. */
    observerHeightM: height('Observer height'),
    /** Height of the target's top above the surface, metres, 0…100 000. Needed for ranges and visible height. */
    targetHeightM: height('Target height').optional(),
    /** Surface distance from observer to target, metres, 0…2 000 000. Needed for hidden and visible height. */
    distanceM: z
      .number({ error: 'Distance must be a number of metres.' })
      .min(0, 'Distance cannot be negative.')
      .max(MAX_DISTANCE_M, `Distance must be at most ${MAX_DISTANCE_M / 1000} km.`)
      .optional(),
    /** Part of the target that must show above the horizon, metres (default 0); at most the target height. */
    requiredVisibleM: height('Required visible part').optional(),
    /** Radius of the Earth model, metres, 6 000 000…7 000 000 (default the IUGG mean 6 371 008.8). */
    earthRadiusM: z
      .number({ error: 'Earth radius must be a number of metres.' })
      .min(6_000_000, 'Earth radius must be at least 6 000 000 m.')
      .max(7_000_000, 'Earth radius must be at most 7 000 000 m.')
      .optional(),
    /** Reported visibility, metres, 10…1 000 000. */
    visibilityM: z
      .number({ error: 'Visibility must be a number of metres.' })
      .min(10, 'Visibility must be at least 10 m.')
      .max(1_000_000, 'Visibility must be at most 1000 km.')
      .optional(),
    /** What the visibility figure is (default `mor-5pct`, what weather services report). */
    visibilityKind: VisibilityKindSchema.optional(),
    /** Critical size of the target (e.g. its width), metres, > 0…100 000; gives the angular-size limit. */
    targetSizeM: z
      .number({ error: 'Target size must be a number of metres.' })
      .positive('Target size must be greater than 0.')
      .max(MAX_HEIGHT_M, `Target size must be at most ${MAX_HEIGHT_M} m.`)
      .optional(),
    /** Angle the eye must resolve, minutes of arc, 0.1…60 (default 1, normal acuity; larger for lookout detection). */
    resolutionArcmin: z
      .number({ error: 'Resolution must be a number of arcminutes.' })
      .min(0.1, 'Resolution must be at least 0.1′.')
      .max(60, 'Resolution must be at most 60′.')
      .optional(),
    /** Day (default) or night: at night only a light is seen, out to its luminous range. */
    period: z.enum(['day', 'night'], { error: 'Period must be day or night.' }).optional(),
    /** Luminous intensity of the target's light towards the lookout, candela, 0…10⁹ (a hand flare ≈ 15 000 cd). */
    lightIntensityCd: z
      .number({ error: 'Light intensity must be a number of candela.' })
      .min(0, 'Light intensity cannot be negative.')
      .max(1e9, 'Light intensity must be at most 10⁹ cd.')
      .optional(),
    /** Lights behind the target at night: none (default), some (×10 threshold) or much (×100). */
    backgroundLighting: z.enum(['none', 'some', 'much'], { error: 'Background lighting must be none, some or much.' }).optional(),
    /** Sea state, Douglas degree 0–9 (WMO code table 3700): screens the lower part of a target on the water. */
    seaState: z
      .number({ error: 'Sea state must be a whole degree 0–9.' })
      .int('Sea state must be a whole degree 0–9.')
      .min(0, 'Sea state must be 0 to 9.')
      .max(9, 'Sea state must be 0 to 9.')
      .optional(),
    /** Significant wave height, metres, 0…30; instead of `seaState`. */
    significantWaveHeightM: z
      .number({ error: 'Wave height must be a number of metres.' })
      .min(0, 'Wave height cannot be negative.')
      .max(30, 'Wave height must be at most 30 m.')
      .optional(),
    /** Refraction conditions to evaluate, 1…50; one result each, in order. */
    conditions: z
      .array(RefractionConditionSchema, { error: 'Conditions must be a list.' })
      .min(1, 'Give at least one refraction condition.')
      .max(50, 'At most 50 conditions per request.'),
  })
  .superRefine((request, ctx) => {
    if (request.requiredVisibleM !== undefined && request.targetHeightM === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['requiredVisibleM'],
        message: 'Give the target height with the required visible part.',
      });
    }
    if (
      request.requiredVisibleM !== undefined &&
      request.targetHeightM !== undefined &&
      request.requiredVisibleM > request.targetHeightM
    ) {
      ctx.addIssue({
        code: 'custom',
        path: ['requiredVisibleM'],
        message: 'The required visible part cannot exceed the target height.',
      });
    }
    if (request.seaState !== undefined && request.significantWaveHeightM !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['significantWaveHeightM'],
        message: 'Give the sea state or the wave height, not both.',
      });
    }
    if (request.visibilityKind !== undefined && request.visibilityM === undefined) {
      ctx.addIssue({ code: 'custom', path: ['visibilityKind'], message: 'Give the visibility with its kind.' });
    }
  });
export type SightlineRequest = z.infer<typeof SightlineRequestSchema>;

// ---------------------------------------------------------------------------
// Response

/** Warning codes attached to a result. */
export const SIGHTLINE_WARNING_CODES = [
  'ducting',
  'sub-refraction',
  'super-refraction',
  'distance-not-given',
  'target-height-not-given',
  'beyond-effective-quarter',
  'required-part-exceeds-target',
  'detection-unbounded',
  'near-ducting',
  'screened-by-waves',
  'unlit-at-night',
] as const;

/** Caution codes attached to every response. */
export const SIGHTLINE_CAUTION_CODES = [
  'estimates-only',
  'refraction-varies',
  'visibility-not-detection',
  'follow-procedures',
] as const;

/** Why a result value is missing or should be read with care. */
export const SightlineWarningSchema = z.object({ code: z.enum(SIGHTLINE_WARNING_CODES), message: z.string() });
export type SightlineWarning = z.infer<typeof SightlineWarningSchema>;

/** A standing caution for every response. */
export const SightlineCautionSchema = z.object({ code: z.enum(SIGHTLINE_CAUTION_CODES), message: z.string() });
export type SightlineCaution = z.infer<typeof SightlineCautionSchema>;

/** Which limit sets the detection range. */
export const DetectionLimitSchema = z.enum(['horizon', 'visibility', 'angular-size', 'luminous-range', 'sea-state']);
export type DetectionLimitValue = z.infer<typeof DetectionLimitSchema>;

/** Refraction regime by k: sub (k < 0), standard (0 ≤ k < 0.5), super (0.5 ≤ k < 1), ducting (k ≥ 1). */
export const RefractionRegimeSchema = z.enum(['sub-refraction', 'standard', 'super-refraction', 'ducting']);

const metres = z.number().nullable();

/** The sightline quantities under one refraction condition. `null` = does not exist or not asked for (see warnings). */
export const SightlineResultSchema = z.object({
  /** Refraction coefficient used, dimensionless. */
  k: z.number(),
  regime: RefractionRegimeSchema,
  /** Effective radius R/(1 − k), metres; null under ducting (k ≥ 1). */
  effectiveRadiusM: metres,
  /** Horizon distance along the surface (arc), metres. */
  horizonDistanceM: metres,
  /** Straight length of the sightline from the eye to the tangent point, metres. */
  tangentLengthM: metres,
  /** Dip of the horizon, degrees, positive below the horizontal. */
  dipDeg: z.number().nullable(),
  /** Part of the target hidden below the horizon line at `distanceM`, metres. */
  hiddenHeightM: metres,
  /** Part of the target above the horizon line at `distanceM`, metres. */
  visibleHeightM: metres,
  /** Geographic range: horizon of the eye plus horizon of the target top, metres. */
  geographicRangeM: metres,
  /** Least of the geometric, visibility and angular-size limits, metres. */
  detectionRangeM: metres,
  /** Which limit sets `detectionRangeM`. */
  limitedBy: DetectionLimitSchema.nullable(),
  /** By day: the visibility limit at the 5 % threshold, metres (null without a visibility, or at night). */
  visibilityLimitM: metres.default(null),
  /** By day: the angular-size limit for the target's size at the resolving angle, metres. */
  angularSizeLimitM: metres.default(null),
  /** At night: the light's luminous range (Allard's law, IALA threshold), metres; 0 for a target without a light. */
  luminousRangeM: metres.default(null),
  /** Height of the wave crests screening a target on the water, metres (0 without a sea). */
  waveScreenM: z.number().default(0),
  warnings: z.array(SightlineWarningSchema),
});
export type SightlineResult = z.infer<typeof SightlineResultSchema>;

/** Body of the sightline evaluation response: one result per condition, in request order. */
export const SightlineResponseSchema = z.object({
  results: z.array(SightlineResultSchema),
  cautions: z.array(SightlineCautionSchema),
});
export type SightlineResponse = z.infer<typeof SightlineResponseSchema>;

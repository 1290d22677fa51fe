import { z } from 'zod';
import { listQuerySchema, pageOf } from './list';
import { RefractionConditionSchema, VisibilityKindSchema } from './sightline';
import { SeenVersionSchema } from './seen-version';

/** Kinds of search object or target a post must detect. */
export const TARGET_KINDS = ['smoke-column', 'vessel', 'small-craft', 'raft', 'person-in-water', 'vehicle', 'light'] as const;
/** Kinds that float on the water unless the planner says otherwise: waves screen their lower part. */
export const WATER_TARGET_KINDS: readonly (typeof TARGET_KINDS)[number][] = ['vessel', 'small-craft', 'raft', 'person-in-water'];
export const TARGET_KIND_LABELS: Record<(typeof TARGET_KINDS)[number], string> = {
  'smoke-column': 'Smoke column',
  vessel: 'Vessel',
  'small-craft': 'Small craft',
  raft: 'Life raft',
  'person-in-water': 'Person in the water',
  vehicle: 'Vehicle',
  light: 'Light',
};

const metres = (what: string, min: number, max: number) =>
  z
    .number({ error: `${what} must be a number of metres.` })
    .min(min, `${what} must be at least ${min} m.`)
    .max(max, `${what} must be at most ${max} m.`);

/** A target profile in the organisation's library. Lengths in metres. */
export const TargetInputSchema = z
  .object({
    name: z.string({ error: 'Name the target.' }).trim().min(1, 'Name the target.').max(120, 'At most 120 characters.'),
    kind: z.enum(TARGET_KINDS, { error: `Choose one of: ${TARGET_KINDS.join(', ')}.` }),
    /** Height of the top above the surface. */
    heightM: metres('Height', 0, 20_000),
    /** Critical width, for the angular-size limit. */
    widthM: metres('Width', 0.01, 10_000),
    /** The upper part that must show to count as detected. */
    requiredVisibleM: metres('Required part', 0, 20_000).default(0),
    period: z.enum(['day', 'night'], { error: 'Day or night.' }).default('day'),
    /** Luminous intensity of its light towards the lookout, candela; null = no light (not seen at night). */
    lightIntensityCd: z
      .number({ error: 'Light intensity must be a number of candela.' })
      .min(0.01, 'At least 0.01 cd.')
      .max(1e9, 'At most 10⁹ cd.')
      .nullable()
      .default(null),
    /** Floats on the water: wave crests screen its lower part (default by kind). */
    onWater: z.boolean({ error: 'On the water: yes or no.' }).optional(),
  })
  .refine((t) => t.requiredVisibleM <= t.heightM, {
    message: 'The part that must show cannot exceed the height.',
    path: ['requiredVisibleM'],
  })
  .refine((t) => t.period === 'day' || t.lightIntensityCd !== null, {
    message: 'At night only a light is seen: give its intensity in candela.',
    path: ['lightIntensityCd'],
  })
  .transform((t) => ({ ...t, onWater: t.onWater ?? WATER_TARGET_KINDS.includes(t.kind) }));
export type TargetInput = z.infer<typeof TargetInputSchema>;

export const TargetSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  kind: z.enum(TARGET_KINDS),
  heightM: z.number(),
  widthM: z.number(),
  requiredVisibleM: z.number(),
  period: z.enum(['day', 'night']),
  /** Candela, or null for no light. */
  lightIntensityCd: z.number().nullable().default(null),
  onWater: z.boolean().default(false),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Target = z.infer<typeof TargetSchema>;

/** Lights behind a target at night: none, some (× 10 threshold) or much (× 100). */
/** Lights behind a target at night, for people (options and descriptions). */
export const BACKGROUND_LIGHTING_LABELS = { none: 'Dark', some: 'Some shore lights', much: 'Bright town' } as const;

export const BackgroundLightingSchema = z.enum(['none', 'some', 'much'], { error: 'Background lighting: none, some or much.' });

/** A named set of refraction conditions with a visibility, in the organisation's library. */
const ConditionSetFieldsSchema = z.object({
  name: z.string({ error: 'Name the set.' }).trim().min(1, 'Name the set.').max(120, 'At most 120 characters.'),
  conditions: z
    .array(RefractionConditionSchema)
    .min(1, 'Give at least one refraction condition.')
    .max(12, 'At most 12 conditions.'),
  /** Visibility, metres; null when not stated. */
  visibilityM: z
    .number({ error: 'Visibility must be a number of metres.' })
    .min(10, 'At least 10 m.')
    .max(1_000_000, 'At most 1 000 km.')
    .nullable()
    .default(null),
  visibilityKind: VisibilityKindSchema.default('mor-5pct'),
  /** Sea state, Douglas degree 0–9 (WMO code table 3700); null = not stated (no wave screen). */
  seaState: z
    .number({ error: 'Sea state must be a whole degree 0–9.' })
    .int('Sea state must be a whole degree 0–9.')
    .min(0, 'Sea state is 0 to 9.')
    .max(9, 'Sea state is 0 to 9.')
    .nullable()
    .default(null),
  /** Significant wave height, metres; null = not stated. Instead of the sea state. */
  significantWaveHeightM: z
    .number({ error: 'Wave height must be a number of metres.' })
    .min(0, 'Wave height cannot be negative.')
    .max(30, 'At most 30 m.')
    .nullable()
    .default(null),
  /** Lights behind a target at night. */
  backgroundLighting: BackgroundLightingSchema.default('none'),
});

const oneSea = (set: { seaState: number | null; significantWaveHeightM: number | null }) =>
  set.seaState === null || set.significantWaveHeightM === null;
const ONE_SEA = { message: 'Give the sea state or the wave height, not both.', path: ['significantWaveHeightM'] };

export const ConditionSetInputSchema = ConditionSetFieldsSchema.refine(oneSea, ONE_SEA);
export type ConditionSetInput = z.infer<typeof ConditionSetInputSchema>;

export const ConditionSetSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  conditions: z.array(z.record(z.string(), z.union([z.number(), z.string()]))),
  visibilityM: z.number().nullable(),
  visibilityKind: VisibilityKindSchema,
  seaState: z.number().int().nullable().default(null),
  significantWaveHeightM: z.number().nullable().default(null),
  backgroundLighting: BackgroundLightingSchema.default('none'),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type ConditionSet = z.infer<typeof ConditionSetSchema>;

/** Changes to a target (no defaults: a field left out stays as it is) and the version last seen. */
export const TargetUpdateSchema = z
  .object({
    name: z.string().trim().min(1, 'Name the target.').max(120),
    kind: z.enum(TARGET_KINDS),
    heightM: metres('Height', 0, 20_000),
    widthM: metres('Width', 0.01, 10_000),
    requiredVisibleM: metres('Required part', 0, 20_000),
    period: z.enum(['day', 'night']),
    lightIntensityCd: z.number().min(0.01, 'At least 0.01 cd.').max(1e9, 'At most 10⁹ cd.').nullable(),
    onWater: z.boolean(),
  })
  .partial()
  .extend({ version: SeenVersionSchema });

/** A condition set is replaced whole; `version` is the one last seen. */
export const ConditionSetUpdateSchema = ConditionSetFieldsSchema.extend({
  version: SeenVersionSchema,
}).refine(oneSea, ONE_SEA);

/** Query of a library list: libraries are small, so a page holds 200 by default. */
export const LibraryListQuerySchema = listQuerySchema(['name', '-name', '-updatedAt'] as const).extend({
  pageSize: z.coerce.number().int().min(1).max(500, 'At most 500 per page.').default(200),
});
export type LibraryListQuery = z.infer<typeof LibraryListQuerySchema>;

export const TargetListSchema = pageOf(TargetSchema);
export const ConditionSetListSchema = pageOf(ConditionSetSchema);

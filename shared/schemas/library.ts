import { z } from 'zod';
import { listQuerySchema, pageOf } from './list';
import { RefractionConditionSchema, VisibilityKindSchema } from './sightline';

/** Kinds of search object or target a post must detect. */
export const TARGET_KINDS = ['smoke-column', 'vessel', 'small-craft', 'raft', 'person-in-water', 'vehicle', 'light'] as const;
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
  })
  .refine((t) => t.requiredVisibleM <= t.heightM, {
    message: 'The part that must show cannot exceed the height.',
    path: ['requiredVisibleM'],
  });
export type TargetInput = z.infer<typeof TargetInputSchema>;

export const TargetSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  kind: z.enum(TARGET_KINDS),
  heightM: z.number(),
  widthM: z.number(),
  requiredVisibleM: z.number(),
  period: z.enum(['day', 'night']),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Target = z.infer<typeof TargetSchema>;

/** A named set of refraction conditions with a visibility, in the organisation's library. */
export const ConditionSetInputSchema = z.object({
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
});
export type ConditionSetInput = z.infer<typeof ConditionSetInputSchema>;

export const ConditionSetSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  conditions: z.array(z.record(z.string(), z.union([z.number(), z.string()]))),
  visibilityM: z.number().nullable(),
  visibilityKind: VisibilityKindSchema,
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
  })
  .partial()
  .extend({ version: z.number({ error: 'Send the version you last saw.' }).int() });

/** A condition set is replaced whole; `version` is the one last seen. */
export const ConditionSetUpdateSchema = ConditionSetInputSchema.extend({
  version: z.number({ error: 'Send the version you last saw.' }).int(),
});

/** Query of a library list: libraries are small, so a page holds 200 by default. */
export const LibraryListQuerySchema = listQuerySchema(['name', '-name', '-updatedAt'] as const).extend({
  pageSize: z.coerce.number().int().min(1).max(500, 'At most 500 per page.').default(200),
});
export type LibraryListQuery = z.infer<typeof LibraryListQuerySchema>;

export const TargetListSchema = pageOf(TargetSchema);
export const ConditionSetListSchema = pageOf(ConditionSetSchema);

import { z } from 'zod';
import { listQuerySchema, pageOf } from './list';
import { patchOf } from './patch-of';

/** Detection laws a sweep width may be read with (a lateral-range curve is its own law). */
export const SWEEP_MODELS = ['inverse-cube', 'definite-range'] as const;
export type SweepModel = (typeof SWEEP_MODELS)[number];
export const SWEEP_MODEL_LABELS: Record<SweepModel | 'lateral-range-curve', string> = {
  'inverse-cube': 'Inverse-cube law (Koopman)',
  'definite-range': 'Definite range',
  'lateral-range-curve': 'Lateral-range curve',
};

/** The most points of a lateral-range curve in a request. */
export const MAX_CURVE_POINTS = 500;

const positiveMetres = (what: string, max: number) =>
  z
    .number({ error: `${what} must be a number of metres.` })
    .positive(`${what} must be more than 0 m.`)
    .max(max, `${what} must be at most ${max.toLocaleString('en')} m.`);

/** One point of a lateral-range curve. */
export const LateralRangePointSchema = z.object({
  /** Lateral range (closest approach to the track), metres. */
  rangeM: z
    .number({ error: 'The range must be a number of metres.' })
    .min(0, 'The range cannot be negative.')
    .max(1_000_000, 'At most 1 000 km.'),
  /** Probability of detection on one pass at that range, 0…1. */
  pod: z.number({ error: 'The POD must be a number from 0 to 1.' }).min(0, 'The POD is 0 to 1.').max(1, 'The POD is 0 to 1.'),
});
export type LateralRangePointInput = z.infer<typeof LateralRangePointSchema>;

/**
 * `POST /api/v1/sweep-width`: a sweep width W — from a lateral-range curve,
 * given directly, or from a law's parameter — and a track spacing S.
 * Exactly one source of W:
 * - `lateralRangeCurve` (no `model`, no `sweepWidthM`): W is its integral; the POD is summed over the tracks;
 * - `sweepWidthM`, with `model` (default `inverse-cube`);
 * - `inverseCubeKM2` (model `inverse-cube`: p(x) = 1 − exp(−K/x²)) or `definiteRangeM` (model `definite-range`).
 */
export const SweepWidthRequestSchema = z
  .object({
    lateralRangeCurve: z
      .array(LateralRangePointSchema, { error: 'The curve is a list of { rangeM, pod } points.' })
      .min(2, 'Give at least 2 points of the curve.')
      .max(MAX_CURVE_POINTS, `At most ${MAX_CURVE_POINTS} points.`)
      .optional(),
    model: z.enum(SWEEP_MODELS, { error: `The model is one of: ${SWEEP_MODELS.join(', ')}.` }).optional(),
    /** Sweep width W, metres. */
    sweepWidthM: positiveMetres('The sweep width', 1_000_000).optional(),
    /** K of the inverse-cube lateral-range curve p(x) = 1 − exp(−K/x²), square metres. */
    inverseCubeKM2: z
      .number({ error: 'K must be a number of square metres.' })
      .positive('K must be more than 0 m².')
      .max(1e12, 'At most 10¹² m².')
      .optional(),
    /** Definite detection range R (every target within R is seen, none beyond), metres. */
    definiteRangeM: positiveMetres('The definite range', 500_000).optional(),
    /** Track spacing S, metres. */
    trackSpacingM: positiveMetres('The track spacing', 1_000_000),
  })
  .superRefine((r, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
    if (r.lateralRangeCurve) {
      if (r.model) issue('model', 'A lateral-range curve is its own model: leave the model out, or send no curve.');
      for (const key of ['sweepWidthM', 'inverseCubeKM2', 'definiteRangeM'] as const) {
        if (r[key] !== undefined) issue(key, 'The sweep width comes from the curve: leave this out, or send no curve.');
      }
      return;
    }
    const model = r.model ?? 'inverse-cube';
    const parameter = model === 'inverse-cube' ? 'inverseCubeKM2' : 'definiteRangeM';
    const other = model === 'inverse-cube' ? 'definiteRangeM' : 'inverseCubeKM2';
    if (r[other] !== undefined) issue(other, `Not a parameter of the ${model} model.`);
    if (r.sweepWidthM === undefined && r[parameter] === undefined) {
      issue('sweepWidthM', `Give the sweep width, ${parameter}, or a lateral-range curve.`);
    }
    if (r.sweepWidthM !== undefined && r[parameter] !== undefined) {
      issue(parameter, 'Give the sweep width or this parameter, not both.');
    }
  });
export type SweepWidthRequest = z.infer<typeof SweepWidthRequestSchema>;

/** Answer of `POST /api/v1/sweep-width`. */
export const SweepWidthResultSchema = z.object({
  model: z.enum([...SWEEP_MODELS, 'lateral-range-curve']),
  /** W, metres. */
  sweepWidthM: z.number(),
  /** S, metres. */
  trackSpacingM: z.number(),
  /** C = W / S. */
  coverageFactor: z.number(),
  /** Probability of detection of one parallel-sweep search by the model, 0…1. An estimate. */
  pod: z.number(),
  /** The same coverage as a random search, 1 − e^(−C): the pessimistic bound. */
  podRandomSearch: z.number(),
  /** Tracks counted each side of the target (curve only), else null. */
  tracksEachSide: z.number().int().nullable(),
  /** How the POD was found, in words. */
  method: z.string(),
  /** The published source of the relation. */
  source: z.string(),
  /** Things to read the figures with. */
  warnings: z.array(z.string()),
  /** The standing caution: POD is an estimate. */
  caution: z.string(),
});
export type SweepWidthResult = z.infer<typeof SweepWidthResultSchema>;

// ——— Sweep-width tables: a library entry naming its edition and source ———

/** One row of a sweep-width table: a search object under a visibility from a height → W. */
export const SweepWidthRowSchema = z.object({
  searchObject: z
    .string({ error: 'Name the search object.' })
    .trim()
    .min(1, 'Name the search object.')
    .max(120, 'At most 120 characters.'),
  /** Meteorological visibility the row holds for, metres. */
  visibilityM: positiveMetres('The visibility', 1_000_000),
  /** Height of eye (or search altitude) the row holds for, metres. */
  heightM: z
    .number({ error: 'The height must be a number of metres.' })
    .min(0, 'The height cannot be negative.')
    .max(20_000, 'At most 20 000 m.'),
  /** Sweep width, metres. */
  sweepWidthM: positiveMetres('The sweep width', 1_000_000),
});
export type SweepWidthRow = z.infer<typeof SweepWidthRowSchema>;

const text = (what: string, max: number) =>
  z
    .string({ error: `Give the ${what}.` })
    .trim()
    .min(1, `Give the ${what}.`)
    .max(max, `At most ${max} characters.`);

/** A sweep-width table as created: the edition and the source it was taken from are required. */
export const SweepWidthTableInputSchema = z.object({
  name: text('name', 120),
  /** The edition of the source (e.g. "2019 edition", "rev. 3"). */
  edition: text('edition', 120),
  /** Where the values come from (the publication, or "own trials, …"). */
  sourceName: text('source', 200),
  /** True for illustrative entries that are not published values. */
  isExample: z.boolean({ error: 'Example: yes or no.' }).default(false),
  notes: z.string().trim().max(2000, 'At most 2000 characters.').default(''),
  rows: z.array(SweepWidthRowSchema).min(1, 'Give at least one row.').max(500, 'At most 500 rows.'),
});
export type SweepWidthTableInput = z.infer<typeof SweepWidthTableInputSchema>;

/** Changes to a table (a field left out stays as it is) and the version last seen. */
export const SweepWidthTableUpdateSchema = patchOf(SweepWidthTableInputSchema).extend({
  version: z.number({ error: 'Send the version you last saw.' }).int(),
});
export type SweepWidthTableUpdate = z.infer<typeof SweepWidthTableUpdateSchema>;

/** Retiring a table: the version last seen. */
export const SweepWidthTableRetireSchema = z.object({ version: z.number({ error: 'Send the version you last saw.' }).int() });

export const SweepWidthTableSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  edition: z.string(),
  sourceName: z.string(),
  isExample: z.boolean(),
  notes: z.string(),
  rows: z.array(SweepWidthRowSchema),
  /** When it was retired (kept for the record, no longer offered), or null. */
  retiredAt: z.string().nullable(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type SweepWidthTable = z.infer<typeof SweepWidthTableSchema>;

/** Query of the table list; retired tables only when asked for. */
export const SweepWidthTableListQuerySchema = listQuerySchema(['name', '-name', '-updatedAt'] as const).extend({
  pageSize: z.coerce.number().int().min(1).max(500, 'At most 500 per page.').default(200),
  includeRetired: z
    .enum(['true', 'false'], { error: 'includeRetired is true or false.' })
    .default('false')
    .transform((v) => v === 'true'),
});
export type SweepWidthTableListQuery = z.infer<typeof SweepWidthTableListQuerySchema>;
export const SweepWidthTableListSchema = pageOf(SweepWidthTableSchema);

import { z } from 'zod';
import { CoverageGridSchema, EncodedClassRasterSchema } from './coverage';
import { COVERAGE_RUN_STATUSES } from './coverage';
import { runStateShape } from './run-state';

/*
 * Siting runs: which candidate places, at which tower height, add the most
 * seen area to a site's kept posts for one target and one condition set.
 * Queued like coverage runs; the inputs are frozen when the run is asked
 * for, so a run can be repeated. Areas in m², heights and distances in metres.
 */

export const SITING_RUN_STATUSES = COVERAGE_RUN_STATUSES;
export type SitingRunStatus = (typeof SITING_RUN_STATUSES)[number];

/** Most candidate × height options one run evaluates. */
export const SITING_MAX_OPTIONS = 300;

const latDeg = z
  .number({ error: 'Latitude must be a number of degrees.' })
  .min(-90, 'Latitude must be at least −90°.')
  .max(90, 'Latitude must be at most 90°.');
const lonDeg = z
  .number({ error: 'Longitude must be a number of degrees.' })
  .min(-180, 'Longitude must be at least −180°.')
  .max(180, 'Longitude must be at most 180°.');

/** A candidate: one of the site's posts, or a point with a name. */
export const SitingCandidateInputSchema = z.union(
  [
    z.strictObject({ postId: z.uuid({ error: 'Not a post id.' }) }),
    z.strictObject({
      latDeg,
      lonDeg,
      name: z.string({ error: 'Name the place.' }).trim().min(1, 'Name the place.').max(120, 'At most 120 characters.'),
    }),
  ],
  { error: 'A candidate is { postId } or { latDeg, lonDeg, name }.' },
);
export type SitingCandidateInput = z.infer<typeof SitingCandidateInputSchema>;

/** Candidates Kenning picks from the terrain: summits and ridge cells inside the site, at least `spacingM` apart. */
export const FromTerrainSchema = z.strictObject({
  spacingM: z
    .number({ error: 'The spacing must be a number of metres.' })
    .min(100, 'At least 100 m between candidates.')
    .max(20_000, 'At most 20 000 m between candidates.'),
  /** Most candidates to keep (the highest first); default 20. */
  maxCandidates: z.number().int('A whole number.').min(1, 'At least 1.').max(100, 'At most 100.').default(20),
  /** Only within `withinM` of this line (an access road or track), WGS84 `[lon, lat]` pairs. */
  accessLine: z
    .strictObject({
      line: z
        .array(z.tuple([lonDeg, latDeg]), { error: 'A line is a list of [lon, lat] pairs.' })
        .min(2, 'A line needs two points.'),
      withinM: z.number({ error: 'A distance in metres.' }).positive('More than 0 m.').max(50_000, 'At most 50 km.'),
    })
    .nullable()
    .default(null),
});

export const SitingObjectiveSchema = z.strictObject({
  /** 1: seen by at least one post; 2: by two whose bearings cross well (a fix). */
  minPosts: z.union([z.literal(1), z.literal(2)], { error: 'minPosts is 1 or 2.' }),
  /** Weigh priority zones by their weights (a cell counts its zone's weight instead of 1). */
  zoneWeights: z.boolean({ error: 'true or false.' }).default(true),
});

export const SitingRunInputSchema = z
  .strictObject({
    candidates: z.union(
      [
        z.array(SitingCandidateInputSchema).min(1, 'Give at least one candidate.').max(100, 'At most 100 candidates.'),
        z.strictObject({ fromTerrain: FromTerrainSchema }),
      ],
      { error: 'Candidates are a list of { postId } or { latDeg, lonDeg, name }, or { fromTerrain: { spacingM } }.' },
    ),
    /** Tower heights to consider, metres (structure height above the ground). */
    heightsM: z
      .array(z.number({ error: 'A height in metres.' }).min(0, 'Heights cannot be negative.').max(120, 'At most 120 m.'))
      .min(1, 'Give at least one tower height.')
      .max(8, 'At most 8 heights.')
      .refine((h) => new Set(h).size === h.length, 'Give each height once.'),
    /** Cost of a tower of each height (same order as `heightsM`), any unit; null = no costs. */
    costs: z
      .array(z.number({ error: 'A cost is a number.' }).min(0, 'Costs cannot be negative.'))
      .nullable()
      .default(null),
    /** Spend at most this (in the costs' unit); null = no budget. Needs `costs`. */
    budget: z.number({ error: 'A budget is a number.' }).positive('More than 0.').nullable().default(null),
    /** Stop once this share of the site (the objective's weighted share) is reached, percent; null = choose `count`. */
    goalPct: z.number({ error: 'A percentage.' }).gt(0, 'More than 0 %.').max(100, 'At most 100 %.').nullable().default(null),
    /** Eye height above the tower's platform, metres. */
    eyeHeightM: z.number({ error: 'A height in metres.' }).min(0, 'Cannot be negative.').max(10, 'At most 10 m.').default(1.6),
    keepPostIds: z
      .array(z.uuid({ error: 'Not a post id.' }))
      .max(50, 'At most 50 kept posts.')
      .default([]),
    count: z
      .number({ error: 'How many new posts, a whole number.' })
      .int('A whole number.')
      .min(1, 'At least 1.')
      .max(20, 'At most 20.'),
    targetId: z.uuid({ error: 'Choose a target.' }),
    conditionSetId: z.uuid({ error: 'Choose a condition set.' }),
    objective: SitingObjectiveSchema,
  })
  .superRefine((input, ctx) => {
    if (input.costs !== null && input.costs.length !== input.heightsM.length) {
      ctx.addIssue({ code: 'custom', path: ['costs'], message: 'Give one cost per tower height.' });
    }
    if (input.budget !== null && input.costs === null) {
      ctx.addIssue({ code: 'custom', path: ['budget'], message: 'A budget needs the costs of the heights.' });
    }
    if (Array.isArray(input.candidates) && input.candidates.length * input.heightsM.length > SITING_MAX_OPTIONS) {
      ctx.addIssue({
        code: 'custom',
        path: ['candidates'],
        message: `At most ${SITING_MAX_OPTIONS} candidate × height options in one run.`,
      });
    }
  });
export type SitingRunInput = z.input<typeof SitingRunInputSchema>;
export type SitingRunRequest = z.infer<typeof SitingRunInputSchema>;

/** A candidate as the run froze it. */
export const SitingCandidateSchema = z.object({
  index: z.number().int(),
  name: z.string(),
  /** The site's post it stands for, or null for a point. */
  postId: z.uuid().nullable(),
  latDeg: z.number(),
  lonDeg: z.number(),
  /** Where it came from: a post, a point given, or the terrain. */
  source: z.enum(['post', 'point', 'terrain']),
});
export type SitingCandidate = z.infer<typeof SitingCandidateSchema>;

const ConditionShareSchema = z.object({
  /** The coverage case key (`target:set:index`) the figure matches. */
  caseKey: z.string(),
  label: z.string(),
  seenM2: z.number(),
  seenPct: z.number(),
});

/** One chosen post of the curve: what it adds to the kept posts and those chosen before it. */
export const SitingStepSchema = z.object({
  candidate: SitingCandidateSchema,
  heightM: z.number(),
  cost: z.number().nullable(),
  /** Area it adds, m² (mean over the set's conditions; unweighted, as coverage runs count). */
  gainM2: z.number(),
  gainPct: z.number(),
  /** Area seen with it and those before it (kept posts included), m² and % of the site. */
  totalSeenM2: z.number(),
  totalSeenPct: z.number(),
  /** The same per condition of the set. */
  byCondition: z.array(ConditionShareSchema),
  /** What the optimiser weighed (zone weights applied), m²·weight. */
  weightedGain: z.number(),
});
export type SitingStep = z.infer<typeof SitingStepSchema>;

export const SitingRunSchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  ...runStateShape(SITING_RUN_STATUSES),
  elapsedS: z.number().nullable(),
  /** sha256 of the frozen inputs: the same inputs give the same choice. */
  inputsHash: z.string(),
  targetId: z.uuid(),
  targetName: z.string(),
  conditionSetId: z.uuid(),
  conditionSetName: z.string(),
  heightsM: z.array(z.number()),
  count: z.number().int(),
  objective: z.object({ minPosts: z.union([z.literal(1), z.literal(2)]), zoneWeights: z.boolean() }),
  keepPostIds: z.array(z.uuid()),
  candidates: z.array(SitingCandidateSchema),
  /** How the set was found: `exact` (every set tried), `greedy-swap`; null until done. */
  method: z.enum(['exact', 'greedy', 'greedy-swap']).nullable(),
  /** The site's area, m², and what the kept posts alone see (m², %). */
  siteAreaM2: z.number().nullable(),
  keptSeenM2: z.number().nullable(),
  keptSeenPct: z.number().nullable(),
  steps: z.array(SitingStepSchema),
  /** The chosen candidates and heights, in the order of the curve. */
  chosen: z.array(z.object({ candidate: SitingCandidateSchema, heightM: z.number() })),
  /**
   * What each choice adds, on the run's grid, for the set's first condition:
   * 0 outside the site, 1 not seen, 2 seen by the kept posts, 3 + n added by step n.
   */
  addedLayer: EncodedClassRasterSchema.nullable(),
  grid: CoverageGridSchema.nullable(),
  /** The draft plan made from the result, once made. */
  planId: z.uuid().nullable(),
});
export type SitingRun = z.infer<typeof SitingRunSchema>;

/** Codes of {@link SitingRun.addedLayer}. */
export const SITING_ADDED = { outside: 0, unseen: 1, kept: 2, firstStep: 3 } as const;

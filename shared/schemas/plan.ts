// Over 300 lines: the whole plan contract (standard, lookouts, results snapshot, revisions, review, signatures) whose parts nest in one another.
import { z } from 'zod';
import { listQuerySchema, pageOf } from './list';
import { patchOf } from './patch-of';
import { CoverageSnapshotSchema } from './coverage';
import { SightlineResultSchema } from './sightline';
import { SeenVersionSchema } from './seen-version';
import type { StandardVerdict } from '@/shared/plans/standard-verdict';

export const PLAN_STATUSES = ['draft', 'submitted', 'returned', 'approved', 'superseded'] as const;
export type PlanStatus = (typeof PLAN_STATUSES)[number];

const percent = z.number({ error: 'Give a percentage.' }).min(0, '0 to 100 %.').max(100, '0 to 100 %.');
const postCount = z.number({ error: '1 to 3 posts.' }).int('1 to 3 posts.').min(1, '1 to 3 posts.').max(3, '1 to 3 posts.');

/** A rule of the standard for one target, e.g. "person in the water: 60 % of the priority zones by ≥ 1 post". */
export const TargetRuleSchema = z.object({
  targetId: z.uuid({ error: 'Choose a target.' }),
  /** Where the share is measured: the whole site, or each priority zone. */
  area: z.enum(['site', 'priority-zones'], { error: 'Site or priority zones.' }),
  minPosts: postCount,
  minPct: percent,
});
export type TargetRule = z.infer<typeof TargetRuleSchema>;

const hourOfDay = (what: string, max: number) =>
  z
    .number({ error: `${what} is an hour, 0 to ${max}.` })
    .int(`${what} is a whole hour, 0 to ${max}.`)
    .min(0, `${what} is an hour, 0 to ${max}.`)
    .max(max, `${what} is an hour, 0 to ${max}.`);

/**
 * A rule for an offshore band of a coast site, e.g. "inshore: 95 % of the
 * shore by ≥ 1 post between 08:00 and 20:00" — checked in every hour of the
 * window from the roster (the posts on watch), else with every post.
 */
export const ShoreBandRuleSchema = z
  .object({
    /** The band's name, as on the site. */
    band: z.string({ error: 'Name the band.' }).trim().min(1, 'Name the band.').max(60),
    minPosts: z.number({ error: '1 or 2 posts.' }).int('1 or 2 posts.').min(1, '1 or 2 posts.').max(2, '1 or 2 posts.'),
    minPct: percent,
    /** Local hours, from (inclusive) to (exclusive); 0 and 24 = the whole day. */
    fromHour: hourOfDay('The start', 23).default(0),
    toHour: hourOfDay('The end', 24).default(24),
  })
  .refine((r) => r.toHour > r.fromHour, { path: ['toHour'], message: 'The end must be after the start.' });
export type ShoreBandRule = z.infer<typeof ShoreBandRuleSchema>;

/** The standard a plan must meet. */
export const PlanStandardSchema = z.object({
  /** Least share of the site seen by at least one post, percent. */
  minSeenPct: percent,
  /** Posts that must see each priority zone (for cross-bearings: 2). */
  priorityMinPosts: postCount,
  /** Rules for single targets, checked in that target's cases only. */
  targetRules: z.array(TargetRuleSchema).max(50, 'At most 50 target rules.').default([]),
  /** Least share of each priority zone with good cross-bearings, percent; null = no such rule. */
  crossBearingMinPct: percent.nullable().default(null),
  /** Rules for a coast site's offshore bands (absent in older plans). */
  bandRules: z.array(ShoreBandRuleSchema).max(20, 'At most 20 band rules.').optional(),
});
export type PlanStandard = z.infer<typeof PlanStandardSchema>;

/**
 * The lookout the plan assumes: the eye's resolving angle and any optics.
 * Binoculars of magnification M are taken to divide the resolving angle by M
 * (an ideal instrument; real gain is less, and the narrow field slows the
 * search) — the definition of angular magnification, common practice.
 */
export const PlanLookoutSchema = z.object({
  /** Resolving angle of the unaided eye for detection, minutes of arc (1′ = 20/20 acuity). */
  resolutionArcmin: z
    .number({ error: 'Resolution must be a number of arcminutes.' })
    .min(0.1, 'At least 0.1′.')
    .max(60, 'At most 60′.')
    .default(1),
  /** Magnification of the optics used for the search, 1 = unaided. */
  magnification: z.number({ error: 'Magnification must be a number.' }).min(1, 'At least 1×.').max(50, 'At most 50×.').default(1),
});
export type PlanLookout = z.infer<typeof PlanLookoutSchema>;

/** Resolving angle in object space, arcminutes: the eye's divided by the magnification. */
export const effectiveResolutionArcmin = (lookout: PlanLookout) => lookout.resolutionArcmin / lookout.magnification;

const ids = (what: string) =>
  z
    .array(z.uuid({ error: `Not a ${what} id.` }))
    .min(1, `Choose at least one ${what}.`)
    .max(100);

export const PlanInputSchema = z.object({
  siteId: z.uuid({ error: 'Choose a site.' }),
  title: z.string({ error: 'Give the plan a title.' }).trim().min(1, 'Give the plan a title.').max(200),
  postIds: ids('post'),
  targetIds: ids('target'),
  conditionSetIds: ids('condition set'),
  standard: PlanStandardSchema.default({ minSeenPct: 70, priorityMinPosts: 2, targetRules: [], crossBearingMinPct: null }),
  lookout: PlanLookoutSchema.default({ resolutionArcmin: 1, magnification: 1 }),
});
export type PlanInput = z.infer<typeof PlanInputSchema>;

/** Changes to a plan: a field left out stays as stored (no defaults). */
export const PlanUpdateSchema = patchOf(PlanInputSchema.omit({ siteId: true })).extend({
  rowVersion: SeenVersionSchema,
});

const Person = z.object({ id: z.uuid(), name: z.string(), role: z.string() });

export const PlanSchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  title: z.string(),
  postIds: z.array(z.uuid()),
  targetIds: z.array(z.uuid()),
  conditionSetIds: z.array(z.uuid()),
  standard: PlanStandardSchema,
  lookout: PlanLookoutSchema.default({ resolutionArcmin: 1, magnification: 1 }),
  status: z.enum(PLAN_STATUSES),
  /** Plan version: 1, then +1 each time an approved plan is changed. */
  version: z.number().int(),
  /** The plan this version replaces, if any. */
  previousId: z.uuid().nullable(),
  /** Optimistic-concurrency counter of the row. */
  rowVersion: z.number().int(),
  preparedBy: Person,
  /** Name of the plan's site, for lists across sites. */
  siteName: z.string(),
  /** When the latest revision was submitted (ISO 8601), or null if never. */
  submittedAt: z.string().nullable(),
  updatedAt: z.string(),
});
export type Plan = z.infer<typeof PlanSchema>;

export const PLAN_SORTS = ['-updatedAt', 'updatedAt', 'title', '-title', 'submittedAt', '-submittedAt'] as const;

/**
 * Query of the plan list. `queue=review` is a reviewer's queue: submitted
 * plans the caller did not prepare, longest waiting first.
 */
export const PlanListQuerySchema = listQuerySchema(PLAN_SORTS).extend({
  siteId: z.uuid({ error: 'Not a site id.' }).optional(),
  status: z
    .string()
    .transform((s) => s.split(','))
    .pipe(z.array(z.enum(PLAN_STATUSES, { error: `Statuses: ${PLAN_STATUSES.join(', ')}.` })))
    .optional(),
  queue: z.enum(['review'], { error: 'The only queue is review.' }).optional(),
});
export type PlanListQuery = z.infer<typeof PlanListQuerySchema>;

export const PlanListSchema = pageOf(PlanSchema);

/** A file frozen into a revision by reference: which, whose, and its content hash. */
export const AttachmentRefSchema = z.object({
  id: z.uuid(),
  ownerType: z.enum(['post', 'site', 'plan']),
  ownerId: z.uuid(),
  kind: z.enum(['photo', 'document']),
  name: z.string(),
  sha256: z.string(),
  bytes: z.number().int(),
  bearingDeg: z.number().nullable(),
  caption: z.string(),
});

/** How much of a named priority zone a post reaches for one target under one condition. */
export const ZoneReachSchema = z.object({
  name: z.string(),
  weight: z.number(),
  /** Distance from the post to the zone's nearest point, metres (0 inside it). */
  nearestM: z.number(),
  /** Distance to the zone's farthest point, metres. */
  farthestM: z.number(),
  /** Share of the zone within the detection range and the post's sector, percent; null when the range is unknown. */
  coveredPct: z.number().nullable(),
  /** whole (≥ 99.5 %), part, none (< 0.5 %), or unknown (no detection range under this condition). */
  reach: z.enum(['whole', 'part', 'none', 'unknown']),
});
export type ZoneReach = z.infer<typeof ZoneReachSchema>;

const BandSpanSchema = z.object({ min: z.number(), kAtMin: z.number(), max: z.number(), kAtMax: z.number() });

/** How a result moves with refraction: k 0 … 0.3 and the set's own conditions (`detectionSensitivity`). */
export const DetectionSensitivitySchema = z.object({
  ks: z.array(z.number()),
  detectionRangeM: BandSpanSchema.nullable(),
  geographicRangeM: BandSpanSchema.nullable(),
  limitedBy: z.array(z.enum(['horizon', 'visibility', 'angular-size', 'luminous-range', 'sea-state'])),
  spreadPct: z.number().nullable(),
});
export type DetectionSensitivityValue = z.infer<typeof DetectionSensitivitySchema>;

/** One line of the frozen results: a post seeing a target under one condition. */
export const PlanResultRowSchema = z.object({
  postId: z.uuid(),
  postName: z.string(),
  targetId: z.uuid(),
  targetName: z.string(),
  conditionSetId: z.uuid(),
  conditionSetName: z.string(),
  conditionIndex: z.number().int(),
  /** Height of eye above the datum, metres. */
  observerHeightM: z.number(),
  result: SightlineResultSchema,
  /** The site's priority zones as seen from this post (smooth earth); empty in revisions made before zones were measured. */
  zones: z.array(ZoneReachSchema).default([]),
  /** The same post, target and set across the k band; null in revisions made before it was computed. */
  sensitivity: DetectionSensitivitySchema.nullable().default(null),
  /** The ground the targets stand on; `observerHeightM` is counted above it. Null in older revisions (sea level). */
  datum: z
    .object({ groundM: z.number(), basis: z.enum(['sea-level', 'stated', 'post-ground']) })
    .nullable()
    .default(null),
});
export type PlanResultRow = z.infer<typeof PlanResultRowSchema>;

export const PlanSnapshotSchema = z.object({
  assumptions: z.array(z.string()),
  inputs: z.object({
    plan: z.object({
      title: z.string(),
      standard: PlanStandardSchema,
      /** Absent in revisions made before the lookout was a plan setting (then 1′, unaided). */
      lookout: PlanLookoutSchema.optional(),
      /** The detection model the figures were made with; absent in older revisions. */
      detectionModel: z.string().optional(),
    }),
    site: z.record(z.string(), z.unknown()),
    posts: z.array(z.record(z.string(), z.unknown())),
    targets: z.array(z.record(z.string(), z.unknown())),
    conditionSets: z.array(z.record(z.string(), z.unknown())),
    /** The plan's documents and its posts' photos as they were at submission (the bytes are kept for good). */
    attachments: z.array(AttachmentRefSchema).default([]),
  }),
  results: z.array(PlanResultRowSchema),
  /** The plan's terrain coverage run as it was at submission; null when none was computed (older revisions, sites without terrain). */
  coverage: CoverageSnapshotSchema.nullable().default(null),
  cautions: z.array(z.object({ code: z.string(), message: z.string() })),
});
export type PlanSnapshot = z.infer<typeof PlanSnapshotSchema>;

/** The plan's coverage against its standard (`standardVerdict` in shared/plans). */
export const StandardVerdictSchema = z.object({
  /** False when no terrain coverage was computed: nothing was checked. */
  checked: z.boolean(),
  passed: z.boolean(),
  caseCount: z.number().int(),
  failingCaseCount: z.number().int(),
  failing: z.array(
    z.object({
      caseKey: z.string(),
      targetName: z.string(),
      conditionSetName: z.string(),
      conditionLabel: z.string(),
      ruleId: z.string(),
      text: z.string(),
      actualPct: z.number().nullable(),
      minPct: z.number().nullable(),
    }),
  ),
}) satisfies z.ZodType<StandardVerdict>;

const exceptionText = (error: string) => z.string({ error }).trim().max(5000, 'At most 5 000 characters.');

export const PlanRevisionSchema = z.object({
  number: z.number().int(),
  /** sha256 of the canonical JSON of the snapshot. */
  contentHash: z.string(),
  snapshot: PlanSnapshotSchema,
  submittedBy: Person,
  submittedAt: z.string(),
  /** The verdict frozen at submission; null in revisions made before verdicts were frozen. */
  verdict: StandardVerdictSchema.nullable().default(null),
  /** Why a plan that fails its standard was submitted anyway (the planner's exception note); null otherwise. */
  exceptionNote: z.string().nullable().default(null),
});
export type PlanRevision = z.infer<typeof PlanRevisionSchema>;

export const ReviewInputSchema = z
  .object({
    decision: z.enum(['approve', 'return'], { error: 'Approve or return.' }),
    comment: z.string().trim().max(5000, 'At most 5 000 characters.').default(''),
    /** The revision the reviewer read. */
    revision: z.number({ error: 'Send the revision you reviewed.' }).int().min(1),
    /** Required to approve a revision that fails its standard: why it is approved as an exception. */
    justification: exceptionText('Write the justification as text.').optional(),
  })
  .refine((r) => r.decision === 'approve' || r.comment.length > 0, { message: 'Say what needs to change.', path: ['comment'] });

/** Body of POST /plans/:planId/submit. */
export const SubmitInputSchema = z.object({
  rowVersion: SeenVersionSchema,
  /** Required when the plan fails its standard: why it is submitted anyway. */
  exceptionNote: exceptionText('Write the exception note as text.').optional(),
});

export const ReviewSchema = z.object({
  revision: z.number().int(),
  decision: z.enum(['approve', 'return']),
  comment: z.string(),
  /** Why a revision failing its standard was approved as an exception; null otherwise. */
  justification: z.string().nullable().default(null),
  reviewer: Person,
  at: z.string(),
});

/** Who prepared, reviewed and approved, with times. */
export const SignatureSchema = z.object({
  step: z.enum(['prepared', 'submitted', 'returned', 'approved']),
  person: Person,
  at: z.string(),
  revision: z.number().int().nullable(),
});

export const PlanHistorySchema = z.object({
  revisions: z.array(PlanRevisionSchema.omit({ snapshot: true })),
  reviews: z.array(ReviewSchema),
  signatures: z.array(SignatureSchema),
});

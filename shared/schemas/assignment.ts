import { z } from 'zod';
import { listQuerySchema, pageOf } from './list';
import { PlanResultRowSchema } from './plan';
import { PostSchema } from './site';
import { DetectionLimitSchema } from './sightline';
import { SeenVersionSchema } from './seen-version';

const instant = (what: string) => z.iso.datetime({ offset: true, error: `${what} must be a date and time (ISO 8601).` });

/** Someone put on a post for a stretch of time (a watch). Times are ISO 8601 with an offset. */
export const AssignmentInputSchema = z
  .object({
    postId: z.uuid({ error: 'Choose a post.' }),
    userId: z.uuid({ error: 'Choose a person.' }),
    startsAt: instant('Start'),
    /** Null: until further notice. */
    endsAt: instant('End').nullable().default(null),
    note: z.string().trim().max(500, 'At most 500 characters.').default(''),
  })
  .refine((a) => a.endsAt === null || Date.parse(a.endsAt) > Date.parse(a.startsAt), {
    message: 'The watch must end after it starts.',
    path: ['endsAt'],
  });
export type AssignmentInput = z.infer<typeof AssignmentInputSchema>;

export const AssignmentUpdateSchema = z
  .object({
    startsAt: instant('Start'),
    endsAt: instant('End').nullable(),
    note: z.string().trim().max(500, 'At most 500 characters.'),
  })
  .partial()
  .extend({ version: SeenVersionSchema });

const Person = z.object({ id: z.uuid(), name: z.string(), role: z.string() });

export const AssignmentSchema = z.object({
  id: z.uuid(),
  postId: z.uuid(),
  postName: z.string(),
  siteId: z.uuid(),
  siteName: z.string(),
  person: Person,
  startsAt: z.string(),
  endsAt: z.string().nullable(),
  note: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Assignment = z.infer<typeof AssignmentSchema>;

/** A watch window: `from`/`to` ISO 8601; default now → 7 days on. */
const WindowSchema = z.object({
  from: instant('From').optional(),
  to: instant('To').optional(),
});

export const AssignmentListQuerySchema = listQuerySchema(['startsAt', '-startsAt'] as const)
  .extend({
    siteId: z.uuid({ error: 'Not a site id.' }).optional(),
    postId: z.uuid({ error: 'Not a post id.' }).optional(),
    userId: z.uuid({ error: 'Not a person id.' }).optional(),
  })
  .extend(WindowSchema.shape);
export type AssignmentListQuery = z.infer<typeof AssignmentListQuerySchema>;
export const AssignmentListSchema = pageOf(AssignmentSchema);

export const RosterQuerySchema = WindowSchema;

/** A site's watch roster over a window: each post's watches and the stretches nobody covers. */
export const RosterSchema = z.object({
  siteId: z.uuid(),
  from: z.string(),
  to: z.string(),
  posts: z.array(
    z.object({
      postId: z.uuid(),
      postName: z.string(),
      assignments: z.array(AssignmentSchema),
      gaps: z.array(z.object({ from: z.string(), to: z.string() })),
    }),
  ),
});
export type Roster = z.infer<typeof RosterSchema>;

/** Someone of the organisation, as pickers show them. */
export const PersonSchema = Person;
export const PeopleSchema = z.object({ items: z.array(Person) });

/** A bearing sector round a post, degrees true (clockwise from true north). */
const BearingRangeSchema = z.object({
  /** Start, degrees true, 0 ≤ fromDeg < 360. */
  fromDeg: z.number(),
  /** End, degrees true; smaller than fromDeg when the range crosses north (e.g. 350 → 10). */
  toDeg: z.number(),
  /** Share of the site's ground within the detection range, in this range, that the post sees, percent; null when none is in range. */
  seenPct: z.number().nullable(),
});

/** One target × condition of the plan's frozen terrain coverage, as this post sees it. */
export const BriefingTerrainCaseSchema = z.object({
  /** The coverage case (`${targetId}:${conditionSetId}:${conditionIndex}`). */
  caseKey: z.string(),
  targetId: z.uuid(),
  targetName: z.string(),
  conditionSetId: z.uuid(),
  conditionSetName: z.string(),
  conditionIndex: z.number().int(),
  /** For people, e.g. "standard optical (k 0.13)". */
  conditionLabel: z.string(),
  /** Share of the site where this post sees the target (within its watch sector), percent (the run's `posts[].seenPct`). */
  seenPct: z.number(),
  /** Equal sectors clockwise from 0° true (`sectorDeg` wide), seen share of the ground in range in each. */
  sectors: z.array(BearingRangeSchema),
  /** Contiguous sectors where the post sees less than `blindBelowPct` of the ground in range. */
  blindSectors: z.array(BearingRangeSchema.extend({ seenPct: z.number() })),
  /** Detection range of the target from this post in this condition (the plan's result), metres; null when the plan has no such row. */
  detectionRangeM: z.number().nullable(),
  /** What sets `detectionRangeM`; null = only the geometry. */
  limitedBy: DetectionLimitSchema.nullable(),
  /** Counted on the site's sea only (a target on the water): the sectors then count every cell of the grid in range. */
  seaOnly: z.boolean(),
});
export type BriefingTerrainCase = z.infer<typeof BriefingTerrainCaseSchema>;

/** What this post sees over the site's terrain, from the approved plan's frozen coverage run. */
export const BriefingTerrainViewSchema = z.object({
  runId: z.uuid(),
  terrainId: z.uuid(),
  /** Width of each bearing sector, degrees (10). */
  sectorDeg: z.number(),
  /** Sectors seen below this share are listed as blind, percent (25). */
  blindBelowPct: z.number(),
  /** Grid convergence at the post, degrees (true north to grid north, clockwise); already applied to every bearing. */
  gridConvergenceDeg: z.number(),
  cases: z.array(BriefingTerrainCaseSchema),
});
export type BriefingTerrainView = z.infer<typeof BriefingTerrainViewSchema>;

/** What a lookout needs before a watch: their posts and what the approved plans expect from each. */
export const BriefingSchema = z.object({
  assignments: z.array(AssignmentSchema),
  posts: z.array(
    z.object({
      post: PostSchema,
      siteName: z.string(),
      /** The latest approved plan that uses this post, or null. */
      plan: z
        .object({
          id: z.uuid(),
          title: z.string(),
          version: z.number().int(),
          revision: z.number().int(),
          approvedAt: z.string(),
        })
        .nullable(),
      results: z.array(PlanResultRowSchema),
      /**
       * Which figures lead: `terrain` when the site has terrain and the plan froze a terrain coverage run
       * (`terrainView` set; the smooth-earth zone reaches do not apply), else `smooth-earth` (no terrain: the
       * results' figures over a smooth earth, e.g. open sea).
       */
      basis: z.enum(['terrain', 'smooth-earth']),
      /** What this post sees over the terrain; null when `basis` is `smooth-earth`. */
      terrainView: BriefingTerrainViewSchema.nullable(),
      /** Whether the site has terrain today (a plan approved before it was added has no terrain view). */
      siteHasTerrain: z.boolean(),
      cautions: z.array(z.object({ code: z.string(), message: z.string() })),
    }),
  ),
});
export type Briefing = z.infer<typeof BriefingSchema>;

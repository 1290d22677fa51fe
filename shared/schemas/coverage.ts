// Over 300 lines: the whole coverage run contract (cases, bands, gaps, patrols, hourly series, layers, comparison), field by field with units.
import { z } from 'zod';
import { GridSpecMSchema } from './grid-spec';
import { runStateShape } from './run-state';
import { CLASS_RASTER_ENCODING, type EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';

/*
 * Terrain coverage of a plan: a run computes, for every target × condition of
 * the plan, how many of its posts see each cell of the site, the
 * cross-bearing quality, each post's visibility classes, the statistics and
 * the check against the plan's standard. Runs are queued (pg-boss) and
 * computed by worker processes; a finished run never changes, so a plan
 * revision can freeze a reference to it. Areas in m², lengths in metres.
 */

export const COVERAGE_RUN_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type CoverageRunStatus = (typeof COVERAGE_RUN_STATUSES)[number];

/** Statuses of a run that may still change. */
export const ACTIVE_RUN_STATUSES: readonly CoverageRunStatus[] = ['queued', 'running'];

/** Layers a run serves (`GET /coverage-runs/:id/layers/:layer`). */
export const COVERAGE_LAYER_KINDS = ['posts-per-cell', 'cross-bearing', 'post-visibility', 'patrol-fraction'] as const;
export type CoverageLayerName = (typeof COVERAGE_LAYER_KINDS)[number];

/** What the ground was: the site's terrain, or a flat datum at sea level (a site without terrain). */
export const COVERAGE_DATUMS = ['terrain', 'flat'] as const;

const MeasureSchema = z.object({ cells: z.number(), area: z.number(), pct: z.number() });

export const AreaCoverageSchema = z.object({
  total: MeasureSchema,
  noData: MeasureSchema,
  unseen: MeasureSchema,
  seenBy1: MeasureSchema,
  seenBy2: MeasureSchema,
  seenBy3: MeasureSchema,
  goodCrossBearing: MeasureSchema,
});

export const BlindAreaSchema = z.object({
  cells: z.number(),
  area: z.number(),
  /** Centre of mass of the patch: grid metres and WGS84. May lie outside a C- or U-shaped patch. */
  centroid: z.object({ x: z.number(), y: z.number(), latDeg: z.number(), lonDeg: z.number() }),
  /** A point surely inside the patch (its cell farthest from the edge): grid metres and WGS84; absent in older runs. */
  interior: z.object({ x: z.number(), y: z.number(), latDeg: z.number(), lonDeg: z.number() }).optional(),
});

export const CoverageRuleCheckSchema = z.object({
  id: z.string(),
  zoneName: z.string().nullable(),
  minPosts: z.number(),
  minPct: z.number(),
  text: z.string(),
  actualPct: z.number(),
  passed: z.boolean(),
  shortfallPct: z.number(),
  shortfallArea: z.number(),
  reasons: z.array(z.string()),
});

/** What decided the undetected part of a case: the view, or the target's range limit. */
export const CASE_LIMITS = ['view', 'visibility', 'angular-size', 'luminous-range', 'sea-state'] as const;

/** How far the target can be detected in one case, and what decided the area not covered. */
export const CaseDetectionSchema = z.object({
  /** Detection range from any post apart from the geometry, metres; null = only the view limits it. */
  rangeLimitM: z.number().nullable(),
  /** Which limit sets `rangeLimitM`. */
  rangeLimitedBy: z.enum(['visibility', 'angular-size', 'luminous-range', 'sea-state']).nullable(),
  /** Wave crests screening the target, metres (0 on land or a calm sea). */
  waveScreenM: z.number(),
  /** Why the target is never detected in this case, if so. */
  reason: z.enum(['screened-by-waves', 'unlit-at-night']).nullable(),
  /** What decided most of the undetected area; null when everything is detected. */
  decidedBy: z.enum(CASE_LIMITS).nullable(),
  /** Areas of the site (or its sea), m²: detected, without terrain data, hidden from posts in range (view), beyond every post's range. */
  areaM2: z.object({ detected: z.number(), noData: z.number(), view: z.number(), range: z.number() }),
  /** Counted on the sea part of the site only (a target on the water on a site with a land/sea mask). */
  seaOnly: z.boolean(),
});
export type CaseDetection = z.infer<typeof CaseDetectionSchema>;

/**
 * A patrol post's figures in one case. The craft runs its route once per
 * cycle at its speed and holds at the last waypoint for the rest; its views
 * are computed at samples along the track (`sampleSpacingM` apart at most).
 */
export const PatrolFiguresSchema = z.object({
  postId: z.uuid(),
  postName: z.string(),
  /** Route length, metres; the cycle, minutes; the time spent running the route, minutes. */
  routeLengthM: z.number(),
  cycleMinutes: z.number(),
  transitMinutes: z.number(),
  /** Places the view was computed from, and the longest distance between two of them along the track, metres. */
  samples: z.number().int(),
  sampleSpacingM: z.number(),
  /** Area of the judged part of the site (its sea part for targets on the water), m². */
  searchAreaM2: z.number(),
  /** Area where the target is detected at least once during the cycle, m², and as a share of the judged area, %. */
  sweptAreaM2: z.number(),
  sweptPct: z.number(),
  /** Mean over the swept cells of the share of the cycle each is in view, 0 … 1. */
  meanFractionInView: z.number(),
  /**
   * Sweep width W = 2 × the detection range over open water (the definite-range
   * law, Koopman), metres; coverage factor C = W·L/A for the track length L
   * run in one cycle; POD = 1 − e^(−C), the random-search probability of detection.
   * Null when the target cannot be detected from the craft (range 0).
   */
  sweepWidthM: z.number().nullable(),
  coverageFactor: z.number().nullable(),
  pod: z.number().nullable(),
});
export type PatrolFigures = z.infer<typeof PatrolFiguresSchema>;

/** One target × one condition of a run: figures and the standard's verdict. */
const ShoreMeasureSchema = z.object({ lengthM: z.number(), pct: z.number() });

/**
 * One offshore band along the shore in one case. A post watches the band at a
 * place on the shore when it sees the target at every point of the offshore
 * transect there within the band (see shared/terrain/shore-strips.ts).
 */
export const CaseBandSchema = z.object({
  name: z.string(),
  /** Metres from the shoreline. */
  fromM: z.number(),
  toM: z.number(),
  /** Length and share of the shore watched by ≥ 1 and ≥ 2 posts (every post of the plan). */
  watched1: ShoreMeasureSchema,
  watched2: ShoreMeasureSchema,
  /** Per post: the chainage stretches it watches, [from, to] metres. */
  posts: z.array(
    z.object({
      postId: z.uuid(),
      postName: z.string(),
      lengthM: z.number(),
      watched: z.array(z.tuple([z.number(), z.number()])),
    }),
  ),
});
export type CaseBand = z.infer<typeof CaseBandSchema>;

/** A stretch of shore where a band is not watched, and what would close it. */
export const CaseGapSchema = z.object({
  band: z.string(),
  /** Chainage, metres; from = to for a seam. */
  fromM: z.number(),
  toM: z.number(),
  lengthM: z.number(),
  /** `unwatched`: nobody watches it; `seam`: two posts' strips meet within one cell, nothing to spare. */
  kind: z.enum(['unwatched', 'seam']),
  /** Where the gap is (its middle on the shore), WGS84. */
  at: z.object({ latDeg: z.number(), lonDeg: z.number() }),
  /** The nearest post that could close it and how much higher it would need to be (smooth earth); null without posts. */
  closer: z
    .object({
      postId: z.uuid(),
      postName: z.string(),
      distanceM: z.number(),
      /** Eye height above the water needed, metres; null when height cannot help. */
      neededEyeM: z.number().nullable(),
      /** How much higher than now, metres; 0 = height is not what hides it; null when height cannot help. */
      raiseByM: z.number().nullable(),
      blockedBy: z.enum(['range-limit', 'sector']).nullable(),
    })
    .nullable(),
});
export type CaseGap = z.infer<typeof CaseGapSchema>;

/** The band shares hour by hour from the roster (posts on watch the whole hour). */
export const HourlySeriesSchema = z.object({
  /** First local day (YYYY-MM-DD) and how many days. */
  date: z.string(),
  days: z.number().int(),
  timeZone: z.string(),
  /** When the roster was read, ISO 8601. */
  rosterReadAt: z.string(),
  hours: z.array(
    z.object({
      startsAt: z.string(),
      local: z.string(),
      hour: z.number().int(),
      postIds: z.array(z.string()),
      bands: z.array(z.object({ name: z.string(), watched1Pct: z.number(), watched2Pct: z.number() })),
    }),
  ),
  /** Hours in which some band has no shore watched, with those bands. */
  unwatchedHours: z.array(z.object({ startsAt: z.string(), local: z.string(), bands: z.array(z.string()) })),
});
export type HourlySeries = z.infer<typeof HourlySeriesSchema>;

/** Query of GET /coverage-runs/:runId/hourly. */
export const CoverageHourlyQuerySchema = z.object({
  caseKey: z.string({ error: 'Name the case.' }).min(1, 'Name the case.').max(200),
  /** First local day, YYYY-MM-DD; default today in the site's time zone. */
  date: z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, 'Give a date as YYYY-MM-DD.')
    .optional(),
  /** 1 (a day) to 7 (a week). */
  days: z.coerce.number({ error: '1 to 7 days.' }).int('1 to 7 days.').min(1, '1 to 7 days.').max(7, '1 to 7 days.').default(1),
});

/** The shoreline a case measured along. */
export const CaseShoreSchema = z.object({
  lengthM: z.number(),
  /** Stations (pieces of about one cell) the shore was judged at. */
  stations: z.number().int(),
  /** Which side of the line (walking from its start) the sea was taken to be on. */
  seaSide: z.enum(['left', 'right']),
  /** Each post's position along the shore (chainage of the nearest point) and its distance from it, metres. */
  posts: z.array(z.object({ postId: z.uuid(), postName: z.string(), chainageM: z.number(), offsetM: z.number() })),
});

export const CoverageCaseSchema = z.object({
  /** `${targetId}:${conditionSetId}:${conditionIndex}`; the same in every run of plans sharing them. */
  key: z.string(),
  targetId: z.uuid(),
  targetName: z.string(),
  targetHeightM: z.number(),
  conditionSetId: z.uuid(),
  conditionSetName: z.string(),
  conditionIndex: z.number().int(),
  /** For people, e.g. "standard optical (k 0.13)". */
  conditionLabel: z.string(),
  refractionCoefficient: z.number(),
  site: AreaCoverageSchema,
  zones: z.array(AreaCoverageSchema.extend({ name: z.string(), weight: z.number() })),
  /** Listed blind areas (largest first) and all of them counted. */
  blindAreas: z.array(BlindAreaSchema),
  blindSummary: z.object({ count: z.number(), area: z.number(), minArea: z.number() }),
  check: z.object({
    interpretation: z.string(),
    passed: z.boolean(),
    rules: z.array(CoverageRuleCheckSchema),
    reasons: z.array(z.string()),
  }),
  /** Per post: share of the site where it sees the target (within its sector), percent. */
  posts: z.array(z.object({ postId: z.uuid(), postName: z.string(), seenPct: z.number() })),
  /** Per patrol post (a vessel or aircraft with a route): what it watches over its cycle; absent without patrols. */
  patrols: z.array(PatrolFiguresSchema).optional(),
  /** What limits detection in this case; null in runs made before the detection model (view and visibility only). */
  detection: CaseDetectionSchema.nullable().default(null),
  /** The detection model the figures were made with; null in older runs. */
  detectionModel: z.string().nullable().default(null),
  /** Water level of this case, metres above the site's datum; null = no tide stated. */
  tideLevelM: z.number().nullable().default(null),
  /** The shoreline measured along; null when the site has no shoreline or no bands. */
  shore: CaseShoreSchema.nullable().default(null),
  /** Each offshore band's figures along the shore. */
  bands: z.array(CaseBandSchema).default([]),
  /** Stretches of shore where a band is not watched. */
  gaps: z.array(CaseGapSchema).default([]),
  /** Band shares hour by hour for the day the run was computed, from the roster then; null without bands. */
  hourly: HourlySeriesSchema.nullable().default(null),
});
export type CoverageCase = z.infer<typeof CoverageCaseSchema>;

/** The grid the layers are on (the terrain's, or the flat datum's). */
export const CoverageGridSchema = GridSpecMSchema.extend({
  epsg: z.number().int().nullable(),
});
export type CoverageGrid = z.infer<typeof CoverageGridSchema>;

export const CoverageRunSchema = z.object({
  id: z.uuid(),
  planId: z.uuid(),
  siteId: z.uuid(),
  /** The terrain computed on, or null for the flat datum. */
  terrainId: z.uuid().nullable(),
  datum: z.enum(COVERAGE_DATUMS),
  /** sha256 of the canonical JSON of every input (terrain, posts, targets, conditions, site, standard). */
  inputsHash: z.string(),
  ...runStateShape(COVERAGE_RUN_STATUSES),
  /** Whether the plan's inputs today are the ones this run computed. */
  current: z.boolean(),
  grid: CoverageGridSchema.nullable(),
  /** Filled when done, in target × condition order. */
  cases: z.array(CoverageCaseSchema),
  /** Seconds the computation took (done runs). */
  elapsedS: z.number().nullable(),
  /** Conditions of the plan the terrain coverage leaves out, and why (e.g. a duct, k ≥ 1). */
  skippedConditions: z
    .array(z.object({ conditionSetName: z.string(), conditionLabel: z.string(), reason: z.string() }))
    .default([]),
});
export type CoverageRun = z.infer<typeof CoverageRunSchema>;

/** Body of GET /plans/:planId/coverage. */
export const PlanCoverageSchema = z.object({
  /** Hash of the plan's inputs today. */
  inputsHash: z.string(),
  /** The run for today's inputs (any status but failed/cancelled), or null. */
  current: CoverageRunSchema.nullable(),
  /** The newest run whatever its status or inputs, or null. */
  latest: CoverageRunSchema.nullable(),
  /** Whether the site has terrain (else coverage is on the flat datum and not required for submitting). */
  hasTerrain: z.boolean(),
});
export type PlanCoverage = z.infer<typeof PlanCoverageSchema>;

/** Query of GET /coverage-runs/:id/layers/:layer. */
export const CoverageLayerQuerySchema = z.object({
  caseKey: z.string({ error: 'Name the case (caseKey).' }).min(1, 'Name the case (caseKey).'),
  postId: z.uuid({ error: 'Not a post id.' }).optional(),
});

/** Query of GET /coverage-compare: run `a` is "before", `b` "after". */
export const CoverageCompareQuerySchema = z.object({
  a: z.uuid({ error: 'Not a run id.' }),
  b: z.uuid({ error: 'Not a run id.' }),
  caseKey: z.string().min(1, 'Name the case (caseKey).'),
  /** The case of run b when it differs (other target or condition ids); default caseKey. */
  caseKeyB: z.string().min(1).optional(),
});

/** A layer as `GET /coverage-runs/:id/layers/:layer` sends it (`kenning-rle8/1`). */
export const EncodedClassRasterSchema = z.object({
  format: z.literal(CLASS_RASTER_ENCODING),
  width: z.number().int().positive(),
  height: z.number().int().positive(),
  cellSize: z.number().positive(),
  xll: z.number(),
  yll: z.number(),
  epsg: z.number().int().nullable(),
  data: z.string(),
}) satisfies z.ZodType<EncodedClassRaster>;

const ChangeMeasureSchema = z.object({ cells: z.number(), area: z.number() });

/** Body of GET /coverage-compare. */
export const CoverageComparisonSchema = z.object({
  a: z.object({ runId: z.uuid(), planId: z.uuid(), caseKey: z.string(), site: AreaCoverageSchema }),
  b: z.object({ runId: z.uuid(), planId: z.uuid(), caseKey: z.string(), site: AreaCoverageSchema }),
  /** `kenning-rle8/1` raster of COVERAGE_CHANGE codes. */
  difference: EncodedClassRasterSchema,
  statistics: z.object({
    compared: ChangeMeasureSchema,
    byChange: z.object({
      unchanged: ChangeMeasureSchema,
      gained: ChangeMeasureSchema,
      lost: ChangeMeasureSchema,
      morePosts: ChangeMeasureSchema,
      fewerPosts: ChangeMeasureSchema,
    }),
    gainedSeenBy1: ChangeMeasureSchema,
    lostSeenBy1: ChangeMeasureSchema,
    gainedSeenBy2: ChangeMeasureSchema,
    lostSeenBy2: ChangeMeasureSchema,
    netSeenBy1Area: z.number(),
    netSeenBy2Area: z.number(),
  }),
});
export type CoverageComparison = z.infer<typeof CoverageComparisonSchema>;

/** What a revision freezes of the plan's coverage run (in `snapshot.coverage`). */
export const CoverageSnapshotSchema = z.object({
  runId: z.uuid(),
  inputsHash: z.string(),
  datum: z.enum(COVERAGE_DATUMS),
  terrainId: z.uuid().nullable(),
  terrainSha256: z.string().nullable(),
  grid: CoverageGridSchema,
  cases: z.array(CoverageCaseSchema),
  /** sha256 of each stored layer, keyed `${layer}:${caseKey}[:${postId}]`. */
  layerHashes: z.record(z.string(), z.string()),
});
export type CoverageSnapshot = z.infer<typeof CoverageSnapshotSchema>;

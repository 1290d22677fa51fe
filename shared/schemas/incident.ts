import { z } from 'zod';
import { FixBearingSchema, FixSchema, GeoJsonPolygonSchema } from './fix';
import { LandmarkOffsetSchema } from './landmark';
import { SeenVersionSchema } from './seen-version';

/*
 * Incidents: a smoke, a light, a vessel, a person … being fixed by bearings
 * from a site's posts, and the append-only, hash-chained log of everything
 * said about it. Angles in degrees (bearings clockwise from north,
 * declination east positive), times ISO 8601.
 */

export const INCIDENT_STATUSES = ['open', 'closed'] as const;
export type IncidentStatus = (typeof INCIDENT_STATUSES)[number];

export const SIGHTING_KINDS = ['smoke', 'light', 'vessel', 'person', 'other'] as const;
export type SightingKind = (typeof SIGHTING_KINDS)[number];

export const INCIDENT_ENTRY_KINDS = ['opened', 'updated', 'report', 'fix', 'closed', 'reopened'] as const;
export type IncidentEntryKind = (typeof INCIDENT_ENTRY_KINDS)[number];

const title = z
  .string({ error: 'Give the incident a title.' })
  .trim()
  .min(1, 'Give the incident a title.')
  .max(200, 'At most 200 characters.');

/** Body of POST /api/v1/incidents. */
export const IncidentCreateSchema = z.strictObject({
  siteId: z.uuid({ error: 'Choose a site.' }),
  title,
});
export type IncidentCreate = z.infer<typeof IncidentCreateSchema>;

/** Body of PATCH /api/v1/incidents/:id: a new title, or closing / reopening with a note. */
export const IncidentUpdateSchema = z.strictObject({
  version: SeenVersionSchema,
  title: title.optional(),
  status: z.enum(INCIDENT_STATUSES, { error: 'The status is open or closed.' }).optional(),
  note: z.string().trim().max(1000, 'At most 1 000 characters.').default(''),
});
export type IncidentUpdate = z.infer<typeof IncidentUpdateSchema>;

/** Query of GET /api/v1/incidents. */
export const IncidentListQuerySchema = z.object({
  siteId: z.uuid({ error: 'Not a site id.' }).optional(),
  status: z.enum(INCIDENT_STATUSES, { error: 'The status is open or closed.' }).optional(),
});

const bearing = FixBearingSchema.shape;

/** Body of POST /api/v1/incidents/:id/reports: one bearing from one of the site's posts. */
export const IncidentReportInputSchema = z
  .strictObject({
    postId: z.uuid({ error: 'Choose the post the bearing was taken from.' }),
    observedAt: z.iso.datetime({ offset: true, error: 'The time must be a date and time (ISO 8601).' }),
    bearingDeg: bearing.bearingDeg,
    bearingReference: bearing.bearingReference,
    /** Typed declination, degrees east positive; left out for a magnetic bearing: the World Magnetic Model's. */
    declinationDeg: bearing.declinationDeg,
    bearingSigmaDeg: bearing.bearingSigmaDeg,
    verticalAngleDeg: bearing.verticalAngleDeg,
    /** Standard uncertainty of the vertical angle, degrees (default 0.1°). */
    verticalAngleSigmaDeg: bearing.verticalAngleSigmaDeg,
    /** The vertical angle is from the horizontal (default) or the visible sea horizon. */
    verticalAngleReference: bearing.verticalAngleReference,
    /** The position given from a named landmark of the site ("1.2 km at 040° from Crag Hut"); it places the fix. */
    landmarkOffset: LandmarkOffsetSchema.optional(),
    kind: z.enum(SIGHTING_KINDS, { error: `What was seen: one of ${SIGHTING_KINDS.join(', ')}.` }),
    note: z.string().trim().max(1000, 'At most 1 000 characters.').default(''),
    /** Chosen by the sender (e.g. a UUID made on the phone); the same key again returns the stored report. */
    idempotencyKey: z
      .string({ error: 'Send an idempotency key with each report.' })
      .trim()
      .min(8, 'An idempotency key has at least 8 characters.')
      .max(100, 'An idempotency key has at most 100 characters.'),
  })
  .refine((r) => Date.parse(r.observedAt) <= Date.now() + 5 * 60_000, {
    path: ['observedAt'],
    message: 'The time of the sighting is in the future. Check the phone’s clock.',
  });
export type IncidentReportInput = z.infer<typeof IncidentReportInputSchema>;

export const DECLINATION_SOURCES = ['typed', 'model', 'none'] as const;

/** A stored report, as the log keeps it. */
export const IncidentReportSchema = z.object({
  id: z.string(),
  seq: z.number().int(),
  postId: z.uuid(),
  postName: z.string(),
  observedAt: z.string(),
  bearingDeg: z.number(),
  bearingReference: bearing.bearingReference,
  /** The declination used, degrees east positive (0 for a true bearing). */
  declinationDeg: z.number(),
  /** Where the declination came from: typed by the person, the magnetic model, or none needed (true bearing). */
  declinationSource: z.enum(DECLINATION_SOURCES),
  trueBearingDeg: z.number(),
  bearingSigmaDeg: z.number(),
  verticalAngleDeg: z.number().nullable(),
  /** Null when no vertical angle was given (and in reports stored before these fields existed). */
  verticalAngleSigmaDeg: z.number().nullish(),
  verticalAngleReference: bearing.verticalAngleReference.unwrap().nullish(),
  /** The position given from a landmark, as stored (the landmark's name and place at the time). */
  landmark: z
    .object({
      landmarkId: z.uuid(),
      name: z.string(),
      latDeg: z.number(),
      lonDeg: z.number(),
      distanceM: z.number(),
      bearingDeg: z.number(),
      distanceSigmaM: z.number().nullable(),
      bearingSigmaDeg: z.number().nullable(),
    })
    .nullish(),
  kind: z.enum(SIGHTING_KINDS),
  note: z.string(),
  idempotencyKey: z.string(),
  reportedBy: z.object({ id: z.uuid(), name: z.string() }),
  recordedAt: z.string(),
});
export type IncidentReport = z.infer<typeof IncidentReportSchema>;

/**
 * The incident's current fix: from the latest bearing of each post that reported, or, while only one post has
 * reported, from its latest bearing and vertical angle (`method: 'vertical-angle'`, with `range`).
 */
export const IncidentFixSchema = FixSchema.extend({
  /** The reports (log sequence numbers) the fix was made from, one per post. */
  fromReports: z.array(z.number().int()),
  /** Per report: residual and whether it disagrees (three or more bearings). */
  lines: z.array(
    z.object({
      seq: z.number().int(),
      postId: z.uuid(),
      postName: z.string(),
      distanceM: z.number(),
      residualDeg: z.number(),
      flagged: z.boolean(),
    }),
  ),
  computedAt: z.string(),
});
export type IncidentFix = z.infer<typeof IncidentFixSchema>;

/** One line of the log. */
export const IncidentEntrySchema = z.object({
  seq: z.number().int(),
  kind: z.enum(INCIDENT_ENTRY_KINDS),
  actor: z.object({ id: z.uuid(), name: z.string() }),
  recordedAt: z.string(),
  body: z.record(z.string(), z.unknown()),
  prevHash: z.string().nullable(),
  hash: z.string(),
});
export type IncidentEntry = z.infer<typeof IncidentEntrySchema>;

/** Whether the log's hash chain is whole. */
export const ChainCheckSchema = z.object({
  intact: z.boolean(),
  entries: z.number().int(),
  /** The first entry whose hash does not match its content or its predecessor. */
  firstBrokenSeq: z.number().int().nullable(),
  /** Hash of the last entry (matches the incident's head when intact). */
  headHash: z.string().nullable(),
  message: z.string(),
});
export type ChainCheck = z.infer<typeof ChainCheckSchema>;

export const IncidentSchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  siteName: z.string(),
  title: z.string(),
  status: z.enum(INCIDENT_STATUSES),
  openedBy: z.object({ id: z.uuid(), name: z.string() }),
  openedAt: z.string(),
  closedAt: z.string().nullable(),
  entryCount: z.number().int(),
  reportCount: z.number().int(),
  /** The latest fix, if two or more posts have reported bearings that cross. */
  fix: IncidentFixSchema.nullable(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Incident = z.infer<typeof IncidentSchema>;

/** GET /api/v1/incidents/:id. */
export const IncidentDetailSchema = z.object({
  incident: IncidentSchema,
  reports: z.array(IncidentReportSchema),
  entries: z.array(IncidentEntrySchema),
  chain: ChainCheckSchema,
  /** Why there is no fix yet, when there is none. */
  fixProblem: z.string().nullable(),
});
export type IncidentDetail = z.infer<typeof IncidentDetailSchema>;

/** Answer of POST /api/v1/incidents/:id/reports. */
export const IncidentReportResultSchema = z.object({
  report: IncidentReportSchema,
  fix: IncidentFixSchema.nullable(),
  fixProblem: z.string().nullable(),
  /** True when this idempotency key had been stored before: nothing new was written. */
  replayed: z.boolean(),
  /** Whether the duty planners were e-mailed about a new fix. */
  mailed: z.boolean(),
});
export type IncidentReportResult = z.infer<typeof IncidentReportResultSchema>;

export { GeoJsonPolygonSchema };

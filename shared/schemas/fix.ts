import { z } from 'zod';
import { LatLonSchema } from './coordinate';

/*
 * Bearing fixes (POST /api/v1/fixes): bearings from posts or typed
 * positions → the fix, its error area and one report per bearing. Angles in
 * degrees (bearings clockwise from north, declination east positive),
 * lengths in metres, areas in square metres at this edge; the core in
 * shared/fixes works in radians.
 */

/** The most bearings one fix may take. */
export const MAX_FIX_BEARINGS = 20;

export const BEARING_REFERENCES = ['true', 'magnetic'] as const;
export type BearingReference = (typeof BEARING_REFERENCES)[number];

const degrees = (what: string, min: number, max: number) =>
  z
    .number({ error: `${what} must be a number of degrees.` })
    .min(min, `${what} must be at least ${min}°.`)
    .max(max, `${what} must be at most ${max}°.`);

export const VERTICAL_ANGLE_REFERENCES = ['horizontal', 'horizon'] as const;
export type VerticalAngleReference = (typeof VERTICAL_ANGLE_REFERENCES)[number];

/**
 * Default standard uncertainty of a vertical angle, degrees: 0.1° (6′), a level clinometer or an alidade's
 * vertical scale read to the nearest tenth of a degree; a hand-held clinometer is nearer 0.25–0.5°
 * (common practice, from memory). It matters: 0.1° moves a point seen 0.5° below the horizontal by about a fifth
 * of its range.
 */
export const DEFAULT_VERTICAL_SIGMA_DEG = 0.1;

/** A position a bearing was taken from when it is not one of the organisation's posts. */
export const FixObserverSchema = z.strictObject({
  latDeg: LatLonSchema.shape.latDeg,
  lonDeg: LatLonSchema.shape.lonDeg,
  /** Eye above the ground, metres (kept with the report; a fix on the ellipsoid does not use it). */
  eyeHeightM: z
    .number({ error: 'Eye height must be a number of metres.' })
    .min(0, 'Eye height cannot be negative.')
    .max(10_000, 'Eye height must be at most 10 000 m.')
    .optional(),
});

/** One bearing: from a post (`postId`) or a typed position (`observer`), never both. */
export const FixBearingSchema = z
  .strictObject({
    postId: z.uuid({ error: 'Not a post id.' }).optional(),
    observer: FixObserverSchema.optional(),
    /** The bearing as read, degrees clockwise from north (true or magnetic, see `bearingReference`), 0…360. */
    bearingDeg: degrees('The bearing', 0, 360),
    bearingReference: z.enum(BEARING_REFERENCES, { error: 'The bearing reference is true or magnetic.' }),
    /**
     * Magnetic declination at the post and date, degrees, east positive (true = magnetic + declination);
     * left out for a magnetic bearing, the World Magnetic Model's at the place and time is used.
     */
    declinationDeg: degrees('The declination', -90, 90).optional(),
    /** Standard uncertainty of the bearing, degrees (a tripod-mounted sight about 0.5°, a hand compass 1–2°). */
    bearingSigmaDeg: z
      .number({ error: 'The bearing uncertainty must be a number of degrees.' })
      .positive('The bearing uncertainty must be more than 0°.')
      .max(20, 'The bearing uncertainty must be at most 20°.'),
    /**
     * Angle of the sighting below (−) or above (+) the horizontal (or, with `verticalAngleReference: 'horizon'`,
     * the visible sea horizon), degrees. One bearing with a vertical angle gives a fix on its own (the ray meets the
     * terrain, or a smooth earth); with bearings from two or more posts it is kept but the bearings place the fix.
     */
    verticalAngleDeg: degrees('The vertical angle', -90, 90).optional(),
    /** Standard uncertainty of the vertical angle, degrees (default {@link DEFAULT_VERTICAL_SIGMA_DEG}). */
    verticalAngleSigmaDeg: z
      .number({ error: 'The vertical angle’s uncertainty must be a number of degrees.' })
      .positive('The vertical angle’s uncertainty must be more than 0°.')
      .max(10, 'The vertical angle’s uncertainty must be at most 10°.')
      .optional(),
    /** What the vertical angle is measured from: the true horizontal (level, clinometer) or the visible sea horizon. */
    verticalAngleReference: z
      .enum(VERTICAL_ANGLE_REFERENCES, { error: 'The vertical angle is measured from the horizontal or the horizon.' })
      .optional(),
  })
  .superRefine((b, ctx) => {
    if (b.postId === undefined && b.observer === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['postId'],
        message: 'Give the post, or the observer’s position { latDeg, lonDeg }.',
      });
    }
    if (b.postId !== undefined && b.observer !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['observer'], message: 'Give either a post or an observer’s position, not both.' });
    }
  });
export type FixBearing = z.infer<typeof FixBearingSchema>;

/** Body of POST /api/v1/fixes. */
export const FixRequestSchema = z.strictObject({
  /** When the bearings were taken (ISO 8601 with offset). */
  observedAt: z.iso.datetime({ offset: true, error: 'The time must be a date and time (ISO 8601).' }),
  bearings: z
    .array(FixBearingSchema, { error: 'Bearings must be a list.' })
    .min(1, 'A fix needs at least two bearings, or one with a vertical angle.')
    .max(MAX_FIX_BEARINGS, `At most ${MAX_FIX_BEARINGS} bearings per fix.`)
    .refine((list) => list.length >= 2 || list[0]?.verticalAngleDeg !== undefined, {
      message: 'A fix needs at least two bearings, or one with a vertical angle.',
    }),
});
export type FixRequest = z.infer<typeof FixRequestSchema>;

export const FIX_METHODS = ['two-bearing-intersection', 'least-squares', 'vertical-angle', 'landmark-offset'] as const;
export type FixMethod = (typeof FIX_METHODS)[number];

/** A GeoJSON polygon: one counter-clockwise ring of [longitude, latitude] degrees, closed. */
export const GeoJsonPolygonSchema = z.object({
  type: z.literal('Polygon'),
  coordinates: z.array(z.array(z.tuple([z.number(), z.number()]))),
});
export type GeoJsonPolygon = z.infer<typeof GeoJsonPolygonSchema>;

export const FIX_VISIBILITY_BASES = ['coverage-run', 'profile', 'no-terrain'] as const;
export type FixVisibilityBasis = (typeof FIX_VISIBILITY_BASES)[number];

/**
 * Whether a reporting post can see the fix point: the ground there, or else
 * how high a smoke (or anything) standing there must rise to show.
 */
export const FixVisibilitySchema = z.object({
  postId: z.uuid().nullable(),
  postName: z.string().nullable(),
  /** The post sees the ground at the fix; null when there is no terrain to tell. */
  seesGround: z.boolean().nullable(),
  /**
   * The least height above the ground at the fix that shows over the terrain from the post (the hidden height),
   * metres; 0 when the ground is seen, null when unknown (no terrain, or the point is off the terrain).
   */
  minSmokeHeightM: z.number().nullable(),
  /** Where the answer comes from: the site's latest finished coverage run, a terrain profile, or no terrain at all. */
  basis: z.enum(FIX_VISIBILITY_BASES),
  /** The refraction coefficient used, when terrain was used. */
  refractionK: z.number().nullable(),
  /** The same in words (metres). */
  message: z.string(),
});
export type FixVisibility = z.infer<typeof FixVisibilitySchema>;

export const FIX_RANGE_BASES = ['terrain', 'smooth-earth'] as const;

/** A one-post fix from a vertical angle: how far along the bearing, and the interval the angle's uncertainty allows. */
export const FixRangeSchema = z.object({
  /** Where the ray meets the ground: the terrain, or a smooth earth at the post's foot (no terrain). */
  basis: z.enum(FIX_RANGE_BASES),
  /** Ground distance from the post to the fix, metres. */
  distanceM: z.number(),
  /** Nearest distance the angle − its uncertainty gives, metres. */
  minM: z.number(),
  /** Farthest distance the angle + its uncertainty gives, metres; null when that ray meets no ground (open-ended). */
  maxM: z.number().nullable(),
  /** The angle used, below (−) or above (+) the horizontal, degrees (a horizon reading has the dip added). */
  angleFromHorizontalDeg: z.number(),
  verticalAngleSigmaDeg: z.number(),
  verticalAngleReference: z.enum(VERTICAL_ANGLE_REFERENCES),
  /** The refraction coefficient of the ray. */
  refractionK: z.number(),
  /** Eye above the datum the ray starts from, metres (ground + structure + eye with terrain; eye height above a smooth earth). */
  eyeAltitudeM: z.number(),
  /** In words, e.g. "no terrain: smooth-earth estimate". */
  message: z.string(),
});
export type FixRange = z.infer<typeof FixRangeSchema>;

/** The fix itself. */
export const FixSchema = z.object({
  latDeg: z.number(),
  lonDeg: z.number(),
  /** The error area (quadrilateral for two bearings, standard error ellipse for more). */
  errorArea: GeoJsonPolygonSchema,
  /** Its area on the WGS84 ellipsoid, square metres. */
  errorAreaM2: z.number(),
  /** How the error area is drawn and its source, in words. */
  errorAreaMethod: z.string(),
  /** Angle between the two bearings at the fix, degrees 0…180 (two bearings only). */
  cutAngleDeg: z.number().optional(),
  /** Observed minus computed true bearing per bearing, degrees (three or more bearings). */
  residualsDeg: z.array(z.number()).optional(),
  /** Error ellipse axes, metres, and the major axis' true bearing, degrees (three or more bearings). */
  errorEllipse: z.object({ semiMajorM: z.number(), semiMinorM: z.number(), majorAxisDeg: z.number() }).optional(),
  method: z.enum(FIX_METHODS),
  warnings: z.array(z.string()),
  /** One post with a vertical angle: the range along its bearing and its interval. */
  range: FixRangeSchema.optional(),
  /** A position given from a named landmark ("1.2 km at 040° from Crag Hut"). */
  fromLandmark: z
    .object({
      landmarkId: z.uuid(),
      name: z.string(),
      distanceM: z.number(),
      bearingDeg: z.number(),
      distanceSigmaM: z.number(),
      bearingSigmaDeg: z.number(),
    })
    .optional(),
  /** Per reporting post, whether it can see the fix point (added by the server where it knows the posts' terrain). */
  visibility: z.array(FixVisibilitySchema).optional(),
});
export type Fix = z.infer<typeof FixSchema>;

/** What each bearing says, with the fix. */
export const FixReportSchema = z.object({
  /** Position in the request's list, from 0. */
  index: z.number().int(),
  postId: z.uuid().nullable(),
  postName: z.string().nullable(),
  /** Where the bearing was taken, WGS84 degrees. */
  from: LatLonSchema,
  /** Eye above the ground, metres (the post's structure + eye height, or the observer's), null when not given. */
  eyeHeightM: z.number().nullable(),
  bearingDeg: z.number(),
  bearingReference: z.enum(BEARING_REFERENCES),
  /** Declination used, degrees east positive (0 for a true bearing). */
  declinationDeg: z.number(),
  /** Where it came from: typed with the bearing, the World Magnetic Model, or none needed (a true bearing). */
  declinationSource: z.enum(['typed', 'model', 'none']).optional(),
  /** The bearing from true north, degrees 0…360. */
  trueBearingDeg: z.number(),
  bearingSigmaDeg: z.number(),
  verticalAngleDeg: z.number().nullable(),
  /** Geodesic distance from where the bearing was taken to the fix, metres. */
  distanceM: z.number(),
  /** True bearing from there to the fix, degrees 0…360. */
  bearingToFixDeg: z.number(),
  /** trueBearingDeg − bearingToFixDeg, degrees −180…180. */
  residualDeg: z.number(),
  /** True when this bearing disagrees with the others (beyond 3σ). */
  flagged: z.boolean(),
});
export type FixReport = z.infer<typeof FixReportSchema>;

export const FIX_CAUTION_CODES = ['estimates-only', 'bearing-error', 'follow-procedures', 'vertical-angle'] as const;
/** A standing caution shown with every fix. */
export const FixCautionSchema = z.object({ code: z.enum(FIX_CAUTION_CODES), message: z.string() });
export type FixCaution = z.infer<typeof FixCautionSchema>;

/** Body of the answer to POST /api/v1/fixes. */
export const FixResultSchema = z.object({
  observedAt: z.string(),
  fix: FixSchema,
  reports: z.array(FixReportSchema),
  cautions: z.array(FixCautionSchema),
});
export type FixResult = z.infer<typeof FixResultSchema>;

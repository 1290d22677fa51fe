import { z } from 'zod';
import { LatLonSchema } from './lat-lon';

/**
 * A post's crew card (`GET /sites/:siteId/posts/:postId/card`, and as an A5
 * PDF at `…/card.pdf`): where the post is, how high the eye is, and how far
 * each target can be seen from it, for pinning on the tower wall. Lengths in
 * metres, bearings in degrees from true north.
 */

/** Where the card's figures come from. */
export const CrewCardBasisSchema = z.discriminatedUnion('kind', [
  z.object({
    /** The latest approved plan revision that uses this post (its frozen results). */
    kind: z.literal('approved-plan'),
    planId: z.uuid(),
    planTitle: z.string(),
    version: z.number().int(),
    revision: z.number().int(),
    /** ISO 8601. */
    approvedAt: z.string(),
    contentHash: z.string(),
  }),
  z.object({
    /** No approved plan uses the post: computed when asked, with the sightline core on smooth earth. */
    kind: z.literal('computed'),
    /** Which targets and conditions were used, for people. */
    scope: z.string(),
  }),
]);
export type CrewCardBasis = z.infer<typeof CrewCardBasisSchema>;

export const CrewCardRowSchema = z.object({
  targetName: z.string(),
  conditionSetName: z.string(),
  /** Refraction coefficient, dimensionless. */
  k: z.number(),
  horizonDistanceM: z.number().nullable(),
  geographicRangeM: z.number().nullable(),
  detectionRangeM: z.number().nullable(),
  limitedBy: z.string().nullable(),
});
export type CrewCardRow = z.infer<typeof CrewCardRowSchema>;

/** A named mark seen from the post: today the post's photos taken with a bearing. */
export const CrewCardMarkSchema = z.object({
  name: z.string(),
  attachmentId: z.uuid().nullable(),
  /** Bearing from the post, degrees true. */
  bearingTrueDeg: z.number(),
  /** Magnetic bearing; null: no declination is known (Kenning has no magnetic model). */
  bearingMagneticDeg: z.number().nullable(),
  /** Distance from the post, metres; null when not recorded. */
  distanceM: z.number().nullable(),
});

export const CrewCardSchema = z.object({
  post: z.object({
    id: z.uuid(),
    name: z.string(),
    kind: z.string(),
    status: z.string(),
    location: LatLonSchema,
    groundElevationM: z.number(),
    structureHeightM: z.number(),
    eyeHeightM: z.number(),
    /** Height of eye above the datum the ranges are counted from. */
    heightOfEyeM: z.number(),
    sector: z.object({ fromDeg: z.number(), toDeg: z.number() }).nullable(),
  }),
  site: z.object({ id: z.uuid(), name: z.string(), timeZone: z.string() }),
  /** MGRS reference of the post (1 m), or a note where MGRS does not reach. */
  mgrs: z.string(),
  basis: CrewCardBasisSchema,
  rows: z.array(CrewCardRowSchema),
  marks: z.array(CrewCardMarkSchema),
  /** Magnetic declination in degrees east and its date, or null when none is known. */
  declination: z.object({ deg: z.number(), date: z.string() }).nullable(),
  cautions: z.array(z.string()),
  /** ISO 8601. */
  generatedAt: z.string(),
});
export type CrewCard = z.infer<typeof CrewCardSchema>;

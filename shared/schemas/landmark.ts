import { z } from 'zod';
import { LatLonSchema } from './lat-lon';
import { SeenVersionSchema } from './seen-version';

/*
 * Landmarks: named reference marks of a site (a hut, a cairn, a mast) used
 * to give a position as a distance and bearing from them, and in
 * landmark-range drills. Degrees WGS84, metres.
 */

const name = z
  .string({ error: 'Give the landmark a name.' })
  .trim()
  .min(1, 'Give the landmark a name.')
  .max(120, 'At most 120 characters.');

/** Body of POST /api/v1/sites/:siteId/landmarks. */
export const LandmarkInputSchema = z.strictObject({
  name,
  latDeg: LatLonSchema.shape.latDeg,
  lonDeg: LatLonSchema.shape.lonDeg,
  /** Height of the mark above its ground, metres (a mast, a cairn), when known. */
  heightM: z
    .number({ error: 'The height must be a number of metres.' })
    .min(0, 'The height cannot be negative.')
    .max(1000, 'The height must be at most 1 000 m.')
    .nullable()
    .optional(),
  note: z.string().trim().max(1000, 'At most 1 000 characters.').default(''),
});
export type LandmarkInput = z.infer<typeof LandmarkInputSchema>;

/** Body of PATCH /api/v1/sites/:siteId/landmarks/:landmarkId: any field, with the version seen. */
export const LandmarkUpdateSchema = LandmarkInputSchema.partial().extend({ version: SeenVersionSchema });
export type LandmarkUpdate = z.infer<typeof LandmarkUpdateSchema>;

export const LandmarkSchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  name: z.string(),
  latDeg: z.number(),
  lonDeg: z.number(),
  heightM: z.number().nullable(),
  note: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type Landmark = z.infer<typeof LandmarkSchema>;

/** A position given as "1.2 km at 040° from Crag Hut". */
export const LandmarkOffsetSchema = z.strictObject({
  landmarkId: z.uuid({ error: 'Choose the landmark.' }),
  /** Ground distance from the landmark, metres. */
  distanceM: z
    .number({ error: 'The distance must be a number of metres.' })
    .min(0, 'The distance cannot be negative.')
    .max(100_000, 'At most 100 km from a landmark.'),
  /** True bearing from the landmark to the position, degrees 0…360. */
  bearingDeg: z
    .number({ error: 'The bearing must be a number of degrees.' })
    .min(0, 'The bearing must be at least 0°.')
    .max(360, 'The bearing must be at most 360°.'),
  /** Standard uncertainty of that bearing, degrees (default 5°, a bearing estimated by eye). */
  bearingSigmaDeg: z.number().positive('The bearing’s uncertainty must be more than 0°.').max(45).optional(),
  /** Standard uncertainty of the distance, metres (default a tenth of it, at least 50 m). */
  distanceSigmaM: z.number().positive('The distance’s uncertainty must be more than 0 m.').max(50_000).optional(),
});
export type LandmarkOffset = z.infer<typeof LandmarkOffsetSchema>;

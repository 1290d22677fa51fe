import { z } from 'zod';
import { EncodedClassRasterSchema } from '@/shared/schemas/coverage';
import { GridSpecMSchema } from '@/shared/schemas/grid-spec';

/** States of a visibility index layer's job. */
export const VISIBILITY_INDEX_STATUSES = ['queued', 'running', 'done', 'failed'] as const;
export type VisibilityIndexStatus = (typeof VISIBILITY_INDEX_STATUSES)[number];

/** Bounds of the request, metres: a tower up to 200 m, a radius of 250 m to 50 km. */
export const VISIBILITY_INDEX_LIMITS = { maxHeightM: 200, minRadiusM: 250, maxRadiusM: 50_000 } as const;

/** Classes of the map layer: 0 = not computed, 1…CLASS_COUNT = equal steps of seen area up to the largest. */
export const VISIBILITY_INDEX_CLASS_COUNT = 6;

const metres = (field: string) =>
  z.coerce
    .number({ error: `${field} must be a number of metres.` })
    .refine(Number.isFinite, `${field} must be a number of metres.`);

/** `GET /sites/:siteId/visibility-index?heightM=&radiusM=`. */
export const VisibilityIndexQuerySchema = z.object({
  /** Eye height of the imagined tower above the ground, metres. */
  heightM: metres('The tower height')
    .min(0, 'The tower height must be 0 m or more.')
    .max(VISIBILITY_INDEX_LIMITS.maxHeightM, `The tower height must be at most ${VISIBILITY_INDEX_LIMITS.maxHeightM} m.`),
  /** Radius around the tower that is counted, metres. */
  radiusM: metres('The radius')
    .min(VISIBILITY_INDEX_LIMITS.minRadiusM, `The radius must be at least ${VISIBILITY_INDEX_LIMITS.minRadiusM} m.`)
    .max(VISIBILITY_INDEX_LIMITS.maxRadiusM, `The radius must be at most ${VISIBILITY_INDEX_LIMITS.maxRadiusM / 1000} km.`),
});
export type VisibilityIndexQuery = z.infer<typeof VisibilityIndexQuerySchema>;

/** The index grid: every `strideCells`-th terrain cell, top-left corner of the terrain's grid; EPSG code of its CRS. */
export const VisibilityIndexGridSchema = GridSpecMSchema.extend({ epsg: z.number().int().nullable() });
export type VisibilityIndexGrid = z.infer<typeof VisibilityIndexGridSchema>;

/** The computed layer, as the map draws it. */
export const VisibilityIndexMapLayerSchema = z.object({
  /** Class per index cell (see VISIBILITY_INDEX_CLASS_COUNT), on the index grid. */
  raster: EncodedClassRasterSchema,
  /** Upper bound of each class 1…N of seen ground inside the site, m² (class c covers (upper[c−2], upper[c−1]]). */
  classUpperM2: z.array(z.number()),
  /** Most seen ground from any evaluated cell, m². */
  maxSeenM2: z.number(),
});
export type VisibilityIndexMapLayer = z.infer<typeof VisibilityIndexMapLayerSchema>;

/** A visibility index layer and its job. */
export const VisibilityIndexSchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  terrainId: z.uuid(),
  heightM: z.number(),
  radiusM: z.number(),
  /** Rays cast from each evaluated cell. */
  rays: z.number().int(),
  /** Every n-th terrain cell is evaluated; null until the job has started. */
  strideCells: z.number().int().nullable(),
  status: z.enum(VISIBILITY_INDEX_STATUSES),
  /** 0–1. */
  progress: z.number(),
  error: z.string().nullable(),
  /** Area of the site on the terrain, m² (the whole grid when the site has no boundary). */
  siteAreaM2: z.number().nullable(),
  elapsedS: z.number().nullable(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
  /** Present once done. */
  layer: VisibilityIndexMapLayerSchema.nullable(),
});
export type VisibilityIndex = z.infer<typeof VisibilityIndexSchema>;

/** Answer of the endpoint: 200 when done, 202 while queued or running (poll again). */
export const VisibilityIndexResponseSchema = z.object({ index: VisibilityIndexSchema });

import { z } from 'zod';
import { GridSpecMSchema } from './grid-spec';
import { LatLonSchema } from './lat-lon';
import { RefractionConditionSchema } from './sightline';

/*
 * Site terrain: the metadata of an uploaded elevation grid, its base layer,
 * elevation look-ups and terrain profiles. Lengths in metres, positions as
 * WGS84 degrees at this edge; grid coordinates are metres in the terrain's
 * projected CRS.
 */

/** Formats a terrain file may come in. */
export const TERRAIN_FORMATS = ['geotiff', 'esri-ascii'] as const;
export const TerrainFormatSchema = z.enum(TERRAIN_FORMATS);
export type TerrainFormat = z.infer<typeof TerrainFormatSchema>;

export const TERRAIN_FORMAT_LABELS: Record<TerrainFormat, string> = {
  geotiff: 'GeoTIFF',
  'esri-ascii': 'ESRI ASCII grid',
};

/** A rectangle in the terrain's CRS, metres. */
export const GridBoundsSchema = z.object({
  west: z.number(),
  south: z.number(),
  east: z.number(),
  north: z.number(),
});
export type GridBounds = z.infer<typeof GridBoundsSchema>;

const LatLonOutSchema = z.object({ latDeg: z.number(), lonDeg: z.number() });

/**
 * How to draw the terrain under a map. Today one picture (`kind: 'image'`)
 * spanning `gridBounds`; its corners are given as latitude/longitude because a
 * projected grid is not a rectangle in degrees. A tile source may be added
 * later as another `kind`.
 */
export const TerrainBaseLayerSchema = z.object({
  kind: z.literal('image'),
  /** What the picture shows. */
  style: z.literal('hillshade'),
  /** Same-origin URL of the PNG (grey with alpha; nodata transparent). */
  url: z.string(),
  /** Picture size, pixels. */
  widthPx: z.number().int(),
  heightPx: z.number().int(),
  /** The grid's extent in its CRS, metres: the picture's edges. */
  gridBounds: GridBoundsSchema,
  /** The picture's corners as WGS84 positions. */
  corners: z.object({
    northWest: LatLonOutSchema,
    northEast: LatLonOutSchema,
    southEast: LatLonOutSchema,
    southWest: LatLonOutSchema,
  }),
});
export type TerrainBaseLayer = z.infer<typeof TerrainBaseLayerSchema>;

/** The metadata of one terrain of a site. */
export const SiteTerrainSchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  /** Whether this is the site's current terrain (older ones stay for plan revisions). */
  active: z.boolean(),
  /** File name as uploaded. */
  originalName: z.string(),
  originalFormat: TerrainFormatSchema,
  /** Size, cell size and lower-left corner of the grid (metres in its CRS). */
  ...GridSpecMSchema.shape,
  crs: z.object({
    epsg: z.number().int().nullable(),
    /** Well-known text when the upload carried one (.prj). */
    wkt: z.string().nullable(),
    /** For people, e.g. "WGS 84 / UTM zone 33N (EPSG:32633)". */
    label: z.string(),
  }),
  /** The nodata marker of the uploaded file, if it had one (the stored grid marks nodata as NaN). */
  nodataValue: z.number().nullable(),
  /** Cells without data. */
  nodataCells: z.number().int(),
  /** Lowest and highest ground, metres. */
  minElevationM: z.number(),
  maxElevationM: z.number(),
  /** sha256 of the stored (normalised Float32 GeoTIFF) grid, hex. */
  sha256: z.string(),
  /** Whether every point of the site's boundary has ground data; null when the site has no boundary. */
  coversBoundary: z.boolean().nullable(),
  uploadedBy: z.object({ id: z.uuid().nullable(), name: z.string() }),
  /** ISO 8601. */
  createdAt: z.string(),
  baseLayer: TerrainBaseLayerSchema,
});
export type SiteTerrain = z.infer<typeof SiteTerrainSchema>;

/** Body of GET/POST …/terrain: `{ terrain }`. */
export const SiteTerrainResponseSchema = z.object({ terrain: SiteTerrainSchema });
export type SiteTerrainResponse = z.infer<typeof SiteTerrainResponseSchema>;

/**
 * The text fields of a terrain upload (multipart, beside the `file` and
 * optional `prj` files): `epsg`, the EPSG code of a grid that carries no CRS
 * of its own.
 */
export const TerrainUploadFieldsSchema = z.object({
  epsg: z.preprocess(
    (value) => (typeof value === 'string' && value.trim() === '' ? undefined : value),
    z
      .string({ error: 'Give the EPSG code as a number, e.g. 32633 for WGS 84 / UTM zone 33N.' })
      .trim()
      .regex(/^\d{4,6}$/, 'Give the EPSG code as a number, e.g. 32633 for WGS 84 / UTM zone 33N.')
      .transform(Number)
      .optional(),
  ),
});
export type TerrainUploadFields = z.infer<typeof TerrainUploadFieldsSchema>;

const queryNumber = (what: string, min: number, max: number) =>
  z.coerce
    .number({ error: `${what} must be a number of degrees.` })
    .refine(Number.isFinite, `${what} must be a number of degrees.`)
    .pipe(z.number().min(min, `${what} must be at least ${min}°.`).max(max, `${what} must be at most ${max}°.`));

/** Query of GET …/terrain/elevation. */
export const ElevationQuerySchema = z.object({
  latDeg: queryNumber('Latitude', -90, 90),
  lonDeg: queryNumber('Longitude', -180, 180),
});
export type ElevationQuery = z.infer<typeof ElevationQuerySchema>;

/** Body of GET …/terrain/elevation. */
export const ElevationResponseSchema = z.object({
  terrainId: z.uuid(),
  latDeg: z.number(),
  lonDeg: z.number(),
  /** Grid position, metres in the terrain's CRS. */
  xM: z.number(),
  yM: z.number(),
  /** Ground elevation (bilinear between cell centres), metres above the terrain's vertical datum. */
  elevationM: z.number(),
});
export type ElevationResponse = z.infer<typeof ElevationResponseSchema>;

const heightM = (what: string) =>
  z
    .number({ error: `${what} must be a number of metres.` })
    .min(0, `${what} cannot be negative.`)
    .max(10_000, `${what} must be at most 10 000 m.`);

/** The observer of a profile: a post of the site, or a position with an eye height. */
const ProfileObserverSchema = z.strictObject({
  latDeg: LatLonSchema.shape.latDeg,
  lonDeg: LatLonSchema.shape.lonDeg,
  /** Eye above the ground at that position, metres (tower, cab and eye together). */
  eyeHeightM: heightM('Eye height'),
});

/**
 * Body of POST …/terrain/profile: `postId` (eye = the post's structure + eye
 * height above the terrain's ground there) or `observer`, the `target`'s foot,
 * its height above ground, and 1 … 10 refraction conditions (as the sightline
 * API takes them).
 */
export const TerrainProfileRequestSchema = z
  .strictObject({
    postId: z.uuid({ error: 'Not a post id.' }).optional(),
    observer: ProfileObserverSchema.optional(),
    target: LatLonSchema,
    /** Height of the target's top above its ground, metres (0 = the ground itself). */
    targetHeightM: heightM('Target height'),
    conditions: z
      .array(RefractionConditionSchema, { error: 'Conditions must be a list.' })
      .min(1, 'Give at least one refraction condition.')
      .max(10, 'At most 10 conditions per profile.'),
    /** Earth radius, metres (default the IUGG mean 6 371 008.8). */
    earthRadiusM: z
      .number({ error: 'Earth radius must be a number of metres.' })
      .min(6_000_000, 'Earth radius must be at least 6 000 000 m.')
      .max(7_000_000, 'Earth radius must be at most 7 000 000 m.')
      .optional(),
  })
  .superRefine((body, ctx) => {
    if (body.postId === undefined && body.observer === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['observer'],
        message: 'Give the observer: a postId, or observer { latDeg, lonDeg, eyeHeightM }.',
      });
    }
    if (body.postId !== undefined && body.observer !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['observer'], message: 'Give either a postId or an observer, not both.' });
    }
  });
export type TerrainProfileRequest = z.infer<typeof TerrainProfileRequestSchema>;

/** A point of the ground along a profile. */
export const ProfilePointSchema = z.object({
  /** Horizontal distance from the observer, metres. */
  distanceM: z.number(),
  /** Ground elevation, metres. */
  groundElevationM: z.number(),
  /** The same, lowered by this condition's curvature drop, metres. */
  loweredElevationM: z.number(),
});
export type ProfilePoint = z.infer<typeof ProfilePointSchema>;

/** The profile under one refraction condition. */
export const ProfileConditionResultSchema = z.object({
  /** Refraction coefficient used, dimensionless. */
  k: z.number(),
  /** Effective radius R/(1 − k), metres; null when k ≥ 1 (ducting: no such sphere). */
  effectiveRadiusM: z.number().nullable(),
  /** Ground at each sample minus (1 − k)·d²/(2R), metres; null where the ground has no data. */
  loweredGroundM: z.array(z.number().nullable()),
  /** The straight sight line in this frame, from the eye (distance 0) to the target's top. */
  sightLine: z.object({ eyeElevationM: z.number(), targetTopElevationM: z.number() }),
  /** Height above the target's ground its top must reach to be seen, metres. */
  hiddenHeightM: z.number(),
  /** The ground that sets the horizon toward the target; null when the target's ground is seen. */
  horizon: ProfilePointSchema.nullable(),
  /** The first ground rising above the sight line to the target's top; null when the top is seen. */
  firstObstruction: ProfilePointSchema.nullable(),
  groundSeen: z.boolean(),
  targetTopSeen: z.boolean(),
});
export type ProfileConditionResult = z.infer<typeof ProfileConditionResultSchema>;

/** Body of POST …/terrain/profile. */
export const TerrainProfileResponseSchema = z.object({
  terrainId: z.uuid(),
  observer: z.object({
    latDeg: z.number(),
    lonDeg: z.number(),
    postId: z.uuid().nullable(),
    /** Terrain ground under the observer (bilinear), metres. */
    groundElevationM: z.number(),
    /** The post's recorded ground elevation, when the observer is a post, metres. */
    recordedGroundElevationM: z.number().nullable(),
    /** Eye above that ground, metres. */
    eyeHeightM: z.number(),
    eyeElevationM: z.number(),
  }),
  target: z.object({
    latDeg: z.number(),
    lonDeg: z.number(),
    groundElevationM: z.number(),
    heightM: z.number(),
  }),
  /** Horizontal distance, metres (grid metres of the terrain's CRS). */
  distanceM: z.number(),
  /** Bearing from observer to target, degrees clockwise from grid north. */
  gridBearingDeg: z.number(),
  /** Distance between samples, metres (half a cell, or more on long lines). */
  spacingM: z.number(),
  /** Samples along the line, observer first. */
  samples: z.array(z.object({ distanceM: z.number(), groundElevationM: z.number().nullable() })),
  /** One result per condition, in request order. */
  results: z.array(ProfileConditionResultSchema),
  /** Standing cautions. */
  cautions: z.array(z.object({ code: z.string(), message: z.string() })),
});
export type TerrainProfileResponse = z.infer<typeof TerrainProfileResponseSchema>;

/** Query of GET …/terrain/mesh: the longest edge of the decimated grid, cells (16 … 1024, default 256). */
export const TerrainMeshQuerySchema = z.object({
  maxEdge: z.coerce
    .number({ error: 'maxEdge must be a whole number of cells.' })
    .int('maxEdge must be a whole number of cells.')
    .min(16, 'maxEdge must be at least 16 cells.')
    .max(1024, 'maxEdge must be at most 1024 cells.')
    .default(256),
});
export type TerrainMeshQuery = z.infer<typeof TerrainMeshQuerySchema>;

/** How the heights of a terrain mesh are written: little-endian Float32 bytes (NaN = nodata) as base64 (RFC 4648 §4). */
export const TERRAIN_MESH_ENCODING = 'float32le-base64';

/**
 * Body of GET …/terrain/mesh: the site's terrain decimated to at most
 * `maxEdge` cells a side (block means, see `decimateTerrain`), for a 3D view.
 * Row 0 = north; cell (col, row) stands for its centre at
 * `xllM + (col + 0.5)·cellSizeM`, `yllM + (height − row − 0.5)·cellSizeM`.
 */
export const TerrainMeshResponseSchema = z.object({
  terrainId: z.uuid(),
  /** The mesh grid: size, side of a mesh cell and lower-left corner, metres in the terrain's CRS. */
  ...GridSpecMSchema.shape,
  /** Terrain cells per mesh cell along each axis. */
  factor: z.number().int(),
  /** Lowest and highest ground of the mesh, metres. */
  minElevationM: z.number(),
  maxElevationM: z.number(),
  encoding: z.literal(TERRAIN_MESH_ENCODING),
  /** width × height Float32 heights, metres. */
  heights: z.string(),
});
export type TerrainMeshResponse = z.infer<typeof TerrainMeshResponseSchema>;

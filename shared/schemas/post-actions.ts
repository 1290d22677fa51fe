import { z } from 'zod';
import { LatLonSchema } from './lat-lon';
import { PostSchema, SiteSchema } from './site';
import { SeenVersionSchema } from './seen-version';

/** Body of POST …/posts/:postId/move: the new position (WGS 84) and the version last seen. */
export const PostMoveSchema = z.object({
  location: LatLonSchema,
  version: SeenVersionSchema,
});
export type PostMove = z.infer<typeof PostMoveSchema>;

/**
 * Answer of a move: the post, and where its ground elevation came from —
 * the site's terrain at the new position, or kept as it was (a site without terrain).
 */
export const PostMoveResponseSchema = z.object({
  post: PostSchema,
  ground: z.discriminatedUnion('from', [
    z.object({ from: z.literal('terrain'), terrainId: z.uuid(), elevationM: z.number(), previousM: z.number() }),
    z.object({ from: z.literal('kept'), elevationM: z.number() }),
  ]),
});
export type PostMoveResponse = z.infer<typeof PostMoveResponseSchema>;

/** Body of POST …/sites/:siteId/boundary-from-terrain: the site's version last seen. */
export const BoundaryFromTerrainSchema = z.object({ version: SeenVersionSchema });

/** Answer of boundary-from-terrain: the site with its new boundary and the terrain it came from. */
export const BoundaryFromTerrainResponseSchema = z.object({
  site: SiteSchema,
  terrainId: z.uuid(),
  /** Corners of the saved ring (closing corner included). */
  corners: z.number().int(),
});

import { pipeline } from 'node:stream/promises';
import { Router } from 'express';
import { z } from 'zod';
import {
  ElevationQuerySchema,
  TerrainMeshQuerySchema,
  TerrainProfileRequestSchema,
  TerrainUploadFieldsSchema,
} from '@/shared/schemas/terrain';
import { BoundaryFromTerrainSchema, PostMoveSchema } from '@/shared/schemas/post-actions';
import { getSite } from '@/server/domain/sites/manage-sites';
import { boundaryFromTerrain, movePost } from '@/server/domain/terrain/place-on-terrain';
import { shorelineFromTerrain } from '@/server/domain/terrain/shoreline-from-terrain';
import {
  getActiveTerrain,
  openHillshade,
  profileTerrain,
  terrainElevation,
  terrainMesh,
  uploadTerrain,
  type TerrainDeps,
} from '@/server/domain/terrain/manage-terrain';
import { AppError } from '@/server/domain/app-error';
import { receiveUpload } from '@/server/http/multipart';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const SiteParams = z.object({ siteId: z.uuid({ error: 'Not a site id.' }) });
const ShorelineTraceSchema = z.object({
  levelM: z
    .number({ error: 'The level must be a number of metres.' })
    .min(-500, 'At least −500 m.')
    .max(9000, 'At most 9 000 m.'),
});
const PostParams = SiteParams.extend({ postId: z.uuid({ error: 'Not a post id.' }) });
const HillshadeQuery = z.object({ terrainId: z.uuid({ error: 'Not a terrain id.' }).optional() });

/** Settings of the terrain upload route. */
export interface TerrainUploadSettings {
  /** Parent folder of the per-request temporary folders. */
  tmpDir: string;
  /** Largest upload, bytes. */
  maxBytes: number;
}

const megabytes = (bytes: number) =>
  bytes >= 1_000_000
    ? `${Math.floor(bytes / 1_000_000).toLocaleString('en')} MB`
    : `${Math.floor(bytes / 1000).toLocaleString('en')} kB`;

/** A site's terrain: upload (planners), metadata, hillshade, elevation, mesh and profile (every role). */
export function terrainRoutes(deps: TerrainDeps, upload: TerrainUploadSettings) {
  const router = Router();

  router.get('/sites/:siteId/terrain', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    res.json({ terrain: await getActiveTerrain(actorOf(req), siteId) });
  });

  router.post('/sites/:siteId/terrain', requireUser, requireRole('planner'), async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const actor = actorOf(req);
    await getSite(actor, siteId); // 404 before taking the body
    const received = await receiveUpload(req, res, {
      tmpRoot: upload.tmpDir,
      maxBytes: upload.maxBytes,
      fileFields: ['file', 'prj'],
      tooLarge: (field) =>
        new AppError(
          413,
          'terrain_too_large',
          `The file is larger than ${megabytes(upload.maxBytes)}, the most Kenning takes. Clip the terrain to the site or resample it to a coarser cell (e.g. gdalwarp -tr 25 25), or send it as a GeoTIFF (smaller than an ASCII grid).`,
          { [field]: `At most ${megabytes(upload.maxBytes)}.` },
        ),
    });
    let terrain;
    try {
      const file = received.files.file;
      if (!file) {
        throw AppError.badRequest('Choose a terrain file to upload.', {
          file: 'Choose a GeoTIFF (.tif, .tiff) or an ESRI ASCII grid (.asc).',
        });
      }
      const { epsg } = parseOrThrow(TerrainUploadFieldsSchema, received.fields, 'upload');
      terrain = await uploadTerrain(deps, actor, siteId, {
        file,
        prj: received.files.prj ?? null,
        epsg: epsg ?? null,
        workDir: received.dir,
      });
    } finally {
      // Before answering, so nothing of the upload is left on disk once the caller hears back.
      await received.cleanup();
    }
    res.status(201).json({ terrain });
  });

  router.get('/sites/:siteId/terrain/hillshade.png', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const { terrainId } = parseOrThrow(HillshadeQuery, req.query, 'query');
    const { stream } = await openHillshade(deps, actorOf(req), siteId, terrainId);
    res.setHeader('Content-Type', 'image/png');
    // A terrain never changes once stored (a replacement gets a new id), so an image named by id can be kept.
    res.setHeader('Cache-Control', terrainId ? 'private, max-age=31536000, immutable' : 'private, no-cache');
    await pipeline(stream, res);
  });

  router.get('/sites/:siteId/terrain/elevation', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const query = parseOrThrow(ElevationQuerySchema, req.query, 'query');
    res.json(await terrainElevation(deps, actorOf(req), siteId, query));
  });

  router.get('/sites/:siteId/terrain/mesh', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const { maxEdge } = parseOrThrow(TerrainMeshQuerySchema, req.query, 'query');
    res.setHeader('Cache-Control', 'private, no-cache');
    res.json(await terrainMesh(deps, actorOf(req), siteId, maxEdge));
  });

  router.post('/sites/:siteId/terrain/profile', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const body = parseOrThrow(TerrainProfileRequestSchema, req.body, 'profile');
    res.json(await profileTerrain(deps, actorOf(req), siteId, body));
  });

  // A post dragged on the map: its ground comes from the terrain at the new place.
  router.post('/sites/:siteId/posts/:postId/move', requireUser, requireRole('planner'), async (req, res) => {
    const { siteId, postId } = parseOrThrow(PostParams, req.params, 'address');
    const move = parseOrThrow(PostMoveSchema, req.body, 'move');
    res.json(await movePost(deps, actorOf(req), siteId, postId, move));
  });

  router.post('/sites/:siteId/boundary-from-terrain', requireUser, requireRole('planner'), async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const { version } = parseOrThrow(BoundaryFromTerrainSchema, req.body, 'site');
    res.json(await boundaryFromTerrain(deps, actorOf(req), siteId, version));
  });

  // A shoreline traced at a stated level; not saved (the site form takes it).
  router.post('/sites/:siteId/shoreline-from-terrain', requireUser, requireRole('planner'), async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const { levelM } = parseOrThrow(ShorelineTraceSchema, req.body, 'trace');
    res.json(await shorelineFromTerrain(deps, actorOf(req), siteId, levelM));
  });

  return router;
}

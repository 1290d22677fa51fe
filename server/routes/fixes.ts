import { Router } from 'express';
import { FixRequestSchema } from '@/shared/schemas/fix';
import { computeFix } from '@/server/domain/fixes/compute-fix';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import { actorOf, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

/**
 * Bearing fixes without storing anything (any signed-in role): a request of
 * the wrong shape is a 400 `invalid_input`, a post of another organisation a
 * 404, bearings that do not cross a 422 `fix_input`, each with the field at fault. With the terrain
 * cache, the fix says whether each post can see it (`fix.visibility`).
 */
export function fixRoutes(terrainCache?: TerrainCache) {
  const router = Router();
  router.post('/fixes', requireUser, async (req, res) => {
    const input = parseOrThrow(FixRequestSchema, req.body, 'fix request');
    res.json(await computeFix(actorOf(req), input, terrainCache));
  });
  return router;
}

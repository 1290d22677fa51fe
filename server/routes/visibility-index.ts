import { Router } from 'express';
import { z } from 'zod';
import { VisibilityIndexQuerySchema } from '@/shared/schemas/visibility-index';
import type { VisibilityIndexQueue } from '@/server/domain/ports/visibility-index-queue';
import { requestVisibilityIndex } from '@/server/domain/visibility-index/request-visibility-index';
import { actorOf, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const SiteParams = z.object({ siteId: z.uuid({ error: 'Not a site id.' }) });

/**
 * `GET /sites/:siteId/visibility-index?heightM=&radiusM=`: the stored layer
 * (200) or its job, started if need be (202; poll the same address). Bad
 * parameters are a 400 `invalid_input` naming the field, as everywhere in the API.
 */
export function visibilityIndexRoutes(deps: { queue: VisibilityIndexQueue | null }) {
  const router = Router();
  router.get('/sites/:siteId/visibility-index', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const query = parseOrThrow(VisibilityIndexQuerySchema, req.query, 'visibility index request');
    const { ready, index } = await requestVisibilityIndex(deps, actorOf(req), siteId, query);
    res.status(ready || index.status === 'failed' ? 200 : 202).json({ index });
  });
  return router;
}

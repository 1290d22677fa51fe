import { Router } from 'express';
import { z } from 'zod';
import { VisibilityIndexQuerySchema } from '@/shared/schemas/visibility-index';
import { AppError } from '@/server/domain/app-error';
import type { VisibilityIndexQueue } from '@/server/domain/ports/visibility-index-queue';
import { requestVisibilityIndex } from '@/server/domain/visibility-index/request-visibility-index';
import { actorOf, requireUser } from '@/server/http/session';
import { fieldErrors, parseOrThrow } from '@/server/http/validate';

const SiteParams = z.object({ siteId: z.uuid({ error: 'Not a site id.' }) });

/**
 * `GET /sites/:siteId/visibility-index?heightM=&radiusM=`: the stored layer
 * (200) or its job, started if need be (202; poll the same address). Bad
 * parameters are a 422 naming the field.
 */
export function visibilityIndexRoutes(deps: { queue: VisibilityIndexQueue | null }) {
  const router = Router();
  router.get('/sites/:siteId/visibility-index', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const parsed = VisibilityIndexQuerySchema.safeParse(req.query);
    if (!parsed.success) {
      throw new AppError(422, 'invalid_input', 'The visibility index request has invalid fields.', fieldErrors(parsed.error));
    }
    const { ready, index } = await requestVisibilityIndex(deps, actorOf(req), siteId, parsed.data);
    res.status(ready || index.status === 'failed' ? 200 : 202).json({ index });
  });
  return router;
}

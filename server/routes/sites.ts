import { Router } from 'express';
import { PageQuerySchema } from '@/shared/schemas/site';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { actorOf, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

export function siteRoutes() {
  const router = Router();
  router.get('/sites', requireUser, async (req, res) => {
    const { page, pageSize } = parseOrThrow(PageQuerySchema, req.query, 'query');
    res.json(await sitesRepository.pageInOrganization(actorOf(req).organizationId, page, pageSize));
  });
  return router;
}

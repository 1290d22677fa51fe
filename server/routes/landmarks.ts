import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { LandmarkInputSchema, LandmarkUpdateSchema } from '@/shared/schemas/landmark';
import { createLandmark, deleteLandmark, listLandmarks, updateLandmark } from '@/server/domain/landmarks/manage-landmarks';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const SiteParams = z.object({ siteId: z.uuid({ error: 'Not a site id.' }) });
const LandmarkParams = SiteParams.extend({ landmarkId: z.uuid({ error: 'Not a landmark id.' }) });

/** A site's landmarks. Every role reads; planners write (as for posts). */
export function landmarkRoutes(db: Sequelize) {
  const router = Router();
  const write = [requireUser, requireRole('planner')];
  router.get('/sites/:siteId/landmarks', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    res.json(await listLandmarks(actorOf(req), siteId));
  });
  router.post('/sites/:siteId/landmarks', ...write, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const input = parseOrThrow(LandmarkInputSchema, req.body, 'landmark');
    res.status(201).json({ landmark: await createLandmark({ db }, actorOf(req), siteId, input) });
  });
  router.patch('/sites/:siteId/landmarks/:landmarkId', ...write, async (req, res) => {
    const { siteId, landmarkId } = parseOrThrow(LandmarkParams, req.params, 'address');
    const input = parseOrThrow(LandmarkUpdateSchema, req.body, 'landmark');
    res.json({ landmark: await updateLandmark({ db }, actorOf(req), siteId, landmarkId, input) });
  });
  router.delete('/sites/:siteId/landmarks/:landmarkId', ...write, async (req, res) => {
    const { siteId, landmarkId } = parseOrThrow(LandmarkParams, req.params, 'address');
    await deleteLandmark({ db }, actorOf(req), siteId, landmarkId);
    res.status(204).end();
  });
  return router;
}

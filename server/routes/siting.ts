import { Router } from 'express';
import { z } from 'zod';
import { SitingRunInputSchema } from '@/shared/schemas/siting';
import {
  cancelSitingRun,
  getSitingRun,
  listSitingRuns,
  planFromSiting,
  requestSiting,
  type SitingDeps,
} from '@/server/domain/siting/manage-siting';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const SiteParams = z.object({ siteId: z.uuid({ error: 'Not a site id.' }) });
const RunParams = z.object({ runId: z.uuid({ error: 'Not a run id.' }) });

/** Siting runs: planners (who make plans) start, cancel and turn them into draft plans; planners and reviewers read them. */
export function sitingRoutes(deps: SitingDeps) {
  const router = Router();
  const planner = [requireUser, requireRole('planner')];

  router.post('/sites/:siteId/siting-runs', ...planner, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const input = parseOrThrow(SitingRunInputSchema, req.body, 'siting request');
    res.status(202).json({ run: await requestSiting(deps, actorOf(req), siteId, input) });
  });
  router.get('/sites/:siteId/siting-runs', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    res.json({ items: await listSitingRuns(actorOf(req), siteId) });
  });
  router.get('/siting-runs/:runId', requireUser, async (req, res) => {
    const { runId } = parseOrThrow(RunParams, req.params, 'address');
    res.json({ run: await getSitingRun(actorOf(req), runId) });
  });
  router.post('/siting-runs/:runId/cancel', ...planner, async (req, res) => {
    const { runId } = parseOrThrow(RunParams, req.params, 'address');
    res.json({ run: await cancelSitingRun(deps, actorOf(req), runId) });
  });
  router.post('/siting-runs/:runId/plan', ...planner, async (req, res) => {
    const { runId } = parseOrThrow(RunParams, req.params, 'address');
    res.status(201).json({ plan: await planFromSiting(deps, actorOf(req), runId) });
  });
  return router;
}

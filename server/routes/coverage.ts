import { Router } from 'express';
import { z } from 'zod';
import {
  COVERAGE_LAYER_KINDS,
  CoverageCompareQuerySchema,
  CoverageHourlyQuerySchema,
  CoverageLayerQuerySchema,
} from '@/shared/schemas/coverage';
import { coverageHourly } from '@/server/domain/coverage/coverage-hourly';
import {
  cancelCoverageRun,
  compareCoverageRuns,
  coverageLayer,
  getCoverageRun,
  planCoverage,
  requestCoverage,
  type CoverageDeps,
} from '@/server/domain/coverage/manage-coverage';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const PlanParams = z.object({ planId: z.uuid({ error: 'Not a plan id.' }) });
const RunParams = z.object({ runId: z.uuid({ error: 'Not a run id.' }) });
const LayerParams = RunParams.extend({
  layer: z.enum(COVERAGE_LAYER_KINDS, { error: `The layer is one of: ${COVERAGE_LAYER_KINDS.join(', ')}.` }),
});

/** Terrain coverage of plans: planners start and cancel runs; everyone who may read the plan reads its runs. */
export function coverageRoutes(deps: CoverageDeps) {
  const router = Router();
  const planner = [requireUser, requireRole('planner')];

  router.get('/plans/:planId/coverage', requireUser, async (req, res) => {
    const { planId } = parseOrThrow(PlanParams, req.params, 'address');
    res.json(await planCoverage(actorOf(req), planId));
  });
  router.post('/plans/:planId/coverage', ...planner, async (req, res) => {
    const { planId } = parseOrThrow(PlanParams, req.params, 'address');
    const { run, created } = await requestCoverage(deps, actorOf(req), planId);
    res.status(created ? 202 : 200).json({ run });
  });
  router.get('/coverage-runs/:runId', requireUser, async (req, res) => {
    const { runId } = parseOrThrow(RunParams, req.params, 'address');
    res.json({ run: await getCoverageRun(actorOf(req), runId) });
  });
  router.post('/coverage-runs/:runId/cancel', ...planner, async (req, res) => {
    const { runId } = parseOrThrow(RunParams, req.params, 'address');
    res.json({ run: await cancelCoverageRun(deps, actorOf(req), runId) });
  });
  router.get('/coverage-runs/:runId/layers/:layer', requireUser, async (req, res) => {
    const { runId, layer } = parseOrThrow(LayerParams, req.params, 'address');
    const { caseKey, postId } = parseOrThrow(CoverageLayerQuerySchema, req.query, 'query');
    // A finished run never changes: the layer may be cached privately.
    res.setHeader('Cache-Control', 'private, max-age=86400, immutable');
    res.json(await coverageLayer(actorOf(req), runId, layer, caseKey, postId));
  });
  router.get('/coverage-runs/:runId/hourly', requireUser, async (req, res) => {
    const { runId } = parseOrThrow(RunParams, req.params, 'address');
    res.json({ hourly: await coverageHourly(actorOf(req), runId, parseOrThrow(CoverageHourlyQuerySchema, req.query, 'query')) });
  });
  router.get('/coverage-compare', requireUser, async (req, res) => {
    res.json(await compareCoverageRuns(actorOf(req), parseOrThrow(CoverageCompareQuerySchema, req.query, 'query')));
  });
  return router;
}

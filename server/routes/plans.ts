import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import {
  PlanInputSchema,
  PlanListQuerySchema,
  PlanUpdateSchema,
  ReviewInputSchema,
  SubmitInputSchema,
} from '@/shared/schemas/plan';
import {
  createPlan,
  getPlan,
  listPlans,
  previewPlan,
  newPlanVersion,
  planHistory,
  planRevision,
  reviewPlan,
  submitPlan,
  updatePlan,
  type PlanDeps,
} from '@/server/domain/plans/manage-plans';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';
import type { Mailer } from '@/server/domain/ports/mailer';
import { INT_COLUMN_MAX } from '@/shared/schemas/seen-version';

const IdParams = z.object({ planId: z.uuid({ error: 'Not a plan id.' }) });
const RevisionParams = IdParams.extend({
  number: z.coerce.number().int().min(1, 'Revisions start at 1.').max(INT_COLUMN_MAX, 'No such revision.'),
});

/** Coverage plans: planners prepare and submit, reviewers approve or return, observers read approved ones. */
export function planRoutes(db: Sequelize, publicUrl: () => string, mailer: Mailer | null) {
  const router = Router();
  const deps = (): PlanDeps => ({ db, mailer, planUrl: (id) => `${publicUrl()}/plans/${id}` });
  const planner = [requireUser, requireRole('planner')];

  router.get('/plans', requireUser, async (req, res) => {
    res.json(await listPlans(actorOf(req), parseOrThrow(PlanListQuerySchema, req.query, 'query')));
  });
  router.post('/plans', ...planner, async (req, res) => {
    res.status(201).json({ plan: await createPlan(deps(), actorOf(req), parseOrThrow(PlanInputSchema, req.body, 'plan')) });
  });
  router.get('/plans/:planId', requireUser, async (req, res) => {
    const { planId } = parseOrThrow(IdParams, req.params, 'address');
    res.json({ plan: await getPlan(actorOf(req), planId) });
  });
  router.get('/plans/:planId/preview', requireUser, async (req, res) => {
    const { planId } = parseOrThrow(IdParams, req.params, 'address');
    res.json({ snapshot: await previewPlan(actorOf(req), planId) });
  });
  router.patch('/plans/:planId', ...planner, async (req, res) => {
    const { planId } = parseOrThrow(IdParams, req.params, 'address');
    res.json({ plan: await updatePlan(deps(), actorOf(req), planId, parseOrThrow(PlanUpdateSchema, req.body, 'plan')) });
  });
  router.post('/plans/:planId/submit', ...planner, async (req, res) => {
    const { planId } = parseOrThrow(IdParams, req.params, 'address');
    res.json(await submitPlan(deps(), actorOf(req), planId, parseOrThrow(SubmitInputSchema, req.body, 'submission')));
  });
  router.post('/plans/:planId/reviews', requireUser, requireRole('reviewer'), async (req, res) => {
    const { planId } = parseOrThrow(IdParams, req.params, 'address');
    res.status(201).json(await reviewPlan(deps(), actorOf(req), planId, parseOrThrow(ReviewInputSchema, req.body, 'review')));
  });
  router.post('/plans/:planId/versions', ...planner, async (req, res) => {
    const { planId } = parseOrThrow(IdParams, req.params, 'address');
    res.status(201).json({ plan: await newPlanVersion(deps(), actorOf(req), planId) });
  });
  router.get('/plans/:planId/revisions', requireUser, async (req, res) => {
    const { planId } = parseOrThrow(IdParams, req.params, 'address');
    res.json(await planHistory(actorOf(req), planId));
  });
  router.get('/plans/:planId/revisions/:number', requireUser, async (req, res) => {
    const { planId, number } = parseOrThrow(RevisionParams, req.params, 'address');
    res.json({ revision: await planRevision(actorOf(req), planId, number) });
  });
  return router;
}

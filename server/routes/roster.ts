import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import {
  AssignmentInputSchema,
  AssignmentListQuerySchema,
  AssignmentUpdateSchema,
  RosterQuerySchema,
} from '@/shared/schemas/assignment';
import {
  briefingFor,
  createAssignment,
  deleteAssignment,
  listAssignments,
  listPeople,
  siteRoster,
  updateAssignment,
} from '@/server/domain/roster/manage-assignments';
import { qualificationWarnings } from '@/server/domain/courses/manage-courses';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const IdParams = z.object({ assignmentId: z.uuid({ error: 'Not a watch id.' }) });
const SiteParams = z.object({ siteId: z.uuid({ error: 'Not a site id.' }) });

/** Watches (people on posts), the site roster with its gaps, the people picker and a lookout's briefing. */
export function rosterRoutes(db: Sequelize) {
  const router = Router();
  const planner = [requireUser, requireRole('planner')];

  router.get('/assignments', requireUser, async (req, res) => {
    res.json(await listAssignments(actorOf(req), parseOrThrow(AssignmentListQuerySchema, req.query, 'query')));
  });
  router.post('/assignments', ...planner, async (req, res) => {
    const input = parseOrThrow(AssignmentInputSchema, req.body, 'watch');
    const assignment = await createAssignment({ db }, actorOf(req), input);
    res.status(201).json({ assignment, warnings: await qualificationWarnings(actorOf(req), input.userId) });
  });
  router.patch('/assignments/:assignmentId', ...planner, async (req, res) => {
    const { assignmentId } = parseOrThrow(IdParams, req.params, 'address');
    const input = parseOrThrow(AssignmentUpdateSchema, req.body, 'watch');
    res.json({ assignment: await updateAssignment({ db }, actorOf(req), assignmentId, input) });
  });
  router.delete('/assignments/:assignmentId', ...planner, async (req, res) => {
    const { assignmentId } = parseOrThrow(IdParams, req.params, 'address');
    await deleteAssignment({ db }, actorOf(req), assignmentId);
    res.status(204).end();
  });
  router.get('/sites/:siteId/roster', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    res.json(await siteRoster(actorOf(req), siteId, parseOrThrow(RosterQuerySchema, req.query, 'query')));
  });
  router.get('/people', requireUser, requireRole('planner', 'reviewer', 'admin'), async (req, res) => {
    res.json({ items: await listPeople(actorOf(req)) });
  });
  router.get('/briefing', requireUser, async (req, res) => {
    res.json(await briefingFor(actorOf(req)));
  });
  return router;
}

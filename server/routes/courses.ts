import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { CourseAssignSchema, CourseInputSchema, QualificationQuerySchema } from '@/shared/schemas/course';
import {
  assignCourse,
  courseResults,
  createCourse,
  getAttempt,
  getCourse,
  listCourses,
  listQualifications,
  startAttempt,
} from '@/server/domain/courses/manage-courses';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const IdParams = z.object({ id: z.uuid({ error: 'Not an id.' }) });
const AttemptParams = IdParams.extend({ attemptId: z.uuid({ error: 'Not an id.' }) });

/**
 * Trainer courses: planners compose and assign them; assigned people take attempts (drills answered through
 * `/drills/:id/answer`); results and qualification per person (observers: their own).
 */
export function courseRoutes(db: Sequelize, terrainCache: TerrainCache) {
  const router = Router();
  const write = [requireUser, requireRole('planner')];
  router.get('/courses', requireUser, async (req, res) => {
    res.json({ items: await listCourses(actorOf(req)) });
  });
  router.post('/courses', ...write, async (req, res) => {
    const input = parseOrThrow(CourseInputSchema, req.body, 'course');
    res.status(201).json({ course: await createCourse({ db }, actorOf(req), input) });
  });
  router.get('/courses/:id', requireUser, async (req, res) => {
    const { id } = parseOrThrow(IdParams, req.params, 'address');
    res.json({ course: await getCourse(actorOf(req), id) });
  });
  router.post('/courses/:id/assignees', ...write, async (req, res) => {
    const { id } = parseOrThrow(IdParams, req.params, 'address');
    const { userIds } = parseOrThrow(CourseAssignSchema, req.body, 'assignment');
    res.json({ course: await assignCourse({ db }, actorOf(req), id, userIds) });
  });
  router.post('/courses/:id/attempts', requireUser, async (req, res) => {
    const { id } = parseOrThrow(IdParams, req.params, 'address');
    res.status(201).json({ attempt: await startAttempt({ db, terrainCache }, actorOf(req), id) });
  });
  router.get('/courses/:id/attempts/:attemptId', requireUser, async (req, res) => {
    const { id, attemptId } = parseOrThrow(AttemptParams, req.params, 'address');
    res.json({ attempt: await getAttempt(actorOf(req), id, attemptId) });
  });
  router.get('/courses/:id/results', requireUser, async (req, res) => {
    const { id } = parseOrThrow(IdParams, req.params, 'address');
    res.json(await courseResults(actorOf(req), id));
  });
  router.get('/qualifications', requireUser, async (req, res) => {
    const query = parseOrThrow(QualificationQuerySchema, req.query, 'query');
    res.json({ items: await listQualifications(actorOf(req), query) });
  });
  return router;
}

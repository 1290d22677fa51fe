import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import {
  ConditionSetInputSchema,
  ConditionSetUpdateSchema,
  LibraryListQuerySchema,
  TargetInputSchema,
  TargetUpdateSchema,
} from '@/shared/schemas/library';
import { conditionSetUseCases, libraryUseCases, targetUseCases } from '@/server/domain/library/manage-library';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const IdParams = z.object({ id: z.uuid({ error: 'Not an id.' }) });

/** The organisation's target profiles and condition sets: every role reads, planners write. */
export function libraryRoutes(db: Sequelize) {
  const router = Router();
  const write = [requireUser, requireRole('planner')];
  const mount = <Dto extends { id: string }, Input extends object>(
    path: string,
    uc: ReturnType<typeof libraryUseCases<Dto, Input>>,
    create: z.ZodType<Input>,
    update: z.ZodType<Partial<Input> & { version: number }>,
    noun: string,
    key: string,
  ) => {
    router.get(`/${path}`, requireUser, async (req, res) => {
      res.json(await uc.list(actorOf(req), parseOrThrow(LibraryListQuerySchema, req.query, 'query')));
    });
    router.post(`/${path}`, ...write, async (req, res) => {
      res.status(201).json({ [key]: await uc.create(actorOf(req), parseOrThrow(create, req.body, noun)) });
    });
    router.patch(`/${path}/:id`, ...write, async (req, res) => {
      const { id } = parseOrThrow(IdParams, req.params, 'address');
      res.json({ [key]: await uc.update(actorOf(req), id, parseOrThrow(update, req.body, noun)) });
    });
    router.delete(`/${path}/:id`, ...write, async (req, res) => {
      const { id } = parseOrThrow(IdParams, req.params, 'address');
      await uc.remove(actorOf(req), id);
      res.status(204).end();
    });
  };
  mount('targets', targetUseCases({ db }), TargetInputSchema, TargetUpdateSchema, 'target', 'target');
  mount(
    'conditions',
    conditionSetUseCases({ db }),
    ConditionSetInputSchema,
    ConditionSetUpdateSchema,
    'condition set',
    'conditionSet',
  );
  return router;
}

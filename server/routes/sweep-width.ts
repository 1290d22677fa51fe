import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import {
  SweepWidthRequestSchema,
  SweepWidthTableInputSchema,
  SweepWidthTableListQuerySchema,
  SweepWidthTableRetireSchema,
  SweepWidthTableUpdateSchema,
} from '@/shared/schemas/sweep-width';
import { evaluateSweep } from '@/shared/sightline/evaluate-sweep';
import { SweepInputError } from '@/shared/sightline/sweep-input-error';
import {
  createSweepWidthTable,
  listSweepWidthTables,
  retireSweepWidthTable,
  updateSweepWidthTable,
} from '@/server/domain/sweep-width/manage-sweep-width-tables';
import { AppError } from '@/server/domain/app-error';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const IdParams = z.object({ id: z.uuid({ error: 'Not an id.' }) });

/**
 * Sweep width → coverage factor → POD (pure, any signed-in role), and the
 * organisation's sweep-width tables (every role reads, planners write).
 * A request of the wrong shape is a 400 `invalid_input`; one the core cannot
 * work with (ranges that do not increase, a spacing needing too many tracks)
 * a 422 `sweep_input`, both with the field at fault.
 */
export function sweepWidthRoutes(db: Sequelize) {
  const router = Router();
  const write = [requireUser, requireRole('planner')];

  router.post('/sweep-width', requireUser, (req, res) => {
    const input = parseOrThrow(SweepWidthRequestSchema, req.body, 'sweep-width request');
    try {
      res.json(evaluateSweep(input));
    } catch (err) {
      if (err instanceof SweepInputError) {
        throw new AppError(422, 'sweep_input', 'The sweep-width request cannot be computed.', { [err.field]: err.message });
      }
      throw err;
    }
  });

  router.get('/sweep-width-tables', requireUser, async (req, res) => {
    res.json(await listSweepWidthTables(actorOf(req), parseOrThrow(SweepWidthTableListQuerySchema, req.query, 'query')));
  });
  router.post('/sweep-width-tables', ...write, async (req, res) => {
    const input = parseOrThrow(SweepWidthTableInputSchema, req.body, 'sweep-width table');
    res.status(201).json({ table: await createSweepWidthTable({ db }, actorOf(req), input) });
  });
  router.patch('/sweep-width-tables/:id', ...write, async (req, res) => {
    const { id } = parseOrThrow(IdParams, req.params, 'address');
    const input = parseOrThrow(SweepWidthTableUpdateSchema, req.body, 'sweep-width table');
    res.json({ table: await updateSweepWidthTable({ db }, actorOf(req), id, input) });
  });
  router.post('/sweep-width-tables/:id/retire', ...write, async (req, res) => {
    const { id } = parseOrThrow(IdParams, req.params, 'address');
    const { version } = parseOrThrow(SweepWidthTableRetireSchema, req.body, 'retire request');
    res.json({ table: await retireSweepWidthTable({ db }, actorOf(req), id, version) });
  });
  return router;
}

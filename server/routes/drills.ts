import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { DrillAnswerSchema, DrillRequestSchema } from '@/shared/schemas/drill';
import { answerDrill, createDrill, getDrill } from '@/server/domain/drills/manage-drills';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import { actorOf, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const IdParams = z.object({ id: z.uuid({ error: 'Not an id.' }) });

/** Trainer drills: every signed-in person sets and answers their own. */
export function drillRoutes(db: Sequelize, terrainCache: TerrainCache) {
  const router = Router();
  router.post('/drills', requireUser, async (req, res) => {
    const request = parseOrThrow(DrillRequestSchema, req.body, 'drill request');
    res.status(201).json({ drill: await createDrill({ db, terrainCache }, actorOf(req), request) });
  });
  router.get('/drills/:id', requireUser, async (req, res) => {
    const { id } = parseOrThrow(IdParams, req.params, 'address');
    res.json({ drill: await getDrill(actorOf(req), id) });
  });
  router.post('/drills/:id/answer', requireUser, async (req, res) => {
    const { id } = parseOrThrow(IdParams, req.params, 'address');
    const answer = parseOrThrow(DrillAnswerSchema, req.body, 'answer');
    res.json(await answerDrill({ db }, actorOf(req), id, answer));
  });
  return router;
}

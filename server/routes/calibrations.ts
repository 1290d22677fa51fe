import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import {
  CalibrationInputSchema,
  CalibrationListQuerySchema,
  SaveCalibrationAsConditionSetSchema,
} from '@/shared/schemas/calibration';
import {
  listCalibrations,
  recordCalibration,
  saveCalibrationAsConditionSet,
} from '@/server/domain/calibrations/manage-calibrations';
import { actorOf, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const IdParams = z.object({ id: z.uuid({ error: 'Not an id.' }) });

/**
 * Field calibrations, "k of the day": every signed-in role logs its own
 * sightings and reads the organisation's; planners save one as a condition set.
 */
export function calibrationRoutes(db: Sequelize) {
  const router = Router();
  router.get('/calibrations', requireUser, async (req, res) => {
    res.json(await listCalibrations(actorOf(req), parseOrThrow(CalibrationListQuerySchema, req.query, 'query')));
  });
  router.post('/calibrations', requireUser, async (req, res) => {
    const input = parseOrThrow(CalibrationInputSchema, req.body, 'calibration');
    res.status(201).json(await recordCalibration({ db }, actorOf(req), input));
  });
  router.post('/calibrations/:id/condition-set', requireUser, async (req, res) => {
    const { id } = parseOrThrow(IdParams, req.params, 'address');
    const { name } = parseOrThrow(SaveCalibrationAsConditionSetSchema, req.body ?? {}, 'condition set');
    res.status(201).json(await saveCalibrationAsConditionSet({ db }, actorOf(req), id, name));
  });
  return router;
}

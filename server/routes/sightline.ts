import { Router } from 'express';
import { SightlineRequestSchema, type RefractionPresetList } from '@/shared/schemas/sightline';
import { evaluateSightline } from '@/shared/sightline/evaluate-sightline';
import { REFRACTION_PRESETS } from '@/shared/sightline/refraction-presets';
import { requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const presetList: RefractionPresetList = {
  presets: REFRACTION_PRESETS.map(({ id, label, k, definition, source }) => ({ id, label, k, definition, source })),
};

/** Pure computation: no database work beyond checking the session. */
export function sightlineRoutes() {
  const router = Router();
  router.post('/sightline', requireUser, (req, res) => {
    const input = parseOrThrow(SightlineRequestSchema, req.body, 'sightline request');
    res.json(evaluateSightline(input));
  });
  router.get('/refraction-presets', requireUser, (_req, res) => {
    res.json(presetList);
  });
  return router;
}

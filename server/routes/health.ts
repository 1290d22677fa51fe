import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { databaseIsUp } from '@/server/data/database';

export function healthRoutes(db: Sequelize) {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const up = await databaseIsUp(db);
    if (!up) res.setHeader('Retry-After', '2');
    res.status(up ? 200 : 503).json({ status: up ? 'ok' : 'degraded', db: up ? 'ok' : 'down' });
  });
  return router;
}

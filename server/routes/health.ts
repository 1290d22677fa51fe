import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { checkHealth } from '@/server/domain/health/check-health';

export function healthRoutes(db: Sequelize) {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const health = await checkHealth({ db });
    if (health.db === 'down') res.setHeader('Retry-After', '2');
    res.status(health.db === 'ok' ? 200 : 503).json(health);
  });
  return router;
}

import type { Sequelize } from 'sequelize';
import { databaseIsUp } from '@/server/data/database';

/** What `GET /health` reports: the server answers, and whether its database does. */
export async function checkHealth(db: Sequelize): Promise<{ status: 'ok' | 'degraded'; db: 'ok' | 'down' }> {
  const up = await databaseIsUp(db);
  return { status: up ? 'ok' : 'degraded', db: up ? 'ok' : 'down' };
}

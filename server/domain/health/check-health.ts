import { databaseIsUp } from '@/server/data/database';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';

/** What `GET /health` reports: the server answers, and whether its database does. */
export async function checkHealth({ db }: UseCaseDeps): Promise<{ status: 'ok' | 'degraded'; db: 'ok' | 'down' }> {
  const up = await databaseIsUp(db);
  return { status: up ? 'ok' : 'degraded', db: up ? 'ok' : 'down' };
}

import { Sequelize } from 'sequelize';
import { initModels } from './models';

/** How long a request waits for a free database connection before it is answered 503. */
export const POOL_ACQUIRE_MS = 5_000;

/** Opens a Sequelize connection and registers every model on it. */
export function createDatabase(url: string, options: { logging?: boolean } = {}): Sequelize {
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    logging: options.logging ? console.log : false,
    // A request that cannot get a connection within `acquire` ms is answered 503 `busy` (error
    // middleware) instead of queueing for a minute behind a stuck burst.
    pool: { max: 10, min: 0, idle: 10_000, acquire: POOL_ACQUIRE_MS },
    define: { underscored: true },
  });
  initModels(sequelize);
  return sequelize;
}

/** True when a trivial query succeeds within `timeoutMs`. */
export async function databaseIsUp(sequelize: Sequelize, timeoutMs = 2000): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<false>((resolve) => {
    timer = setTimeout(() => resolve(false), timeoutMs);
  });
  try {
    return await Promise.race([sequelize.query('SELECT 1').then(() => true as const), timeout]);
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}

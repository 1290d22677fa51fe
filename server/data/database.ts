import { Sequelize } from 'sequelize';
import { initModels } from './models';

/** Opens a Sequelize connection and registers every model on it. */
export function createDatabase(url: string, options: { logging?: boolean } = {}): Sequelize {
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    logging: options.logging ? console.log : false,
    pool: { max: 10, min: 0, idle: 10_000 },
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

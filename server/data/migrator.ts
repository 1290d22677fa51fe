import path from 'node:path';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug';

export type Migration = MigrationFn<QueryInterface>;

/** Schema changes are made only by these migrations (never `sync()`). */
export function createMigrator(sequelize: Sequelize, options: { log?: boolean } = {}) {
  return new Umzug({
    migrations: {
      glob: ['migrations/[0-9]*.ts', { cwd: path.join(__dirname) }],
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: options.log ? console : undefined,
  });
}

/** Applies every pending migration in one transaction-per-migration run. */
export async function migrate(sequelize: Sequelize, options: { log?: boolean } = {}): Promise<string[]> {
  const applied = await createMigrator(sequelize, options).up();
  return applied.map((m) => m.name);
}

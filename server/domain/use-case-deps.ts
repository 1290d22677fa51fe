import type { Sequelize } from 'sequelize';

/**
 * What every use case is given, as its first argument: `useCase(deps, actor, …input)`.
 * Repositories are modules the use case imports; the database handle (for
 * transactions) and the ports a feature needs (file store, queue, mailer…) come in
 * `deps`. A feature's own deps type extends this one (`PlanDeps`, `TerrainDeps`…).
 */
export interface UseCaseDeps {
  db: Sequelize;
}

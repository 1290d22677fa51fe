import { Op, type Transaction } from 'sequelize';
import type { SitingRunStatus } from '@/shared/schemas/siting';
import { SitingRunModel, UserModel } from '../models';

/** A siting run as the domain sees it (plain object; `inputs` and `result` as stored). */
export interface SitingRunRecord {
  id: string;
  organizationId: string;
  siteId: string;
  terrainId: string;
  inputsHash: string;
  inputs: unknown;
  status: SitingRunStatus;
  progress: number;
  stage: string;
  error: string | null;
  jobId: string | null;
  requestedBy: { id: string | null; name: string };
  result: unknown;
  planId: string | null;
  elapsedS: number | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

async function toRecord(row: SitingRunModel | null, transaction?: Transaction): Promise<SitingRunRecord | null> {
  if (!row) return null;
  const user = row.requestedById
    ? await UserModel.findByPk(row.requestedById, { attributes: ['id', 'name'], raw: true, transaction })
    : null;
  return {
    id: row.id,
    organizationId: row.organizationId,
    siteId: row.siteId,
    terrainId: row.terrainId,
    inputsHash: row.inputsHash,
    inputs: row.inputs,
    status: row.status,
    progress: row.progress,
    stage: row.stage,
    error: row.error,
    jobId: row.jobId,
    requestedBy: { id: row.requestedById, name: row.requestedById ? (user?.name ?? '(removed user)') : '(seed)' },
    result: row.result,
    planId: row.planId,
    elapsedS: row.elapsedS,
    createdAt: row.createdAt.toISOString(),
    startedAt: iso(row.startedAt),
    finishedAt: iso(row.finishedAt),
  };
}

type ActiveChanges = Partial<
  Pick<SitingRunModel, 'status' | 'progress' | 'stage' | 'error' | 'jobId' | 'startedAt' | 'finishedAt' | 'heartbeatAt'>
>;

export const sitingRepository = {
  async create(
    run: Pick<SitingRunRecord, 'organizationId' | 'siteId' | 'terrainId' | 'inputsHash'> & {
      inputs: object;
      requestedById: string | null;
    },
    transaction?: Transaction,
  ): Promise<SitingRunRecord> {
    return (await toRecord(await SitingRunModel.create(run, { transaction }), transaction))!;
  },

  async find(organizationId: string, id: string, transaction?: Transaction): Promise<SitingRunRecord | null> {
    return toRecord(await SitingRunModel.findOne({ where: { organizationId, id }, transaction }), transaction);
  },

  /** By id alone: for the worker, which acts for nobody. */
  async findById(id: string, transaction?: Transaction, lock = false): Promise<SitingRunRecord | null> {
    return toRecord(
      await SitingRunModel.findByPk(id, { transaction, ...(lock && transaction && { lock: transaction.LOCK.UPDATE }) }),
      transaction,
    );
  },

  /** The site's runs, newest first. */
  async listInSite(organizationId: string, siteId: string, limit = 20): Promise<SitingRunRecord[]> {
    const rows = await SitingRunModel.findAll({ where: { organizationId, siteId }, order: [['createdAt', 'DESC']], limit });
    return Promise.all(rows.map(async (r) => (await toRecord(r))!));
  },

  /** Changes a run that has not ended; false when it had (nothing changed). */
  async updateActive(id: string, changes: ActiveChanges, transaction?: Transaction): Promise<boolean> {
    const [count] = await SitingRunModel.update(
      { ...changes, heartbeatAt: new Date() },
      { where: { id, status: { [Op.in]: ['queued', 'running'] } }, transaction },
    );
    return count > 0;
  },

  /** Writes the result and ends the run, in the caller's transaction. */
  async finish(id: string, result: object, elapsedS: number, transaction: Transaction): Promise<void> {
    await SitingRunModel.update(
      { result, elapsedS, status: 'done', progress: 1, stage: 'Done', finishedAt: new Date() },
      { where: { id, status: 'running' }, transaction },
    );
  },

  /** Records the draft plan made from a finished run (once). */
  async setPlan(id: string, planId: string, transaction: Transaction): Promise<boolean> {
    const [count] = await SitingRunModel.update({ planId }, { where: { id, status: 'done', planId: null }, transaction });
    return count > 0;
  },
};

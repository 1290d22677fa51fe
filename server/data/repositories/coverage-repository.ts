import { Op, type Transaction } from 'sequelize';
import type { CoverageCase, CoverageRunStatus } from '@/shared/schemas/coverage';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { CoverageLayerModel, CoverageRunModel, UserModel } from '../models';
import type { CoverageRunGrid } from '../models/coverage-run';

/** A coverage run as the domain sees it (plain object; `inputs` as stored). */
export interface CoverageRunRecord {
  id: string;
  organizationId: string;
  planId: string;
  siteId: string;
  terrainId: string | null;
  datum: 'terrain' | 'flat';
  inputsHash: string;
  inputs: unknown;
  status: CoverageRunStatus;
  progress: number;
  stage: string;
  error: string | null;
  jobId: string | null;
  /** How often the run was handed to a worker. */
  attempts: number;
  requestedBy: { id: string | null; name: string };
  grid: CoverageRunGrid | null;
  cases: CoverageCase[];
  elapsedS: number | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

async function toRecords(rows: CoverageRunModel[], transaction?: Transaction): Promise<CoverageRunRecord[]> {
  const ids = [...new Set(rows.map((r) => r.requestedById).filter((x): x is string => x !== null))];
  const users = ids.length
    ? await UserModel.findAll({ where: { id: ids }, attributes: ['id', 'name'], raw: true, transaction })
    : [];
  const names = new Map(users.map((u) => [u.id, u.name]));
  return rows.map((r) => ({
    id: r.id,
    organizationId: r.organizationId,
    planId: r.planId,
    siteId: r.siteId,
    terrainId: r.terrainId,
    datum: r.datum,
    inputsHash: r.inputsHash,
    inputs: r.inputs,
    status: r.status,
    progress: r.progress,
    stage: r.stage,
    error: r.error,
    jobId: r.jobId,
    attempts: r.attempts,
    requestedBy: { id: r.requestedById, name: r.requestedById ? (names.get(r.requestedById) ?? '(removed user)') : '(seed)' },
    grid: r.grid,
    cases: r.cases,
    elapsedS: r.elapsedS,
    createdAt: r.createdAt.toISOString(),
    startedAt: iso(r.startedAt),
    finishedAt: iso(r.finishedAt),
  }));
}
const one = async (row: CoverageRunModel | null, t?: Transaction) => (row ? (await toRecords([row], t))[0]! : null);

export const coverageRepository = {
  async create(
    run: Pick<CoverageRunRecord, 'organizationId' | 'planId' | 'siteId' | 'terrainId' | 'datum' | 'inputsHash'> & {
      inputs: object;
      requestedById: string | null;
    },
    transaction?: Transaction,
  ): Promise<CoverageRunRecord> {
    const row = await CoverageRunModel.create(run, { transaction });
    return (await one(row, transaction))!;
  },

  async find(organizationId: string, id: string, transaction?: Transaction): Promise<CoverageRunRecord | null> {
    return one(await CoverageRunModel.findOne({ where: { organizationId, id }, transaction }), transaction);
  },

  /** By id alone: for the worker, which acts for nobody. */
  async findById(id: string, transaction?: Transaction, lock = false): Promise<CoverageRunRecord | null> {
    return one(
      await CoverageRunModel.findByPk(id, { transaction, ...(lock && transaction && { lock: transaction.LOCK.UPDATE }) }),
      transaction,
    );
  },

  /** The newest run of the plan for these inputs that is queued, running or done. */
  async findCurrent(planId: string, inputsHash: string, transaction?: Transaction): Promise<CoverageRunRecord | null> {
    const row = await CoverageRunModel.findOne({
      where: { planId, inputsHash, status: { [Op.in]: ['queued', 'running', 'done'] } },
      order: [['createdAt', 'DESC']],
      transaction,
    });
    return one(row, transaction);
  },

  async latest(planId: string, transaction?: Transaction): Promise<CoverageRunRecord | null> {
    return one(await CoverageRunModel.findOne({ where: { planId }, order: [['createdAt', 'DESC']], transaction }), transaction);
  },

  /**
   * Changes a run that has not ended (and, given `attempt`, is still that attempt: a worker
   * whose run was handed to another after it went quiet changes nothing); returns false
   * when it had (nothing changed).
   */
  async updateActive(
    id: string,
    changes: Partial<Pick<CoverageRunModel, 'status' | 'progress' | 'stage' | 'error' | 'jobId' | 'startedAt' | 'finishedAt'>>,
    transaction?: Transaction,
    attempt?: number,
  ): Promise<boolean> {
    const [count] = await CoverageRunModel.update(changes, {
      where: { id, status: { [Op.in]: ['queued', 'running'] }, ...(attempt !== undefined && { attempts: attempt }) },
      transaction,
    });
    return count > 0;
  },

  async finish(
    id: string,
    result: { grid: CoverageRunGrid; cases: CoverageCase[]; elapsedS: number },
    transaction: Transaction,
  ): Promise<void> {
    await CoverageRunModel.update(
      { ...result, status: 'done', progress: 1, stage: 'Done', finishedAt: new Date() },
      { where: { id }, transaction },
    );
  },

  async addLayers(
    runId: string,
    layers: { caseKey: string; layer: string; postId: string; encoded: EncodedClassRaster; sha256: string }[],
    transaction: Transaction,
  ): Promise<void> {
    // In slices: one statement with every layer of a big run would be tens of megabytes.
    for (let i = 0; i < layers.length; i += 8) {
      await CoverageLayerModel.bulkCreate(
        layers.slice(i, i + 8).map((l) => ({ runId, ...l })),
        { transaction },
      );
    }
  },

  async layer(
    runId: string,
    caseKey: string,
    layer: string,
    postId: string,
    transaction?: Transaction,
  ): Promise<EncodedClassRaster | null> {
    const row = await CoverageLayerModel.findOne({
      where: { runId, caseKey, layer, postId },
      attributes: ['encoded'],
      transaction,
    });
    return row?.encoded ?? null;
  },

  /** The site's newest finished run (any plan's) on the given terrain, or null. */
  async latestDoneOnTerrain(
    organizationId: string,
    siteId: string,
    terrainId: string,
    transaction?: Transaction,
  ): Promise<CoverageRunRecord | null> {
    const row = await CoverageRunModel.findOne({
      where: { organizationId, siteId, terrainId, status: 'done', datum: 'terrain' },
      order: [['finishedAt', 'DESC']],
      transaction,
    });
    return one(row, transaction);
  },

  /** `${layer}:${caseKey}[:${postId}]` → sha256 of every layer of a run. */
  async layerHashes(runId: string, transaction?: Transaction): Promise<Record<string, string>> {
    const rows = await CoverageLayerModel.findAll({
      where: { runId },
      attributes: ['caseKey', 'layer', 'postId', 'sha256'],
      order: [
        ['layer', 'ASC'],
        ['caseKey', 'ASC'],
        ['postId', 'ASC'],
      ],
      raw: true,
      transaction,
    });
    return Object.fromEntries(rows.map((r) => [[r.layer, r.caseKey, r.postId].filter(Boolean).join(':'), r.sha256]));
  },

  async countLayers(runId: string): Promise<number> {
    return CoverageLayerModel.count({ where: { runId } });
  },
};

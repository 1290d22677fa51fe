import { Op, type Transaction } from 'sequelize';
import type { VisibilityIndexGrid, VisibilityIndexStatus } from '@/shared/schemas/visibility-index';
import { VisibilityIndexLayerModel } from '../models/visibility-index-layer';

/** A visibility index row as plain data (seen areas as Float32, or null until done). */
export interface VisibilityIndexRecord {
  id: string;
  organizationId: string;
  siteId: string;
  terrainId: string;
  heightM: number;
  radiusM: number;
  rays: number;
  strideCells: number | null;
  status: VisibilityIndexStatus;
  progress: number;
  error: string | null;
  jobId: string | null;
  grid: VisibilityIndexGrid | null;
  seenM2: Float32Array | null;
  siteAreaM2: number | null;
  elapsedS: number | null;
  requestedById: string | null;
  createdAt: Date;
  finishedAt: Date | null;
}

function toRecord(row: VisibilityIndexLayerModel): VisibilityIndexRecord {
  const p = row.get({ plain: true });
  let seenM2: Float32Array | null = null;
  if (p.seenM2) {
    // Copy out of the driver's buffer (its offset need not be a multiple of 4); stored little-endian.
    const bytes = new Uint8Array(p.seenM2.byteLength);
    bytes.set(p.seenM2);
    seenM2 = new Float32Array(bytes.buffer);
  }
  return {
    id: p.id,
    organizationId: p.organizationId,
    siteId: p.siteId,
    terrainId: p.terrainId,
    heightM: p.heightM,
    radiusM: p.radiusM,
    rays: p.rays,
    strideCells: p.strideCells ?? null,
    status: p.status,
    progress: p.progress,
    error: p.error ?? null,
    jobId: p.jobId ?? null,
    grid: p.grid ?? null,
    seenM2,
    siteAreaM2: p.siteAreaM2 ?? null,
    elapsedS: p.elapsedS ?? null,
    requestedById: p.requestedById,
    createdAt: p.createdAt,
    finishedAt: p.finishedAt ?? null,
  };
}

const one = (row: VisibilityIndexLayerModel | null) => (row ? toRecord(row) : null);

/** Visibility index layers, scoped by organisation where a person asks. */
export const visibilityIndexRepository = {
  /** The live (not failed) layer of a terrain for these parameters, or null. */
  async findLive(
    organizationId: string,
    terrainId: string,
    heightM: number,
    radiusM: number,
    transaction?: Transaction,
  ): Promise<VisibilityIndexRecord | null> {
    return one(
      await VisibilityIndexLayerModel.findOne({
        where: { organizationId, terrainId, heightM, radiusM, status: { [Op.ne]: 'failed' } },
        transaction,
      }),
    );
  },

  async findById(id: string, transaction?: Transaction): Promise<VisibilityIndexRecord | null> {
    return one(await VisibilityIndexLayerModel.findByPk(id, { transaction }));
  },

  async create(
    layer: Pick<
      VisibilityIndexRecord,
      'organizationId' | 'siteId' | 'terrainId' | 'heightM' | 'radiusM' | 'rays' | 'requestedById'
    >,
    transaction?: Transaction,
  ): Promise<VisibilityIndexRecord> {
    return toRecord(await VisibilityIndexLayerModel.create(layer, { transaction }));
  },

  async setJob(id: string, jobId: string, transaction?: Transaction): Promise<void> {
    await VisibilityIndexLayerModel.update({ jobId }, { where: { id }, transaction });
  },

  /** Marks a queued layer running; false when it was not queued (taken, done or failed). */
  async start(id: string, strideCells: number, grid: VisibilityIndexGrid, siteAreaM2: number): Promise<boolean> {
    const [count] = await VisibilityIndexLayerModel.update(
      { status: 'running', strideCells, grid, siteAreaM2, progress: 0 },
      { where: { id, status: { [Op.in]: ['queued', 'running'] } } },
    );
    return count === 1;
  },

  async progress(id: string, progress: number): Promise<void> {
    await VisibilityIndexLayerModel.update({ progress }, { where: { id, status: 'running' } });
  },

  async finish(id: string, seenM2: Float32Array, elapsedS: number): Promise<void> {
    const bytes = Buffer.from(seenM2.buffer, seenM2.byteOffset, seenM2.byteLength);
    await VisibilityIndexLayerModel.update(
      { status: 'done', progress: 1, seenM2: bytes, elapsedS, finishedAt: new Date() },
      { where: { id, status: 'running' } },
    );
  },

  async fail(id: string, error: string): Promise<void> {
    await VisibilityIndexLayerModel.update(
      { status: 'failed', error, finishedAt: new Date() },
      { where: { id, status: { [Op.in]: ['queued', 'running'] } } },
    );
  },
};

import type { Transaction } from 'sequelize';
import type { Landmark, LandmarkInput } from '@/shared/schemas/landmark';
import { LandmarkModel } from '../models';

function toLandmark(row: LandmarkModel): Landmark {
  return {
    id: row.id,
    siteId: row.siteId,
    name: row.name,
    latDeg: row.latDeg,
    lonDeg: row.lonDeg,
    heightM: row.heightM,
    note: row.note,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** A site's landmarks (named reference marks); every read is scoped by the organisation. */
export const landmarksRepository = {
  async listInSite(organizationId: string, siteId: string, transaction?: Transaction): Promise<Landmark[]> {
    const rows = await LandmarkModel.findAll({ where: { organizationId, siteId }, order: [['name', 'ASC']], transaction });
    return rows.map(toLandmark);
  },
  async findInSite(organizationId: string, siteId: string, id: string, transaction?: Transaction): Promise<Landmark | null> {
    const row = await LandmarkModel.findOne({ where: { organizationId, siteId, id }, transaction });
    return row ? toLandmark(row) : null;
  },
  async create(organizationId: string, siteId: string, input: LandmarkInput, transaction: Transaction): Promise<Landmark> {
    const row = await LandmarkModel.create({ organizationId, siteId, ...input, heightM: input.heightM ?? null }, { transaction });
    return toLandmark(row);
  },
  /** Writes the changes when the row is still at `version`; null when it is not (or is gone). */
  async update(
    organizationId: string,
    siteId: string,
    id: string,
    version: number,
    changes: Partial<LandmarkInput>,
    transaction: Transaction,
  ): Promise<Landmark | null> {
    const row = await LandmarkModel.findOne({
      where: { organizationId, siteId, id },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!row || row.version !== version) return null;
    await row.update({ ...changes, version: row.version + 1 }, { transaction });
    return toLandmark(row);
  },
  async remove(organizationId: string, siteId: string, id: string, transaction: Transaction): Promise<boolean> {
    return (await LandmarkModel.destroy({ where: { organizationId, siteId, id }, transaction })) > 0;
  },
};

import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { sortOrder } from '@/shared/schemas/list';
import type { SweepWidthTable, SweepWidthTableInput, SweepWidthTableListQuery } from '@/shared/schemas/sweep-width';
import { SweepWidthTableModel } from '../models';
import { containsText } from './like-pattern';

const toTable = (r: SweepWidthTableModel): SweepWidthTable => ({
  id: r.id,
  name: r.name,
  edition: r.edition,
  sourceName: r.sourceName,
  isExample: r.isExample,
  notes: r.notes,
  rows: r.rows,
  retiredAt: r.retiredAt ? r.retiredAt.toISOString() : null,
  version: r.version,
  updatedAt: r.updatedAt.toISOString(),
});

/** Sweep-width tables of one organisation, as plain objects. */
export const sweepWidthTablesRepository = {
  async page(organizationId: string, query: SweepWidthTableListQuery) {
    const [field, direction] = sortOrder(query.sort);
    const where: WhereOptions<SweepWidthTableModel> = {
      organizationId,
      ...(query.q && { name: containsText(query.q) }),
      ...(!query.includeRetired && { retiredAt: { [Op.is]: null } }),
    };
    const { rows, count } = await SweepWidthTableModel.findAndCountAll({
      where,
      order: [
        [field, direction],
        ['id', 'ASC'],
      ],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    });
    return { items: rows.map(toTable), total: count, page: query.page, pageSize: query.pageSize };
  },
  async find(organizationId: string, id: string, transaction?: Transaction): Promise<SweepWidthTable | null> {
    const row = await SweepWidthTableModel.findOne({ where: { id, organizationId }, transaction });
    return row ? toTable(row) : null;
  },
  async count(organizationId: string, transaction?: Transaction): Promise<number> {
    return SweepWidthTableModel.count({ where: { organizationId }, transaction });
  },
  async create(organizationId: string, input: SweepWidthTableInput, transaction: Transaction): Promise<SweepWidthTable> {
    return toTable(await SweepWidthTableModel.create({ ...input, organizationId }, { transaction }));
  },
  /** Writes `changes` only if the row still has `version` (and is not retired); null on a miss. */
  async updateIfVersion(
    organizationId: string,
    id: string,
    version: number,
    changes: Partial<SweepWidthTableInput> & { retiredAt?: Date },
    transaction: Transaction,
  ): Promise<SweepWidthTable | null> {
    const [count] = await SweepWidthTableModel.update(
      { ...changes, version: version + 1 },
      { where: { id, organizationId, version, retiredAt: { [Op.is]: null } }, transaction },
    );
    return count === 1 ? this.find(organizationId, id, transaction) : null;
  },
};

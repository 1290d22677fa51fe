import type { Transaction } from 'sequelize';
import { sortOrder } from '@/shared/schemas/list';
import type { LibraryListQuery } from '@/shared/schemas/library';
import { containsText } from './like-pattern';
import type { ConditionSet, ConditionSetInput, Target, TargetInput } from '@/shared/schemas/library';
import { ConditionSetModel, TargetProfileModel } from '../models';

const toTarget = (r: TargetProfileModel): Target => ({
  id: r.id,
  name: r.name,
  kind: r.kind,
  heightM: r.heightM,
  widthM: r.widthM,
  requiredVisibleM: r.requiredVisibleM,
  period: r.period,
  lightIntensityCd: r.lightIntensityCd ?? null,
  onWater: r.onWater,
  version: r.version,
  updatedAt: r.updatedAt.toISOString(),
});

const toConditionSet = (r: ConditionSetModel): ConditionSet => ({
  id: r.id,
  name: r.name,
  conditions: r.conditions,
  visibilityM: r.visibilityM,
  visibilityKind: r.visibilityKind,
  seaState: r.seaState ?? null,
  significantWaveHeightM: r.significantWaveHeightM ?? null,
  backgroundLighting: r.backgroundLighting,
  version: r.version,
  updatedAt: r.updatedAt.toISOString(),
});

/** The same five operations over one library table, returning plain objects. */
function libraryOf<M extends typeof TargetProfileModel | typeof ConditionSetModel, Dto, Input extends object>(
  model: M,
  toDto: (row: InstanceType<M>) => Dto,
) {
  // Sequelize's static methods do not type well across a union of models; the casts stay inside this factory.
  const m = model as unknown as typeof TargetProfileModel;
  const dto = toDto as unknown as (row: TargetProfileModel) => Dto;
  return {
    async list(organizationId: string, transaction?: Transaction): Promise<Dto[]> {
      return (await m.findAll({ where: { organizationId }, order: [['name', 'ASC']], transaction })).map(dto);
    },
    /** One page, searched by name and sorted as asked. */
    async page(organizationId: string, query: LibraryListQuery) {
      const [field, direction] = sortOrder(query.sort);
      const { rows, count } = await m.findAndCountAll({
        where: { organizationId, ...(query.q && { name: containsText(query.q) }) },
        order: [
          [field, direction],
          ['id', 'ASC'],
        ],
        limit: query.pageSize,
        offset: (query.page - 1) * query.pageSize,
      });
      return { items: rows.map(dto), total: count, page: query.page, pageSize: query.pageSize };
    },
    async find(organizationId: string, id: string, transaction?: Transaction): Promise<Dto | null> {
      const row = await m.findOne({ where: { id, organizationId }, transaction });
      return row ? dto(row) : null;
    },
    async create(organizationId: string, input: Input, transaction: Transaction): Promise<Dto> {
      return dto(await m.create({ ...(input as object), organizationId } as never, { transaction }));
    },
    async updateIfVersion(
      organizationId: string,
      id: string,
      version: number,
      changes: Partial<Input>,
      transaction: Transaction,
    ): Promise<Dto | null> {
      const [count] = await m.update({ ...(changes as object), version: version + 1 } as never, {
        where: { id, organizationId, version },
        transaction,
      });
      return count === 1 ? this.find(organizationId, id, transaction) : null;
    },
    async softDelete(organizationId: string, id: string, transaction: Transaction): Promise<void> {
      await m.destroy({ where: { id, organizationId }, transaction });
    },
  };
}

export const targetsRepository = libraryOf<typeof TargetProfileModel, Target, TargetInput>(TargetProfileModel, toTarget);
export const conditionSetsRepository = libraryOf<typeof ConditionSetModel, ConditionSet, ConditionSetInput>(
  ConditionSetModel,
  toConditionSet,
);
export type LibraryRepository<Dto, Input extends object> = ReturnType<typeof libraryOf<typeof TargetProfileModel, Dto, Input>>;

import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { Calibration, CalibrationFigures, CalibrationListQuery, CalibrationMethod } from '@/shared/schemas/calibration';
import { CALIBRATION_CAUTIONS } from '@/shared/trainer/evaluate-calibration';
import { FieldCalibrationModel, PostModel, UserModel } from '../models';

const include = [
  { model: PostModel, as: 'post', attributes: ['id', 'name'] },
  { model: UserModel, as: 'observer', attributes: ['id', 'name'] },
];

const toCalibration = (r: FieldCalibrationModel): Calibration => ({
  id: r.id,
  method: r.method,
  measurement: r.measurement,
  postId: r.postId,
  postName: r.post?.name ?? null,
  observer: { id: r.observerId, name: r.observer?.name ?? '' },
  observedAt: r.observedAt.toISOString(),
  weather: r.weather,
  notes: r.notes,
  k: r.k,
  kMin: r.kMin,
  kMax: r.kMax,
  resultKind: r.resultKind,
  ...r.figures,
  conditionSetId: r.conditionSetId,
  cautions: CALIBRATION_CAUTIONS.map((c) => ({ ...c })),
  createdAt: r.createdAt.toISOString(),
});

/** What a new calibration row holds. */
export interface NewCalibration {
  postId: string | null;
  observerId: string;
  observedAt: Date;
  method: CalibrationMethod;
  measurement: Record<string, number | boolean | string>;
  weather: Calibration['weather'];
  notes: string;
  figures: CalibrationFigures;
}

/** Field calibrations of one organisation, as plain objects. */
export const calibrationsRepository = {
  /** Newest observation first; `from`/`to` bound the observation time (from inclusive, to exclusive). */
  async page(organizationId: string, query: CalibrationListQuery) {
    const observedAt = {
      ...(query.from && { [Op.gte]: new Date(query.from) }),
      ...(query.to && { [Op.lt]: new Date(query.to) }),
    };
    const where: WhereOptions<FieldCalibrationModel> = {
      organizationId,
      ...(query.postId && { postId: query.postId }),
      ...((query.from || query.to) && { observedAt }),
    };
    const { rows, count } = await FieldCalibrationModel.findAndCountAll({
      where,
      include,
      order: [
        ['observedAt', 'DESC'],
        ['id', 'ASC'],
      ],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    });
    return { items: rows.map(toCalibration), total: count, page: query.page, pageSize: query.pageSize };
  },

  async find(organizationId: string, id: string, transaction?: Transaction): Promise<Calibration | null> {
    const row = await FieldCalibrationModel.findOne({ where: { id, organizationId }, include, transaction });
    return row ? toCalibration(row) : null;
  },

  async create(organizationId: string, input: NewCalibration, transaction: Transaction): Promise<Calibration> {
    const { k, kMin, kMax, resultKind, ...figures } = input.figures;
    const row = await FieldCalibrationModel.create(
      {
        organizationId,
        postId: input.postId,
        observerId: input.observerId,
        observedAt: input.observedAt,
        method: input.method,
        measurement: input.measurement,
        weather: input.weather,
        notes: input.notes,
        k,
        kMin,
        kMax,
        resultKind,
        figures,
      },
      { transaction },
    );
    return (await this.find(organizationId, row.id, transaction))!;
  },

  /** Links the condition set it was saved as, only if it has none yet; false when it already had one. */
  async linkConditionSet(organizationId: string, id: string, conditionSetId: string, transaction: Transaction): Promise<boolean> {
    const [count] = await FieldCalibrationModel.update(
      { conditionSetId },
      { where: { id, organizationId, conditionSetId: { [Op.is]: null } }, transaction },
    );
    return count === 1;
  },
};

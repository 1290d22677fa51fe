import { Op, type Transaction } from 'sequelize';
import type { Plan, PlanInput, PlanRevision, PlanSnapshot, PlanStatus } from '@/shared/schemas/plan';
import { PlanModel, PlanReviewModel, PlanRevisionModel, UserModel } from '../models';

type Person = { id: string; name: string; role: string };

async function people(ids: string[], transaction?: Transaction): Promise<Map<string, Person>> {
  const rows = await UserModel.findAll({ where: { id: [...new Set(ids)] }, attributes: ['id', 'name', 'role'], raw: true, transaction });
  return new Map(rows.map((r) => [r.id, { id: r.id, name: r.name, role: r.role }]));
}
const someone = (map: Map<string, Person>, id: string): Person => map.get(id) ?? { id, name: 'former user', role: 'unknown' };

async function toPlans(rows: PlanModel[], transaction?: Transaction): Promise<Plan[]> {
  const who = await people(rows.map((r) => r.preparedById), transaction);
  return rows.map((r) => ({
    id: r.id,
    siteId: r.siteId,
    title: r.title,
    postIds: r.postIds,
    targetIds: r.targetIds,
    conditionSetIds: r.conditionSetIds,
    standard: r.standard,
    status: r.status,
    version: r.version,
    previousId: r.previousId,
    rowVersion: r.rowVersion,
    preparedBy: someone(who, r.preparedById),
    updatedAt: r.updatedAt.toISOString(),
  }));
}

export const plansRepository = {
  async list(organizationId: string, filter: { statuses?: PlanStatus[]; siteId?: string }): Promise<Plan[]> {
    const rows = await PlanModel.findAll({
      where: {
        organizationId,
        ...(filter.statuses && { status: { [Op.in]: filter.statuses } }),
        ...(filter.siteId && { siteId: filter.siteId }),
      },
      order: [['updatedAt', 'DESC']],
    });
    return toPlans(rows);
  },

  async find(organizationId: string, id: string, transaction?: Transaction): Promise<Plan | null> {
    const row = await PlanModel.findOne({ where: { id, organizationId }, transaction, ...(transaction && { lock: transaction.LOCK.UPDATE }) });
    return row ? (await toPlans([row], transaction))[0]! : null;
  },

  async create(organizationId: string, preparedById: string, input: PlanInput & { version?: number; previousId?: string | null }, transaction: Transaction): Promise<Plan> {
    const row = await PlanModel.create({ ...input, organizationId, preparedById, previousId: input.previousId ?? null }, { transaction });
    return (await toPlans([row], transaction))[0]!;
  },

  async updateIfRowVersion(organizationId: string, id: string, rowVersion: number, changes: Partial<PlanInput> & { status?: PlanStatus }, transaction: Transaction): Promise<Plan | null> {
    const [count] = await PlanModel.update({ ...changes, rowVersion: rowVersion + 1 }, { where: { id, organizationId, rowVersion }, transaction });
    return count === 1 ? this.find(organizationId, id, transaction) : null;
  },

  async setStatus(id: string, status: PlanStatus, transaction: Transaction): Promise<void> {
    await PlanModel.increment({ rowVersion: 1 }, { where: { id }, transaction });
    await PlanModel.update({ status }, { where: { id }, transaction });
  },

  async addRevision(planId: string, submittedById: string, snapshot: PlanSnapshot, hash: string, transaction: Transaction): Promise<number> {
    const last = (await PlanRevisionModel.max('number', { where: { planId }, transaction })) as number | null;
    const number = (last ?? 0) + 1;
    await PlanRevisionModel.create({ planId, number, contentHash: hash, snapshot, submittedById }, { transaction });
    return number;
  },

  async revisions(planId: string, withSnapshot: boolean): Promise<(Omit<PlanRevision, 'snapshot'> & { snapshot?: PlanSnapshot })[]> {
    const rows = await PlanRevisionModel.findAll({
      where: { planId },
      order: [['number', 'ASC']],
      attributes: withSnapshot ? undefined : ['number', 'contentHash', 'submittedById', 'createdAt'],
    });
    const who = await people(rows.map((r) => r.submittedById));
    return rows.map((r) => ({
      number: r.number,
      contentHash: r.contentHash,
      ...(withSnapshot && { snapshot: r.snapshot as PlanSnapshot }),
      submittedBy: someone(who, r.submittedById),
      submittedAt: r.createdAt.toISOString(),
    }));
  },

  async latestRevisionNumber(planId: string, transaction?: Transaction): Promise<number | null> {
    return ((await PlanRevisionModel.max('number', { where: { planId }, transaction })) as number | null) ?? null;
  },

  async addReview(planId: string, review: { revision: number; decision: 'approve' | 'return'; comment: string; reviewerId: string }, transaction: Transaction) {
    await PlanReviewModel.create({ planId, ...review }, { transaction });
  },

  async reviews(planId: string) {
    const rows = await PlanReviewModel.findAll({ where: { planId }, order: [['createdAt', 'ASC']] });
    const who = await people(rows.map((r) => r.reviewerId));
    return rows.map((r) => ({ revision: r.revision, decision: r.decision, comment: r.comment, reviewer: someone(who, r.reviewerId), at: r.createdAt.toISOString() }));
  },

  async reviewerEmails(organizationId: string): Promise<string[]> {
    const rows = await UserModel.findAll({ where: { organizationId, role: 'reviewer', active: true }, attributes: ['email'], raw: true });
    return rows.map((r) => r.email);
  },

  async emailOf(userId: string): Promise<string | null> {
    return (await UserModel.findByPk(userId, { attributes: ['email'], raw: true }))?.email ?? null;
  },
};

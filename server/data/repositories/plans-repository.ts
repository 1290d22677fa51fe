import { PlanStandardSchema } from '@/shared/schemas/plan';
import { col, fn, literal, Op, type Transaction } from 'sequelize';
import { sortOrder } from '@/shared/schemas/list';
import type { Plan, PlanInput, PlanListQuery, PlanRevision, PlanSnapshot, PlanStatus } from '@/shared/schemas/plan';
import type { StandardVerdict } from '@/shared/plans/standard-verdict';
import { PlanModel, PlanReviewModel, PlanRevisionModel, SiteModel, UserModel } from '../models';
import { containsText } from './like-pattern';

type Person = { id: string; name: string; role: string };

async function people(ids: string[], transaction?: Transaction): Promise<Map<string, Person>> {
  const rows = await UserModel.findAll({
    where: { id: [...new Set(ids)] },
    attributes: ['id', 'name', 'role'],
    raw: true,
    transaction,
  });
  return new Map(rows.map((r) => [r.id, { id: r.id, name: r.name, role: r.role }]));
}
const someone = (map: Map<string, Person>, id: string): Person => map.get(id) ?? { id, name: 'former user', role: 'unknown' };

/** When each plan's latest revision was submitted, for lists and the review queue. */
const SUBMITTED_AT = literal('(SELECT max(r.created_at) FROM plan_revisions r WHERE r.plan_id = "PlanModel"."id")');

async function toPlans(rows: PlanModel[], transaction?: Transaction): Promise<Plan[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const [who, sites, submitted] = await Promise.all([
    people(
      rows.map((r) => r.preparedById),
      transaction,
    ),
    SiteModel.findAll({
      where: { id: [...new Set(rows.map((r) => r.siteId))] },
      attributes: ['id', 'name'],
      paranoid: false,
      raw: true,
      transaction,
    }),
    PlanRevisionModel.findAll({
      where: { planId: ids },
      attributes: ['planId', [fn('max', col('created_at')), 'at']],
      group: ['planId'],
      raw: true,
      transaction,
    }) as unknown as Promise<{ planId: string; at: Date }[]>,
  ]);
  const siteName = new Map(sites.map((x) => [x.id, x.name]));
  const submittedAt = new Map(submitted.map((x) => [x.planId, new Date(x.at).toISOString()]));
  return rows.map((r) => ({
    id: r.id,
    siteId: r.siteId,
    title: r.title,
    postIds: r.postIds,
    targetIds: r.targetIds,
    conditionSetIds: r.conditionSetIds,
    standard: PlanStandardSchema.parse(r.standard),
    lookout: r.lookout ?? { resolutionArcmin: 1, magnification: 1 },
    status: r.status,
    version: r.version,
    previousId: r.previousId,
    rowVersion: r.rowVersion,
    preparedBy: someone(who, r.preparedById),
    siteName: siteName.get(r.siteId) ?? 'removed site',
    submittedAt: submittedAt.get(r.id) ?? null,
    updatedAt: r.updatedAt.toISOString(),
  }));
}

export const plansRepository = {
  /** One page of the organisation's plans; `notPreparedBy` leaves out one person's own plans (a reviewer's queue). */
  async page(
    organizationId: string,
    query: Omit<PlanListQuery, 'status' | 'queue'> & { statuses?: PlanStatus[]; notPreparedBy?: string },
  ) {
    const [field, direction] = sortOrder(query.sort);
    const { rows, count } = await PlanModel.findAndCountAll({
      where: {
        organizationId,
        ...(query.statuses && { status: { [Op.in]: query.statuses } }),
        ...(query.siteId && { siteId: query.siteId }),
        ...(query.notPreparedBy && { preparedById: { [Op.ne]: query.notPreparedBy } }),
        ...(query.q && { title: containsText(query.q) }),
      },
      order: [
        [field === 'submittedAt' ? SUBMITTED_AT : field, direction],
        ['id', 'ASC'],
      ],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    });
    return { items: await toPlans(rows), total: count, page: query.page, pageSize: query.pageSize };
  },

  /** The most recently approved plan of the organisation that uses the post. */
  async latestApprovedWithPost(organizationId: string, postId: string): Promise<Plan | null> {
    const row = await PlanModel.findOne({
      where: { organizationId, status: 'approved', postIds: { [Op.contains]: [postId] } },
      order: [['updatedAt', 'DESC']],
    });
    return row ? (await toPlans([row]))[0]! : null;
  },

  /** Titles and statuses of the organisation's plans with these statuses that use the post. */
  async withPost(
    organizationId: string,
    postId: string,
    statuses: PlanStatus[],
    transaction?: Transaction,
  ): Promise<{ id: string; title: string; status: PlanStatus }[]> {
    const rows = await PlanModel.findAll({
      where: { organizationId, status: { [Op.in]: statuses }, postIds: { [Op.contains]: [postId] } },
      attributes: ['id', 'title', 'status'],
      order: [['title', 'ASC']],
      raw: true,
      transaction,
    });
    return rows.map((r) => ({ id: r.id, title: r.title, status: r.status }));
  },

  async countInSite(siteId: string, statuses: PlanStatus[], transaction?: Transaction): Promise<number> {
    return PlanModel.count({ where: { siteId, status: { [Op.in]: statuses } }, transaction });
  },

  /**
   * Inside a transaction the plan row is locked for the write, without waiting: a second
   * writer of the same plan gets PostgreSQL's lock_not_available (answered 409 `busy`)
   * at once instead of holding a pooled connection while it queues behind the first.
   */
  async find(organizationId: string, id: string, transaction?: Transaction): Promise<Plan | null> {
    if (transaction) {
      await PlanModel.sequelize!.query(
        'SELECT 1 FROM plans WHERE id = :id AND organization_id = :organizationId FOR UPDATE NOWAIT',
        {
          replacements: { id, organizationId },
          transaction,
        },
      );
    }
    const row = await PlanModel.findOne({ where: { id, organizationId }, transaction });
    return row ? (await toPlans([row], transaction))[0]! : null;
  },

  async create(
    organizationId: string,
    preparedById: string,
    input: PlanInput & { version?: number; previousId?: string | null },
    transaction: Transaction,
  ): Promise<Plan> {
    const row = await PlanModel.create(
      { ...input, organizationId, preparedById, previousId: input.previousId ?? null },
      { transaction },
    );
    return (await toPlans([row], transaction))[0]!;
  },

  async updateIfRowVersion(
    organizationId: string,
    id: string,
    rowVersion: number,
    changes: Partial<PlanInput> & { status?: PlanStatus },
    transaction: Transaction,
  ): Promise<Plan | null> {
    const [count] = await PlanModel.update(
      { ...changes, rowVersion: rowVersion + 1 },
      { where: { id, organizationId, rowVersion }, transaction },
    );
    return count === 1 ? this.find(organizationId, id, transaction) : null;
  },

  async setStatus(id: string, status: PlanStatus, transaction: Transaction): Promise<void> {
    await PlanModel.increment({ rowVersion: 1 }, { where: { id }, transaction });
    await PlanModel.update({ status }, { where: { id }, transaction });
  },

  async addRevision(
    planId: string,
    submittedById: string,
    snapshot: PlanSnapshot,
    hash: string,
    frozen: { verdict: StandardVerdict; exceptionNote: string | null },
    transaction: Transaction,
  ): Promise<number> {
    const last = (await PlanRevisionModel.max('number', { where: { planId }, transaction })) as number | null;
    const number = (last ?? 0) + 1;
    await PlanRevisionModel.create(
      {
        planId,
        number,
        contentHash: hash,
        snapshot,
        submittedById,
        standardVerdict: frozen.verdict,
        exceptionNote: frozen.exceptionNote,
      },
      { transaction },
    );
    return number;
  },

  /** The verdict frozen with a revision (null: none was frozen, an older revision). */
  async revisionVerdict(planId: string, number: number, transaction?: Transaction): Promise<StandardVerdict | null> {
    const row = await PlanRevisionModel.findOne({
      where: { planId, number },
      attributes: ['standardVerdict'],
      transaction,
    });
    return (row?.standardVerdict as StandardVerdict | null | undefined) ?? null;
  },

  async revisions(
    planId: string,
    withSnapshot: boolean,
  ): Promise<(Omit<PlanRevision, 'snapshot'> & { snapshot?: PlanSnapshot })[]> {
    const rows = await PlanRevisionModel.findAll({
      where: { planId },
      order: [['number', 'ASC']],
      attributes: withSnapshot
        ? undefined
        : ['number', 'contentHash', 'submittedById', 'createdAt', 'standardVerdict', 'exceptionNote'],
    });
    const who = await people(rows.map((r) => r.submittedById));
    return rows.map((r) => ({
      number: r.number,
      contentHash: r.contentHash,
      ...(withSnapshot && { snapshot: r.snapshot as PlanSnapshot }),
      submittedBy: someone(who, r.submittedById),
      submittedAt: r.createdAt.toISOString(),
      verdict: (r.standardVerdict as StandardVerdict | null) ?? null,
      exceptionNote: r.exceptionNote ?? null,
    }));
  },

  async latestRevisionNumber(planId: string, transaction?: Transaction): Promise<number | null> {
    return ((await PlanRevisionModel.max('number', { where: { planId }, transaction })) as number | null) ?? null;
  },

  async addReview(
    planId: string,
    review: {
      revision: number;
      decision: 'approve' | 'return';
      comment: string;
      reviewerId: string;
      exceptionJustification: string | null;
    },
    transaction: Transaction,
  ) {
    await PlanReviewModel.create({ planId, ...review }, { transaction });
  },

  async reviews(planId: string) {
    const rows = await PlanReviewModel.findAll({ where: { planId }, order: [['createdAt', 'ASC']] });
    const who = await people(rows.map((r) => r.reviewerId));
    return rows.map((r) => ({
      revision: r.revision,
      decision: r.decision,
      comment: r.comment,
      justification: r.exceptionJustification ?? null,
      reviewer: someone(who, r.reviewerId),
      at: r.createdAt.toISOString(),
    }));
  },

  async reviewerEmails(organizationId: string): Promise<string[]> {
    const rows = await UserModel.findAll({
      where: { organizationId, role: 'reviewer', active: true },
      attributes: ['email'],
      raw: true,
    });
    return rows.map((r) => r.email);
  },

  async emailOf(userId: string): Promise<string | null> {
    return (await UserModel.findByPk(userId, { attributes: ['email'], raw: true }))?.email ?? null;
  },
};

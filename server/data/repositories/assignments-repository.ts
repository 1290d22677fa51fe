import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { Assignment } from '@/shared/schemas/assignment';
import { sortOrder } from '@/shared/schemas/list';
import { AssignmentModel, PostModel, SiteModel, UserModel } from '../models';

const include = [
  {
    model: PostModel,
    as: 'post',
    attributes: ['id', 'name', 'siteId'],
    paranoid: false,
    include: [{ model: SiteModel, as: 'site', attributes: ['id', 'name'], paranoid: false }],
  },
  { model: UserModel, as: 'user', attributes: ['id', 'name', 'role'] },
];

type Loaded = AssignmentModel & { post?: PostModel & { site?: SiteModel }; user?: UserModel };

function toAssignment(row: Loaded): Assignment {
  return {
    id: row.id,
    postId: row.postId,
    postName: row.post?.name ?? 'removed post',
    siteId: row.post?.siteId ?? row.postId,
    siteName: row.post?.site?.name ?? 'removed site',
    person: row.user
      ? { id: row.user.id, name: row.user.name, role: row.user.role }
      : { id: row.userId, name: 'former user', role: 'unknown' },
    startsAt: row.startsAt.toISOString(),
    endsAt: row.endsAt ? row.endsAt.toISOString() : null,
    note: row.note,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** Watches that share any instant with [from, to). */
const overlapping = (from: Date, to: Date | null): WhereOptions => ({
  ...(to && { startsAt: { [Op.lt]: to } }),
  [Op.or]: [{ endsAt: null }, { endsAt: { [Op.gt]: from } }],
});

export interface AssignmentFilter {
  siteId?: string;
  postId?: string;
  userId?: string;
  from: Date;
  to: Date;
}

export const assignmentsRepository = {
  async page(
    organizationId: string,
    filter: AssignmentFilter & { sort: 'startsAt' | '-startsAt'; page: number; pageSize: number },
  ) {
    const [, direction] = sortOrder(filter.sort);
    const { rows, count } = await AssignmentModel.findAndCountAll({
      where: {
        organizationId,
        ...(filter.postId && { postId: filter.postId }),
        ...(filter.userId && { userId: filter.userId }),
        ...(filter.siteId && { '$post.site_id$': filter.siteId }),
        ...overlapping(filter.from, filter.to),
      },
      include,
      order: [
        ['startsAt', direction],
        ['id', 'ASC'],
      ],
      limit: filter.pageSize,
      offset: (filter.page - 1) * filter.pageSize,
      distinct: true,
    });
    return { items: rows.map((r) => toAssignment(r as Loaded)), total: count, page: filter.page, pageSize: filter.pageSize };
  },

  /** Every watch of a site's posts within the window, for the roster. */
  async inSite(organizationId: string, siteId: string, from: Date, to: Date): Promise<Assignment[]> {
    const rows = await AssignmentModel.findAll({
      where: { organizationId, '$post.site_id$': siteId, ...overlapping(from, to) },
      include,
      order: [['startsAt', 'ASC']],
    });
    return rows.map((r) => toAssignment(r as Loaded));
  },

  /** Whether the person is on a watch at any post of the site at that instant (an observer on duty). */
  async onWatchInSite(organizationId: string, userId: string, siteId: string, at: Date, transaction?: Transaction) {
    const count = await AssignmentModel.count({
      where: { organizationId, userId, '$post.site_id$': siteId, startsAt: { [Op.lte]: at }, ...overlapping(at, null) },
      include: [{ model: PostModel, as: 'post', attributes: [] }],
      transaction,
    });
    return count > 0;
  },

  async find(organizationId: string, id: string, transaction?: Transaction): Promise<Assignment | null> {
    const row = await AssignmentModel.findOne({ where: { id, organizationId }, include, transaction });
    return row ? toAssignment(row as Loaded) : null;
  },

  /** Another watch of the same person at an overlapping time, if any. */
  async clashFor(
    organizationId: string,
    userId: string,
    from: Date,
    to: Date | null,
    exceptId: string | null,
    transaction: Transaction,
  ): Promise<Assignment | null> {
    const row = await AssignmentModel.findOne({
      where: { organizationId, userId, ...(exceptId && { id: { [Op.ne]: exceptId } }), ...overlapping(from, to) },
      include,
      transaction,
    });
    return row ? toAssignment(row as Loaded) : null;
  },

  async create(
    organizationId: string,
    input: { postId: string; userId: string; startsAt: Date; endsAt: Date | null; note: string },
    transaction: Transaction,
  ): Promise<Assignment> {
    const row = await AssignmentModel.create({ organizationId, ...input }, { transaction });
    return (await this.find(organizationId, row.id, transaction))!;
  },

  async updateIfVersion(
    organizationId: string,
    id: string,
    version: number,
    changes: { startsAt?: Date; endsAt?: Date | null; note?: string },
    transaction: Transaction,
  ): Promise<Assignment | null> {
    const [count] = await AssignmentModel.update(
      { ...changes, version: version + 1 },
      { where: { id, organizationId, version }, transaction },
    );
    return count === 1 ? this.find(organizationId, id, transaction) : null;
  },

  async softDelete(organizationId: string, id: string, transaction: Transaction): Promise<void> {
    await AssignmentModel.destroy({ where: { id, organizationId }, transaction });
  },
};

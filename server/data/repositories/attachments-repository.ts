import { Op, type Transaction } from 'sequelize';
import type {
  Attachment,
  AttachmentContentType,
  AttachmentKind,
  AttachmentList,
  AttachmentOwnerType,
} from '@/shared/schemas/attachment';
import type { PlanStatus } from '@/shared/schemas/plan';
import { AttachmentModel, PlanModel, PostModel, SiteModel, UserModel } from '../models';

/** An attachment with the store key, which only the server sees. */
export type StoredAttachment = Attachment & { storeKey: string };

export interface NewAttachment {
  ownerType: AttachmentOwnerType;
  ownerId: string;
  kind: AttachmentKind;
  originalName: string;
  contentType: AttachmentContentType;
  bytes: number;
  sha256: string;
  storeKey: string;
  widthPx: number | null;
  heightPx: number | null;
  bearingDeg: number | null;
  caption: string;
}

const include = [{ model: UserModel, as: 'uploadedBy', attributes: ['id', 'name'] }];

function toAttachment(row: AttachmentModel): StoredAttachment {
  return {
    id: row.id,
    ownerType: row.ownerType,
    ownerId: row.ownerId,
    kind: row.kind,
    originalName: row.originalName,
    contentType: row.contentType,
    bytes: row.bytes,
    sha256: row.sha256,
    widthPx: row.widthPx,
    heightPx: row.heightPx,
    bearingDeg: row.bearingDeg,
    caption: row.caption,
    uploadedBy: row.uploadedBy
      ? { id: row.uploadedBy.id, name: row.uploadedBy.name }
      : { id: row.uploadedById, name: 'former user' },
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    version: row.version,
    storeKey: row.storeKey,
  };
}

const withoutKey = ({ storeKey: _key, ...attachment }: StoredAttachment): Attachment => attachment;

export const attachmentsRepository = {
  /**
   * The owner as far as attachments care: whether it exists (not deleted) in
   * the organisation, and a plan's status (observers see approved plans only).
   */
  async findOwner(
    organizationId: string,
    ownerType: AttachmentOwnerType,
    ownerId: string,
    transaction?: Transaction,
  ): Promise<{ planStatus: PlanStatus | null } | null> {
    const where = { id: ownerId, organizationId };
    if (ownerType === 'post') return (await PostModel.count({ where, transaction })) ? { planStatus: null } : null;
    if (ownerType === 'site') return (await SiteModel.count({ where, transaction })) ? { planStatus: null } : null;
    const plan = await PlanModel.findOne({ where, attributes: ['status'], transaction });
    return plan ? { planStatus: plan.status } : null;
  },

  /** Every live attachment of the given owners, oldest first (for freezing into a plan revision). */
  async ofOwners(
    organizationId: string,
    owners: { ownerType: AttachmentOwnerType; ownerIds: string[] }[],
    transaction?: Transaction,
  ): Promise<Attachment[]> {
    const rows = await AttachmentModel.findAll({
      where: { organizationId, [Op.or]: owners.map((o) => ({ ownerType: o.ownerType, ownerId: o.ownerIds })) },
      include,
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
      transaction,
    });
    return rows.map((r) => withoutKey(toAttachment(r)));
  },

  async page(
    organizationId: string,
    filter: { ownerType: AttachmentOwnerType; ownerId: string; kind?: AttachmentKind },
    page: number,
    pageSize: number,
  ): Promise<AttachmentList> {
    const { rows, count } = await AttachmentModel.findAndCountAll({
      where: {
        organizationId,
        ownerType: filter.ownerType,
        ownerId: filter.ownerId,
        ...(filter.kind && { kind: filter.kind }),
      },
      include,
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    });
    return { items: rows.map((r) => withoutKey(toAttachment(r))), total: count, page, pageSize };
  },

  /** Not deleted, in the organisation; null otherwise. */
  async find(organizationId: string, id: string, transaction?: Transaction): Promise<StoredAttachment | null> {
    const row = await AttachmentModel.findOne({ where: { id, organizationId }, include, transaction });
    return row ? toAttachment(row) : null;
  },

  async create(
    organizationId: string,
    uploadedById: string,
    input: NewAttachment,
    transaction: Transaction,
  ): Promise<Attachment> {
    const row = await AttachmentModel.create({ ...input, organizationId, uploadedById }, { transaction });
    return withoutKey((await this.find(organizationId, row.id, transaction))!);
  },

  /** Applies the changes when the row still has `version`; null when another edit came first. */
  async updateIfVersion(
    organizationId: string,
    id: string,
    version: number,
    changes: { caption?: string; bearingDeg?: number | null },
    transaction: Transaction,
  ): Promise<Attachment | null> {
    const [count] = await AttachmentModel.update(
      { ...changes, version: version + 1 },
      { where: { id, organizationId, version }, transaction },
    );
    if (count !== 1) return null;
    return withoutKey((await this.find(organizationId, id, transaction))!);
  },

  /** Soft delete: the row stays (plan revisions may refer to it) and so do the bytes. */
  async softDelete(organizationId: string, id: string, transaction: Transaction): Promise<void> {
    await AttachmentModel.destroy({ where: { id, organizationId }, transaction });
  },

  withoutKey,
};

import type { Transaction, WhereOptions } from 'sequelize';
import type { Incident, IncidentEntry, IncidentEntryKind, IncidentStatus } from '@/shared/schemas/incident';
import { IncidentEntryModel, IncidentModel, SiteModel, UserModel } from '../models';

type LoadedIncident = IncidentModel & { site?: SiteModel; openedBy?: UserModel };
type LoadedEntry = IncidentEntryModel & { actor?: UserModel };

const incidentInclude = [
  { model: SiteModel, as: 'site', attributes: ['id', 'name'], paranoid: false },
  { model: UserModel, as: 'openedBy', attributes: ['id', 'name'] },
];

/** The incident row as the API shows it; the counts and fix come from its log. */
export interface IncidentRow extends Omit<Incident, 'reportCount' | 'fix'> {
  lastHash: string | null;
}

function toIncident(row: LoadedIncident): IncidentRow {
  return {
    id: row.id,
    siteId: row.siteId,
    siteName: row.site?.name ?? 'removed site',
    title: row.title,
    status: row.status,
    openedBy: { id: row.openedById, name: row.openedBy?.name ?? 'former user' },
    openedAt: row.openedAt.toISOString(),
    closedAt: row.closedAt ? row.closedAt.toISOString() : null,
    entryCount: row.entryCount,
    lastHash: row.lastHash,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
  };
}

function toEntry(row: LoadedEntry): IncidentEntry & { actorId: string; recordedAtDate: Date } {
  return {
    seq: row.seq,
    kind: row.kind,
    actor: { id: row.actorId, name: row.actor?.name ?? 'former user' },
    actorId: row.actorId,
    recordedAt: row.recordedAt.toISOString(),
    recordedAtDate: row.recordedAt,
    body: row.body,
    prevHash: row.prevHash,
    hash: row.hash,
  };
}

export type StoredEntry = ReturnType<typeof toEntry>;

/** An entry's content as its hash covers it. */
export interface ChainedEntry {
  seq: number;
  kind: IncidentEntryKind;
  actorId: string;
  recordedAt: Date;
  body: Record<string, unknown>;
  prevHash: string | null;
}

export const incidentsRepository = {
  async list(organizationId: string, filter: { siteId?: string; status?: IncidentStatus }): Promise<IncidentRow[]> {
    const where: WhereOptions = {
      organizationId,
      ...(filter.siteId && { siteId: filter.siteId }),
      ...(filter.status && { status: filter.status }),
    };
    const rows = await IncidentModel.findAll({ where, include: incidentInclude, order: [['openedAt', 'DESC']], limit: 200 });
    return rows.map((r) => toIncident(r as LoadedIncident));
  },

  async find(organizationId: string, id: string, transaction?: Transaction): Promise<IncidentRow | null> {
    const row = await IncidentModel.findOne({ where: { id, organizationId }, include: incidentInclude, transaction });
    return row ? toIncident(row as LoadedIncident) : null;
  },

  /**
   * Takes the incident's row lock for the rest of the transaction: appends to
   * one incident's log happen one at a time, each after the last one's hash.
   */
  async lock(organizationId: string, id: string, transaction: Transaction): Promise<IncidentModel | null> {
    return IncidentModel.findOne({ where: { id, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
  },

  async create(
    organizationId: string,
    input: { siteId: string; title: string; openedById: string },
    transaction: Transaction,
  ): Promise<IncidentModel> {
    return IncidentModel.create({ organizationId, ...input }, { transaction });
  },

  /**
   * Stores one entry of the locked incident's log (its number, previous hash
   * and hash already worked out by the caller) and moves the incident's head
   * to it, with any changes to the incident made by the entry.
   */
  async append(
    incident: IncidentModel,
    entry: ChainedEntry & { idempotencyKey: string | null; hash: string },
    incidentChanges: Partial<Pick<IncidentModel, 'title' | 'status' | 'closedAt'>>,
    transaction: Transaction,
  ): Promise<StoredEntry> {
    const row = await IncidentEntryModel.create(
      { organizationId: incident.organizationId, incidentId: incident.id, ...entry },
      { transaction },
    );
    await incident.update(
      { ...incidentChanges, entryCount: entry.seq, lastHash: entry.hash, version: incident.version + 1 },
      { transaction },
    );
    const actor = await UserModel.findByPk(entry.actorId, { attributes: ['id', 'name'], transaction });
    return toEntry(Object.assign(row, { actor }) as LoadedEntry);
  },

  async entries(organizationId: string, incidentId: string, transaction?: Transaction): Promise<StoredEntry[]> {
    const rows = await IncidentEntryModel.findAll({
      where: { organizationId, incidentId },
      include: [{ model: UserModel, as: 'actor', attributes: ['id', 'name'] }],
      order: [['seq', 'ASC']],
      transaction,
    });
    return rows.map((r) => toEntry(r as LoadedEntry));
  },

  async entryByKey(incidentId: string, idempotencyKey: string, transaction: Transaction): Promise<StoredEntry | null> {
    const row = await IncidentEntryModel.findOne({
      where: { incidentId, idempotencyKey },
      include: [{ model: UserModel, as: 'actor', attributes: ['id', 'name'] }],
      transaction,
    });
    return row ? toEntry(row as LoadedEntry) : null;
  },

  /** Addresses of the organisation's active planners, told of each new fix. */
  async plannerEmails(organizationId: string): Promise<string[]> {
    const rows = await UserModel.findAll({
      where: { organizationId, role: 'planner', active: true },
      attributes: ['email'],
      raw: true,
    });
    return rows.map((r) => r.email);
  },
};

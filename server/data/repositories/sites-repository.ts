import { fn, col, type Transaction } from 'sequelize';
import type { Site, SiteInput, SiteSummary } from '@/shared/schemas/site';
import { PostModel, PriorityZoneModel, SiteModel } from '../models';
import type { PolygonGeometry } from '../models/site';

const polygon = (ring: [number, number][]): PolygonGeometry => ({ type: 'Polygon', coordinates: [ring] });
const ringOf = (g: PolygonGeometry | null | undefined) =>
  g ? (g.coordinates[0] ?? []).map(([x, y]) => [x, y] as [number, number]) : null;

function toSite(row: SiteModel, zones: PriorityZoneModel[]): Site {
  return {
    id: row.id,
    name: row.name,
    kind: row.kind,
    notes: row.notes,
    boundary: ringOf(row.boundary),
    priorityZones: zones
      .sort((a, b) => a.position - b.position)
      .map((z) => ({ name: z.name, weight: z.weight, ring: ringOf(z.area) ?? [] })),
    defaultUnits: row.defaultUnits,
    timeZone: row.timeZone,
    seaLevelMaxM: row.seaLevelMaxM ?? null,
    targetGroundM: row.targetGroundM ?? null,
    seaArea: row.seaArea ?? null,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
  };
}

async function replaceZones(siteId: string, zones: SiteInput['priorityZones'], transaction: Transaction) {
  await PriorityZoneModel.destroy({ where: { siteId }, transaction });
  await PriorityZoneModel.bulkCreate(
    zones.map((z, position) => ({ siteId, name: z.name, weight: z.weight, area: polygon(z.ring), position })),
    { transaction },
  );
}

export const sitesRepository = {
  /** Locks the site's row until the transaction ends (one terrain upload at a time per site). */
  async lockForUpdate(organizationId: string, id: string, transaction: Transaction): Promise<void> {
    await SiteModel.findOne({ where: { id, organizationId }, attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction });
  },

  async pageInOrganization(
    organizationId: string,
    page: number,
    pageSize: number,
  ): Promise<{ items: SiteSummary[]; total: number; page: number; pageSize: number }> {
    const { rows, count } = await SiteModel.findAndCountAll({
      where: { organizationId },
      order: [['name', 'ASC']],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    });
    const counts = rows.length
      ? ((await PostModel.findAll({
          where: { siteId: rows.map((r) => r.id) },
          attributes: ['siteId', [fn('COUNT', col('id')), 'n']],
          group: ['siteId'],
          raw: true,
        })) as unknown as { siteId: string; n: string }[])
      : [];
    const bySite = new Map(counts.map((c) => [c.siteId, Number(c.n)]));
    return {
      items: rows.map((r) => ({
        id: r.id,
        name: r.name,
        kind: r.kind,
        notes: r.notes,
        updatedAt: r.updatedAt.toISOString(),
        postCount: bySite.get(r.id) ?? 0,
      })),
      total: count,
      page,
      pageSize,
    };
  },

  async findInOrganization(organizationId: string, id: string, transaction?: Transaction): Promise<Site | null> {
    const row = await SiteModel.findOne({ where: { id, organizationId }, transaction });
    if (!row) return null;
    const zones = await PriorityZoneModel.findAll({ where: { siteId: id }, transaction });
    return toSite(row, zones);
  },

  async create(organizationId: string, input: SiteInput, transaction: Transaction): Promise<Site> {
    const row = await SiteModel.create(
      {
        organizationId,
        name: input.name,
        kind: input.kind,
        notes: input.notes,
        boundary: input.boundary ? polygon(input.boundary) : null,
        defaultUnits: input.defaultUnits,
        timeZone: input.timeZone,
        seaLevelMaxM: input.seaLevelMaxM,
        targetGroundM: input.targetGroundM,
        seaArea: input.seaArea,
      },
      { transaction },
    );
    await replaceZones(row.id, input.priorityZones, transaction);
    return (await this.findInOrganization(organizationId, row.id, transaction))!;
  },

  /** Applies the changes when the row still has `version`; null when another edit came first. */
  async updateIfVersion(
    organizationId: string,
    id: string,
    version: number,
    changes: Partial<SiteInput>,
    transaction: Transaction,
  ): Promise<Site | null> {
    const { priorityZones, boundary, ...plain } = changes;
    const [count] = await SiteModel.update(
      { ...plain, ...(boundary !== undefined && { boundary: boundary ? polygon(boundary) : null }), version: version + 1 },
      { where: { id, organizationId, version }, transaction },
    );
    if (count !== 1) return null;
    if (priorityZones) await replaceZones(id, priorityZones, transaction);
    return this.findInOrganization(organizationId, id, transaction);
  },

  async softDelete(organizationId: string, id: string, transaction: Transaction): Promise<void> {
    await SiteModel.destroy({ where: { id, organizationId }, transaction });
  },
};

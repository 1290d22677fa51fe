import { QueryTypes, type Transaction } from 'sequelize';
import type { Site, SiteInput, SiteSummary } from '@/shared/schemas/site';
import { PriorityZoneModel, SiteModel } from '../models';
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
    shoreline: row.shoreline ?? null,
    bands: row.bands ?? [],
    heightDatum: row.heightDatum ?? 'mean-sea-level',
    tide: row.tide ?? null,
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

  /**
   * One page of the organisation's live sites by name, each with its live posts counted.
   * One statement (the total by a window function): the site list is asked on every
   * home screen, and three round trips with every column were most of its cost.
   */
  async pageInOrganization(
    organizationId: string,
    page: number,
    pageSize: number,
  ): Promise<{ items: SiteSummary[]; total: number; page: number; pageSize: number }> {
    const db = SiteModel.sequelize!;
    const rows = (await db.query(
      `SELECT s.id, s.name, s.kind, s.notes, s.updated_at AS "updatedAt", count(*) OVER () AS total,
              (SELECT count(*) FROM posts p WHERE p.site_id = s.id AND p.deleted_at IS NULL) AS "postCount"
         FROM sites s
        WHERE s.organization_id = :organizationId AND s.deleted_at IS NULL
        ORDER BY s.name ASC
        LIMIT :limit OFFSET :offset`,
      {
        replacements: { organizationId, limit: pageSize, offset: (page - 1) * pageSize },
        type: QueryTypes.SELECT,
      },
    )) as {
      id: string;
      name: string;
      kind: SiteSummary['kind'];
      notes: string;
      updatedAt: Date;
      total: string;
      postCount: string;
    }[];
    // A page past the end has no row to carry the total.
    const total = rows[0] ? Number(rows[0].total) : page > 1 ? await SiteModel.count({ where: { organizationId } }) : 0;
    return {
      items: rows.map((r) => ({
        id: r.id,
        name: r.name,
        kind: r.kind,
        notes: r.notes,
        updatedAt: new Date(r.updatedAt).toISOString(),
        postCount: Number(r.postCount),
      })),
      total,
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
        shoreline: input.shoreline,
        bands: input.bands,
        heightDatum: input.heightDatum,
        tide: input.tide,
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

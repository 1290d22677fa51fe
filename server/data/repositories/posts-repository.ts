import type { Transaction } from 'sequelize';
import { sortOrder } from '@/shared/schemas/list';
import type { Post, PostInput, PostListQuery } from '@/shared/schemas/site';
import { PostModel } from '../models';
import { containsText } from './like-pattern';

function toPost(row: PostModel): Post {
  const [lonDeg, latDeg] = row.location.coordinates;
  return {
    id: row.id,
    siteId: row.siteId,
    name: row.name,
    kind: row.kind,
    location: { latDeg, lonDeg },
    groundElevationM: row.groundElevationM,
    structureHeightM: row.structureHeightM,
    eyeHeightM: row.eyeHeightM,
    sector:
      row.sectorFromDeg === null || row.sectorToDeg === null ? null : { fromDeg: row.sectorFromDeg, toDeg: row.sectorToDeg },
    status: row.status,
    route: row.route ? row.route.map(([lonDeg, latDeg]) => ({ latDeg, lonDeg })) : null,
    speedMps: row.speedMps ?? null,
    cycleMinutes: row.cycleMinutes ?? null,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** A route as stored: `[lon, lat]` pairs. */
const routeColumn = (route: PostInput['route']): [number, number][] | null =>
  route ? route.map((p) => [p.lonDeg, p.latDeg] as [number, number]) : null;

const columns = (input: Partial<PostInput>) => {
  const { location, sector, route, ...plain } = input;
  return {
    ...plain,
    ...(route !== undefined && { route: routeColumn(route) }),
    ...(location && {
      location: { type: 'Point' as const, coordinates: [location.lonDeg, location.latDeg] as [number, number] },
    }),
    ...(sector !== undefined && { sectorFromDeg: sector?.fromDeg ?? null, sectorToDeg: sector?.toDeg ?? null }),
  };
};

export const postsRepository = {
  async listInSite(organizationId: string, siteId: string, transaction?: Transaction): Promise<Post[]> {
    const rows = await PostModel.findAll({ where: { organizationId, siteId }, order: [['name', 'ASC']], transaction });
    return rows.map(toPost);
  },

  /** One page of a site's posts, filtered and sorted as asked; ties broken by name, then id. */
  async pageInSite(organizationId: string, siteId: string, query: PostListQuery) {
    const [field, direction] = sortOrder(query.sort);
    const { rows, count } = await PostModel.findAndCountAll({
      where: {
        organizationId,
        siteId,
        ...(query.kind && { kind: query.kind }),
        ...(query.status && { status: query.status }),
        ...(query.q && { name: containsText(query.q) }),
      },
      order: [
        [field, direction],
        ['name', 'ASC'],
        ['id', 'ASC'],
      ],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    });
    return { items: rows.map(toPost), total: count, page: query.page, pageSize: query.pageSize };
  },

  async findInOrganization(organizationId: string, id: string, transaction?: Transaction): Promise<Post | null> {
    const row = await PostModel.findOne({ where: { id, organizationId }, transaction });
    return row ? toPost(row) : null;
  },

  async findInSite(organizationId: string, siteId: string, id: string, transaction?: Transaction): Promise<Post | null> {
    const row = await PostModel.findOne({ where: { id, siteId, organizationId }, transaction });
    return row ? toPost(row) : null;
  },

  async create(organizationId: string, siteId: string, input: PostInput, transaction: Transaction): Promise<Post> {
    const row = await PostModel.create(
      {
        organizationId,
        siteId,
        name: input.name,
        kind: input.kind,
        groundElevationM: input.groundElevationM,
        structureHeightM: input.structureHeightM,
        eyeHeightM: input.eyeHeightM,
        status: input.status,
        location: { type: 'Point', coordinates: [input.location.lonDeg, input.location.latDeg] },
        sectorFromDeg: input.sector?.fromDeg ?? null,
        sectorToDeg: input.sector?.toDeg ?? null,
        route: routeColumn(input.route ?? null),
        speedMps: input.speedMps ?? null,
        cycleMinutes: input.cycleMinutes ?? null,
      },
      { transaction },
    );
    return toPost(row);
  },

  async updateIfVersion(
    organizationId: string,
    siteId: string,
    id: string,
    version: number,
    changes: Partial<PostInput>,
    transaction: Transaction,
  ): Promise<Post | null> {
    const [count] = await PostModel.update(
      { ...columns(changes), version: version + 1 },
      { where: { id, siteId, organizationId, version }, transaction },
    );
    return count === 1 ? this.findInSite(organizationId, siteId, id, transaction) : null;
  },

  async countInSite(siteId: string, transaction?: Transaction): Promise<number> {
    return PostModel.count({ where: { siteId }, transaction });
  },

  async softDelete(organizationId: string, siteId: string, id: string, transaction: Transaction): Promise<void> {
    await PostModel.destroy({ where: { id, siteId, organizationId }, transaction });
  },
};

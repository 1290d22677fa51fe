import type { Transaction } from 'sequelize';
import type { TerrainFormat } from '@/shared/schemas/terrain';
import { SiteTerrainModel, UserModel } from '../models';
import type { TerrainCorners } from '../models/site-terrain';

/** A stored terrain as the domain sees it (plain object). */
export interface TerrainRecord {
  id: string;
  organizationId: string;
  siteId: string;
  active: boolean;
  storeKey: string;
  sha256: string;
  storedBytes: number;
  originalName: string;
  originalFormat: TerrainFormat;
  originalBytes: number;
  width: number;
  height: number;
  cellSizeM: number;
  xllM: number;
  yllM: number;
  epsg: number | null;
  crsWkt: string | null;
  crsLabel: string;
  nodataValue: number | null;
  nodataCells: number;
  minElevationM: number;
  maxElevationM: number;
  coversBoundary: boolean | null;
  hillshadeKey: string;
  hillshadeWidth: number;
  hillshadeHeight: number;
  corners: TerrainCorners;
  uploadedById: string | null;
  /** Name of the uploader, or "(seed)" / "(removed user)". */
  uploadedByName: string;
  createdAt: string;
}

export type NewTerrain = Omit<
  TerrainRecord,
  'id' | 'organizationId' | 'siteId' | 'active' | 'uploadedById' | 'uploadedByName' | 'createdAt'
>;

async function toRecord(row: SiteTerrainModel, transaction?: Transaction): Promise<TerrainRecord> {
  const user = row.uploadedById ? await UserModel.findByPk(row.uploadedById, { attributes: ['name'], transaction }) : null;
  const plain = row.get({ plain: true });
  return {
    ...plain,
    storedBytes: row.storedBytes,
    originalBytes: row.originalBytes,
    nodataCells: row.nodataCells,
    uploadedByName: user?.name ?? (row.uploadedById ? '(removed user)' : '(seed)'),
    createdAt: row.createdAt.toISOString(),
  };
}

export const terrainRepository = {
  async findActive(organizationId: string, siteId: string, transaction?: Transaction): Promise<TerrainRecord | null> {
    const row = await SiteTerrainModel.findOne({ where: { organizationId, siteId, active: true }, transaction });
    return row ? toRecord(row, transaction) : null;
  },

  /** Any terrain of the site, active or replaced. */
  async findInSite(organizationId: string, siteId: string, id: string, transaction?: Transaction): Promise<TerrainRecord | null> {
    const row = await SiteTerrainModel.findOne({ where: { organizationId, siteId, id }, transaction });
    return row ? toRecord(row, transaction) : null;
  },

  /** Makes `terrain` the site's active terrain; the previous one stays, inactive. Returns the previous id too. */
  async createActive(
    organizationId: string,
    siteId: string,
    uploadedById: string | null,
    terrain: NewTerrain,
    transaction: Transaction,
  ): Promise<{ created: TerrainRecord; replacedId: string | null }> {
    const previous = await SiteTerrainModel.findOne({ where: { organizationId, siteId, active: true }, transaction });
    if (previous) await SiteTerrainModel.update({ active: false }, { where: { id: previous.id }, transaction });
    const row = await SiteTerrainModel.create(
      { ...terrain, organizationId, siteId, uploadedById, active: true },
      { transaction },
    );
    return { created: await toRecord(row, transaction), replacedId: previous?.id ?? null };
  },

  async countInSite(siteId: string): Promise<number> {
    return SiteTerrainModel.count({ where: { siteId } });
  },
};

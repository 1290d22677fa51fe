import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { TerrainFormat } from '@/shared/schemas/terrain';

/** WGS84 corners of a terrain grid. */
export interface TerrainCorners {
  northWest: { latDeg: number; lonDeg: number };
  northEast: { latDeg: number; lonDeg: number };
  southEast: { latDeg: number; lonDeg: number };
  southWest: { latDeg: number; lonDeg: number };
}

/** One uploaded terrain of a site (see migration 0008). Never updated except `active`. */
export class SiteTerrainModel extends Model<InferAttributes<SiteTerrainModel>, InferCreationAttributes<SiteTerrainModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare siteId: string;
  declare active: CreationOptional<boolean>;
  declare storeKey: string;
  declare sha256: string;
  declare storedBytes: number;
  declare originalName: string;
  declare originalFormat: TerrainFormat;
  declare originalBytes: number;
  declare width: number;
  declare height: number;
  declare cellSizeM: number;
  declare xllM: number;
  declare yllM: number;
  declare epsg: number | null;
  declare crsWkt: string | null;
  declare crsLabel: string;
  declare nodataValue: number | null;
  declare nodataCells: number;
  declare minElevationM: number;
  declare maxElevationM: number;
  declare coversBoundary: boolean | null;
  declare hillshadeKey: string;
  declare hillshadeWidth: number;
  declare hillshadeHeight: number;
  declare corners: TerrainCorners;
  declare uploadedById: string | null;
  declare createdAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    // BIGINT columns come back from pg as strings; the getters turn them into numbers.
    const bigint = (name: 'storedBytes' | 'originalBytes' | 'nodataCells') => ({
      type: DataTypes.BIGINT,
      allowNull: false,
      get(this: SiteTerrainModel) {
        return Number(this.getDataValue(name));
      },
    });
    SiteTerrainModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        siteId: { type: DataTypes.UUID, allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        storeKey: { type: DataTypes.STRING(64), allowNull: false },
        sha256: { type: DataTypes.STRING(64), allowNull: false },
        storedBytes: bigint('storedBytes'),
        originalName: { type: DataTypes.STRING(255), allowNull: false },
        originalFormat: { type: DataTypes.STRING(16), allowNull: false },
        originalBytes: bigint('originalBytes'),
        width: { type: DataTypes.INTEGER, allowNull: false },
        height: { type: DataTypes.INTEGER, allowNull: false },
        cellSizeM: { type: DataTypes.DOUBLE, allowNull: false },
        xllM: { type: DataTypes.DOUBLE, allowNull: false },
        yllM: { type: DataTypes.DOUBLE, allowNull: false },
        epsg: { type: DataTypes.INTEGER, allowNull: true },
        crsWkt: { type: DataTypes.TEXT, allowNull: true },
        crsLabel: { type: DataTypes.STRING(255), allowNull: false },
        nodataValue: { type: DataTypes.DOUBLE, allowNull: true },
        nodataCells: bigint('nodataCells'),
        minElevationM: { type: DataTypes.DOUBLE, allowNull: false },
        maxElevationM: { type: DataTypes.DOUBLE, allowNull: false },
        coversBoundary: { type: DataTypes.BOOLEAN, allowNull: true },
        hillshadeKey: { type: DataTypes.STRING(64), allowNull: false },
        hillshadeWidth: { type: DataTypes.INTEGER, allowNull: false },
        hillshadeHeight: { type: DataTypes.INTEGER, allowNull: false },
        corners: { type: DataTypes.JSONB, allowNull: false },
        uploadedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'site_terrains', updatedAt: false },
    );
  }
}

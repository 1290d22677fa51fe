import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { HeightDatum, ShoreBand, SiteKind, Tide } from '@/shared/schemas/site';
import type { OrganizationModel } from './organization';

/** GeoJSON polygon as stored (WGS84). */
export interface PolygonGeometry {
  type: 'Polygon';
  coordinates: [number, number][][];
  crs?: unknown;
}

export class SiteModel extends Model<InferAttributes<SiteModel>, InferCreationAttributes<SiteModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: ForeignKey<OrganizationModel['id']>;
  declare name: string;
  declare kind: SiteKind;
  declare notes: CreationOptional<string>;
  declare boundary: CreationOptional<PolygonGeometry | null>;
  declare defaultUnits: CreationOptional<'metric' | 'nautical' | 'imperial'>;
  declare timeZone: CreationOptional<string>;
  declare seaLevelMaxM: CreationOptional<number | null>;
  declare targetGroundM: CreationOptional<number | null>;
  declare seaArea: CreationOptional<[number, number][] | null>;
  declare shoreline: CreationOptional<[number, number][] | null>;
  declare bands: CreationOptional<ShoreBand[]>;
  declare heightDatum: CreationOptional<HeightDatum>;
  declare tide: CreationOptional<Tide | null>;
  declare version: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare zones?: NonAttribute<PriorityZoneModel[]>;

  static register(sequelize: Sequelize) {
    SiteModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        kind: { type: DataTypes.ENUM('forest-district', 'coast-stretch', 'search-area'), allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        boundary: { type: DataTypes.GEOMETRY('POLYGON', 4326), allowNull: true },
        defaultUnits: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'metric' },
        timeZone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
        seaLevelMaxM: { type: DataTypes.DOUBLE, allowNull: true },
        targetGroundM: { type: DataTypes.DOUBLE, allowNull: true },
        seaArea: { type: DataTypes.JSONB, allowNull: true },
        shoreline: { type: DataTypes.JSONB, allowNull: true },
        bands: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        heightDatum: { type: DataTypes.STRING(24), allowNull: false, defaultValue: 'mean-sea-level' },
        tide: { type: DataTypes.JSONB, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deletedAt: DataTypes.DATE,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sites', paranoid: true },
    );
  }
}

export class PriorityZoneModel extends Model<InferAttributes<PriorityZoneModel>, InferCreationAttributes<PriorityZoneModel>> {
  declare id: CreationOptional<string>;
  declare siteId: ForeignKey<SiteModel['id']>;
  declare name: string;
  declare weight: number;
  declare area: PolygonGeometry;
  declare position: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    PriorityZoneModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        weight: { type: DataTypes.INTEGER, allowNull: false },
        area: { type: DataTypes.GEOMETRY('POLYGON', 4326), allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'priority_zones' },
    );
  }
}

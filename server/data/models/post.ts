import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { POST_KINDS, POST_STATUSES } from '@/shared/schemas/site';
import type { OrganizationModel } from './organization';
import type { SiteModel } from './site';

export interface PointGeometry {
  type: 'Point';
  coordinates: [number, number];
  crs?: unknown;
}

export class PostModel extends Model<InferAttributes<PostModel>, InferCreationAttributes<PostModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: ForeignKey<OrganizationModel['id']>;
  declare siteId: ForeignKey<SiteModel['id']>;
  declare name: string;
  declare kind: (typeof POST_KINDS)[number];
  declare location: PointGeometry;
  declare groundElevationM: number;
  declare structureHeightM: number;
  declare eyeHeightM: number;
  declare sectorFromDeg: number | null;
  declare sectorToDeg: number | null;
  declare status: (typeof POST_STATUSES)[number];
  /** Patrol route as `[lon, lat]` pairs (WGS84); null = a fixed post. */
  declare route: CreationOptional<[number, number][] | null>;
  declare speedMps: CreationOptional<number | null>;
  declare cycleMinutes: CreationOptional<number | null>;
  declare version: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    PostModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        kind: { type: DataTypes.STRING(16), allowNull: false },
        location: { type: DataTypes.GEOMETRY('POINT', 4326), allowNull: false },
        groundElevationM: { type: DataTypes.DOUBLE, allowNull: false },
        structureHeightM: { type: DataTypes.DOUBLE, allowNull: false },
        eyeHeightM: { type: DataTypes.DOUBLE, allowNull: false },
        sectorFromDeg: { type: DataTypes.DOUBLE, allowNull: true },
        sectorToDeg: { type: DataTypes.DOUBLE, allowNull: true },
        status: { type: DataTypes.STRING(16), allowNull: false },
        route: { type: DataTypes.JSONB, allowNull: true },
        speedMps: { type: DataTypes.DOUBLE, allowNull: true },
        cycleMinutes: { type: DataTypes.DOUBLE, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deletedAt: DataTypes.DATE,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'posts', paranoid: true },
    );
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { VisibilityIndexGrid, VisibilityIndexStatus } from '@/shared/schemas/visibility-index';

/** One visibility index layer of a site terrain, tower height and radius (migration 0027). */
export class VisibilityIndexLayerModel extends Model<
  InferAttributes<VisibilityIndexLayerModel>,
  InferCreationAttributes<VisibilityIndexLayerModel>
> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare siteId: string;
  declare terrainId: string;
  declare heightM: number;
  declare radiusM: number;
  declare rays: number;
  declare strideCells: CreationOptional<number | null>;
  declare status: CreationOptional<VisibilityIndexStatus>;
  declare progress: CreationOptional<number>;
  declare error: CreationOptional<string | null>;
  declare jobId: CreationOptional<string | null>;
  declare grid: CreationOptional<VisibilityIndexGrid | null>;
  /** Seen ground per index cell, m², little-endian Float32; NaN where not computed. */
  declare seenM2: CreationOptional<Buffer | null>;
  declare siteAreaM2: CreationOptional<number | null>;
  declare elapsedS: CreationOptional<number | null>;
  declare requestedById: string | null;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    VisibilityIndexLayerModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        siteId: { type: DataTypes.UUID, allowNull: false },
        terrainId: { type: DataTypes.UUID, allowNull: false },
        heightM: { type: DataTypes.DOUBLE, allowNull: false },
        radiusM: { type: DataTypes.DOUBLE, allowNull: false },
        rays: { type: DataTypes.INTEGER, allowNull: false },
        strideCells: { type: DataTypes.INTEGER, allowNull: true },
        status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
        progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        error: { type: DataTypes.TEXT, allowNull: true },
        jobId: { type: DataTypes.STRING(64), allowNull: true },
        grid: { type: DataTypes.JSONB, allowNull: true },
        seenM2: { type: DataTypes.BLOB, allowNull: true },
        siteAreaM2: { type: DataTypes.DOUBLE, allowNull: true },
        elapsedS: { type: DataTypes.DOUBLE, allowNull: true },
        requestedById: { type: DataTypes.UUID, allowNull: true },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'visibility_index_layers' },
    );
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { SitingRunStatus } from '@/shared/schemas/siting';

/** One siting run of a site (see migration 0026). The result is written once, when it is done. */
export class SitingRunModel extends Model<InferAttributes<SitingRunModel>, InferCreationAttributes<SitingRunModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare siteId: string;
  declare terrainId: string;
  declare inputsHash: string;
  declare inputs: object;
  declare status: CreationOptional<SitingRunStatus>;
  declare progress: CreationOptional<number>;
  declare stage: CreationOptional<string>;
  declare error: CreationOptional<string | null>;
  declare jobId: CreationOptional<string | null>;
  declare requestedById: string | null;
  declare result: CreationOptional<object | null>;
  declare planId: CreationOptional<string | null>;
  declare elapsedS: CreationOptional<number | null>;
  declare heartbeatAt: CreationOptional<Date | null>;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    SitingRunModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        siteId: { type: DataTypes.UUID, allowNull: false },
        terrainId: { type: DataTypes.UUID, allowNull: false },
        inputsHash: { type: DataTypes.STRING(64), allowNull: false },
        inputs: { type: DataTypes.JSONB, allowNull: false },
        status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
        progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        stage: { type: DataTypes.STRING(200), allowNull: false, defaultValue: 'Waiting for a worker' },
        error: { type: DataTypes.TEXT, allowNull: true },
        jobId: { type: DataTypes.STRING(64), allowNull: true },
        requestedById: { type: DataTypes.UUID, allowNull: true },
        result: { type: DataTypes.JSONB, allowNull: true },
        planId: { type: DataTypes.UUID, allowNull: true },
        elapsedS: { type: DataTypes.DOUBLE, allowNull: true },
        heartbeatAt: { type: DataTypes.DATE, allowNull: true },
        startedAt: { type: DataTypes.DATE, allowNull: true },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'siting_runs' },
    );
  }
}

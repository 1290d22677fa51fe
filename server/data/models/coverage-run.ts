import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { CoverageCase, CoverageGrid, CoverageRunStatus } from '@/shared/schemas/coverage';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';

/** The grid a run's layers are on (see migration 0010). */
export type CoverageRunGrid = CoverageGrid;

/** One terrain coverage run of a plan. Only status, progress and results change, and only until it ends. */
export class CoverageRunModel extends Model<InferAttributes<CoverageRunModel>, InferCreationAttributes<CoverageRunModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare planId: string;
  declare siteId: string;
  declare terrainId: string | null;
  declare datum: 'terrain' | 'flat';
  declare inputsHash: string;
  declare inputs: object;
  declare status: CreationOptional<CoverageRunStatus>;
  declare progress: CreationOptional<number>;
  declare stage: CreationOptional<string>;
  declare error: CreationOptional<string | null>;
  declare jobId: CreationOptional<string | null>;
  /** How often the run was handed to a worker (1, or 2 after the first worker died). */
  declare attempts: CreationOptional<number>;
  declare requestedById: string | null;
  declare grid: CreationOptional<CoverageRunGrid | null>;
  declare cases: CreationOptional<CoverageCase[]>;
  declare elapsedS: CreationOptional<number | null>;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    CoverageRunModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        planId: { type: DataTypes.UUID, allowNull: false },
        siteId: { type: DataTypes.UUID, allowNull: false },
        terrainId: { type: DataTypes.UUID, allowNull: true },
        datum: { type: DataTypes.STRING(16), allowNull: false },
        inputsHash: { type: DataTypes.STRING(64), allowNull: false },
        inputs: { type: DataTypes.JSONB, allowNull: false },
        status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
        progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        stage: { type: DataTypes.STRING(200), allowNull: false, defaultValue: 'Waiting for a worker' },
        error: { type: DataTypes.TEXT, allowNull: true },
        jobId: { type: DataTypes.STRING(64), allowNull: true },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        requestedById: { type: DataTypes.UUID, allowNull: true },
        grid: { type: DataTypes.JSONB, allowNull: true },
        cases: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        elapsedS: { type: DataTypes.DOUBLE, allowNull: true },
        startedAt: { type: DataTypes.DATE, allowNull: true },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'coverage_runs' },
    );
  }
}

/** One stored layer of a run: a class raster for one case (and one post, for per-post layers). */
export class CoverageLayerModel extends Model<InferAttributes<CoverageLayerModel>, InferCreationAttributes<CoverageLayerModel>> {
  declare id: CreationOptional<string>;
  declare runId: string;
  declare caseKey: string;
  declare layer: string;
  /** '' for whole-network layers. */
  declare postId: string;
  declare encoded: EncodedClassRaster;
  declare sha256: string;

  static register(sequelize: Sequelize) {
    CoverageLayerModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        runId: { type: DataTypes.UUID, allowNull: false },
        caseKey: { type: DataTypes.STRING(120), allowNull: false },
        layer: { type: DataTypes.STRING(32), allowNull: false },
        postId: { type: DataTypes.STRING(36), allowNull: false, defaultValue: '' },
        encoded: { type: DataTypes.JSONB, allowNull: false },
        sha256: { type: DataTypes.STRING(64), allowNull: false },
      },
      { sequelize, tableName: 'coverage_layers', timestamps: false },
    );
  }
}

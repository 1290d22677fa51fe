import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { PlanLookout, PlanStandard, PlanStatus } from '@/shared/schemas/plan';

export class PlanModel extends Model<InferAttributes<PlanModel>, InferCreationAttributes<PlanModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare siteId: string;
  declare previousId: string | null;
  declare title: string;
  declare postIds: string[];
  declare targetIds: string[];
  declare conditionSetIds: string[];
  declare standard: PlanStandard;
  declare lookout: CreationOptional<PlanLookout>;
  declare status: CreationOptional<PlanStatus>;
  declare version: CreationOptional<number>;
  declare rowVersion: CreationOptional<number>;
  declare preparedById: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    PlanModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        siteId: { type: DataTypes.UUID, allowNull: false },
        previousId: { type: DataTypes.UUID, allowNull: true },
        title: { type: DataTypes.STRING(200), allowNull: false },
        postIds: { type: DataTypes.JSONB, allowNull: false },
        targetIds: { type: DataTypes.JSONB, allowNull: false },
        conditionSetIds: { type: DataTypes.JSONB, allowNull: false },
        standard: { type: DataTypes.JSONB, allowNull: false },
        lookout: { type: DataTypes.JSONB, allowNull: false, defaultValue: { resolutionArcmin: 1, magnification: 1 } },
        status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'draft' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        rowVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        preparedById: { type: DataTypes.UUID, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'plans' },
    );
  }
}

export class PlanRevisionModel extends Model<InferAttributes<PlanRevisionModel>, InferCreationAttributes<PlanRevisionModel>> {
  declare id: CreationOptional<string>;
  declare planId: string;
  declare number: number;
  declare contentHash: string;
  declare snapshot: object;
  declare submittedById: string;
  /** `StandardVerdict` frozen at submission; null in older revisions. */
  declare standardVerdict: CreationOptional<object | null>;
  declare exceptionNote: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    PlanRevisionModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        planId: { type: DataTypes.UUID, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        contentHash: { type: DataTypes.STRING(64), allowNull: false },
        snapshot: { type: DataTypes.JSONB, allowNull: false },
        submittedById: { type: DataTypes.UUID, allowNull: false },
        standardVerdict: { type: DataTypes.JSONB, allowNull: true, field: 'standard_verdict' },
        exceptionNote: { type: DataTypes.TEXT, allowNull: true, field: 'exception_note' },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'plan_revisions', updatedAt: false },
    );
  }
}

export class PlanReviewModel extends Model<InferAttributes<PlanReviewModel>, InferCreationAttributes<PlanReviewModel>> {
  declare id: CreationOptional<string>;
  declare planId: string;
  declare revision: number;
  declare decision: 'approve' | 'return';
  declare comment: string;
  declare reviewerId: string;
  declare exceptionJustification: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    PlanReviewModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        planId: { type: DataTypes.UUID, allowNull: false },
        revision: { type: DataTypes.INTEGER, allowNull: false },
        decision: { type: DataTypes.STRING(8), allowNull: false },
        comment: { type: DataTypes.TEXT, allowNull: false },
        reviewerId: { type: DataTypes.UUID, allowNull: false },
        exceptionJustification: { type: DataTypes.TEXT, allowNull: true, field: 'exception_justification' },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'plan_reviews', updatedAt: false },
    );
  }
}

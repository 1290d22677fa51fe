import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { TARGET_KINDS } from '@/shared/schemas/library';

const common = {
  id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
  organizationId: { type: DataTypes.UUID, allowNull: false },
  name: { type: DataTypes.STRING(120), allowNull: false },
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  deletedAt: DataTypes.DATE,
  createdAt: DataTypes.DATE,
  updatedAt: DataTypes.DATE,
};

export class TargetProfileModel extends Model<InferAttributes<TargetProfileModel>, InferCreationAttributes<TargetProfileModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare name: string;
  declare kind: (typeof TARGET_KINDS)[number];
  declare heightM: number;
  declare widthM: number;
  declare requiredVisibleM: number;
  declare period: 'day' | 'night';
  declare lightIntensityCd: CreationOptional<number | null>;
  declare onWater: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    TargetProfileModel.init(
      {
        ...common,
        kind: { type: DataTypes.STRING(24), allowNull: false },
        heightM: { type: DataTypes.DOUBLE, allowNull: false },
        widthM: { type: DataTypes.DOUBLE, allowNull: false },
        requiredVisibleM: { type: DataTypes.DOUBLE, allowNull: false },
        period: { type: DataTypes.STRING(8), allowNull: false },
        lightIntensityCd: { type: DataTypes.DOUBLE, allowNull: true },
        onWater: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      },
      { sequelize, tableName: 'target_profiles', paranoid: true },
    );
  }
}

export class ConditionSetModel extends Model<InferAttributes<ConditionSetModel>, InferCreationAttributes<ConditionSetModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare name: string;
  declare conditions: Record<string, number | string>[];
  declare visibilityM: number | null;
  declare visibilityKind: 'mor-5pct' | 'meteorological-range-2pct';
  declare seaState: CreationOptional<number | null>;
  declare significantWaveHeightM: CreationOptional<number | null>;
  declare backgroundLighting: CreationOptional<'none' | 'some' | 'much'>;
  declare version: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    ConditionSetModel.init(
      {
        ...common,
        conditions: { type: DataTypes.JSONB, allowNull: false },
        visibilityM: { type: DataTypes.DOUBLE, allowNull: true },
        visibilityKind: { type: DataTypes.STRING(32), allowNull: false },
        seaState: { type: DataTypes.SMALLINT, allowNull: true },
        significantWaveHeightM: { type: DataTypes.DOUBLE, allowNull: true },
        backgroundLighting: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'none' },
      },
      { sequelize, tableName: 'condition_sets', paranoid: true },
    );
  }
}

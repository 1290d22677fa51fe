import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { CalibrationFigures, CalibrationMethod } from '@/shared/schemas/calibration';
import type { PostModel } from './post';
import type { UserModel } from './user';

/** The figures kept beside the indexed k columns (see migration 0023). */
export type StoredCalibrationFigures = Omit<CalibrationFigures, 'k' | 'kMin' | 'kMax' | 'resultKind'>;

/** A field calibration of an organisation (see migration 0023). */
export class FieldCalibrationModel extends Model<
  InferAttributes<FieldCalibrationModel>,
  InferCreationAttributes<FieldCalibrationModel>
> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare postId: string | null;
  declare observerId: string;
  declare observedAt: Date;
  declare method: CalibrationMethod;
  declare measurement: Record<string, number | boolean | string>;
  declare weather: { pressureHpa: number; temperatureC: number; lapseRateKPerM: number } | null;
  declare notes: CreationOptional<string>;
  declare k: number | null;
  declare kMin: number | null;
  declare kMax: number | null;
  declare resultKind: CalibrationFigures['resultKind'];
  declare figures: StoredCalibrationFigures;
  declare conditionSetId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare post?: NonAttribute<PostModel | null>;
  declare observer?: NonAttribute<UserModel>;

  static register(sequelize: Sequelize) {
    FieldCalibrationModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        postId: { type: DataTypes.UUID, allowNull: true },
        observerId: { type: DataTypes.UUID, allowNull: false },
        observedAt: { type: DataTypes.DATE, allowNull: false },
        method: { type: DataTypes.STRING(20), allowNull: false },
        measurement: { type: DataTypes.JSONB, allowNull: false },
        weather: { type: DataTypes.JSONB, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        k: { type: DataTypes.DOUBLE, allowNull: true },
        kMin: { type: DataTypes.DOUBLE, allowNull: true },
        kMax: { type: DataTypes.DOUBLE, allowNull: true },
        resultKind: { type: DataTypes.STRING(20), allowNull: false },
        figures: { type: DataTypes.JSONB, allowNull: false },
        conditionSetId: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'field_calibrations' },
    );
  }
}

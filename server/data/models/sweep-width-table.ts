import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { SweepWidthRow } from '@/shared/schemas/sweep-width';

/** A sweep-width table of an organisation (see migration 0012). */
export class SweepWidthTableModel extends Model<
  InferAttributes<SweepWidthTableModel>,
  InferCreationAttributes<SweepWidthTableModel>
> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare name: string;
  declare edition: string;
  declare sourceName: string;
  declare isExample: CreationOptional<boolean>;
  declare notes: CreationOptional<string>;
  declare rows: SweepWidthRow[];
  declare retiredAt: CreationOptional<Date | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    SweepWidthTableModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        edition: { type: DataTypes.STRING(120), allowNull: false },
        sourceName: { type: DataTypes.STRING(200), allowNull: false },
        isExample: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        rows: { type: DataTypes.JSONB, allowNull: false },
        retiredAt: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sweep_width_tables' },
    );
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { DrillKind, DrillQuestion, DrillUnits } from '@/shared/schemas/drill';
import type { GeneratedDrill } from '@/shared/trainer/generate-drill';

/** A drill set for one person (see migration 0024). */
export class TrainerDrillModel extends Model<InferAttributes<TrainerDrillModel>, InferCreationAttributes<TrainerDrillModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare userId: string;
  declare postId: string | null;
  declare kind: DrillKind;
  declare seed: number;
  declare units: DrillUnits;
  declare question: DrillQuestion;
  declare solution: GeneratedDrill['solution'];
  declare answer: CreationOptional<{ value: number | boolean } | null>;
  declare score: CreationOptional<number | null>;
  declare answeredAt: CreationOptional<Date | null>;
  declare attemptId: CreationOptional<string | null>;
  declare position: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    TrainerDrillModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        userId: { type: DataTypes.UUID, allowNull: false },
        postId: { type: DataTypes.UUID, allowNull: true },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        seed: { type: DataTypes.INTEGER, allowNull: false },
        units: { type: DataTypes.STRING(20), allowNull: false },
        question: { type: DataTypes.JSONB, allowNull: false },
        solution: { type: DataTypes.JSONB, allowNull: false },
        answer: { type: DataTypes.JSONB, allowNull: true },
        score: { type: DataTypes.DOUBLE, allowNull: true },
        answeredAt: { type: DataTypes.DATE, allowNull: true },
        attemptId: { type: DataTypes.UUID, allowNull: true },
        position: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'trainer_drills' },
    );
  }
}

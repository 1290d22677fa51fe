import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { DrillKind, DrillUnits } from '@/shared/schemas/drill';

/** A planner's drill set (see migration 0025). */
export class TrainerCourseModel extends Model<InferAttributes<TrainerCourseModel>, InferCreationAttributes<TrainerCourseModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare name: string;
  declare kinds: DrillKind[];
  declare postIds: string[];
  declare questionCount: number;
  declare passMarkPct: number;
  declare validityDays: number;
  declare units: DrillUnits;
  declare createdById: string;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    TrainerCourseModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        kinds: { type: DataTypes.JSONB, allowNull: false },
        postIds: { type: DataTypes.JSONB, allowNull: false },
        questionCount: { type: DataTypes.INTEGER, allowNull: false },
        passMarkPct: { type: DataTypes.DOUBLE, allowNull: false },
        validityDays: { type: DataTypes.INTEGER, allowNull: false },
        units: { type: DataTypes.STRING(20), allowNull: false },
        createdById: { type: DataTypes.UUID, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'trainer_courses' },
    );
  }
}

/** A person a course is assigned to (see migration 0025). */
export class TrainerCourseAssigneeModel extends Model<
  InferAttributes<TrainerCourseAssigneeModel>,
  InferCreationAttributes<TrainerCourseAssigneeModel>
> {
  declare courseId: string;
  declare userId: string;
  declare organizationId: string;
  declare assignedById: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    TrainerCourseAssigneeModel.init(
      {
        courseId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
        userId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        assignedById: { type: DataTypes.UUID, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'trainer_course_assignees' },
    );
  }
}

/** One person's attempt at a course: its drills, scored when the last is answered (see migration 0025). */
export class TrainerCourseAttemptModel extends Model<
  InferAttributes<TrainerCourseAttemptModel>,
  InferCreationAttributes<TrainerCourseAttemptModel>
> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare courseId: string;
  declare userId: string;
  declare seed: number;
  declare questionCount: number;
  declare passMarkPct: number;
  declare completedAt: CreationOptional<Date | null>;
  declare scorePct: CreationOptional<number | null>;
  declare passed: CreationOptional<boolean | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    TrainerCourseAttemptModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        courseId: { type: DataTypes.UUID, allowNull: false },
        userId: { type: DataTypes.UUID, allowNull: false },
        seed: { type: DataTypes.INTEGER, allowNull: false },
        questionCount: { type: DataTypes.INTEGER, allowNull: false },
        passMarkPct: { type: DataTypes.DOUBLE, allowNull: false },
        completedAt: { type: DataTypes.DATE, allowNull: true },
        scorePct: { type: DataTypes.DOUBLE, allowNull: true },
        passed: { type: DataTypes.BOOLEAN, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'trainer_course_attempts' },
    );
  }
}

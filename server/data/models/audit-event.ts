import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** One write: who, what, when, and a before/after summary. Never updated. */
export class AuditEventModel extends Model<InferAttributes<AuditEventModel>, InferCreationAttributes<AuditEventModel>> {
  declare id: CreationOptional<number>;
  declare organizationId: string;
  declare actorId: string | null;
  declare action: string;
  declare entityType: string;
  declare entityId: string;
  declare summary: { before?: unknown; after?: unknown };
  declare createdAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    AuditEventModel.init(
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        actorId: { type: DataTypes.UUID, allowNull: true },
        action: { type: DataTypes.STRING(40), allowNull: false },
        entityType: { type: DataTypes.STRING(40), allowNull: false },
        entityId: { type: DataTypes.UUID, allowNull: false },
        summary: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'audit_events', updatedAt: false },
    );
  }
}

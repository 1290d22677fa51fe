import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { IncidentEntryKind, IncidentStatus } from '@/shared/schemas/incident';
import type { SiteModel } from './site';
import type { UserModel } from './user';

/** An incident on a site: its title and status for lists, and the head of its log's hash chain. */
export class IncidentModel extends Model<InferAttributes<IncidentModel>, InferCreationAttributes<IncidentModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare siteId: ForeignKey<SiteModel['id']>;
  declare title: string;
  declare status: CreationOptional<IncidentStatus>;
  declare openedById: ForeignKey<UserModel['id']>;
  declare openedAt: CreationOptional<Date>;
  declare closedAt: CreationOptional<Date | null>;
  declare entryCount: CreationOptional<number>;
  declare lastHash: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    IncidentModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        title: { type: DataTypes.STRING(200), allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'open' },
        openedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        entryCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        lastHash: { type: DataTypes.STRING(64), allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'incidents' },
    );
  }
}

/** One line of an incident's log. Never updated or deleted (a trigger refuses both). */
export class IncidentEntryModel extends Model<InferAttributes<IncidentEntryModel>, InferCreationAttributes<IncidentEntryModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare incidentId: ForeignKey<IncidentModel['id']>;
  declare seq: number;
  declare kind: IncidentEntryKind;
  declare actorId: ForeignKey<UserModel['id']>;
  declare recordedAt: Date;
  declare body: Record<string, unknown>;
  declare idempotencyKey: string | null;
  declare prevHash: string | null;
  declare hash: string;

  static register(sequelize: Sequelize) {
    IncidentEntryModel.init(
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        seq: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.STRING(20), allowNull: false },
        recordedAt: { type: DataTypes.DATE, allowNull: false },
        body: { type: DataTypes.JSONB, allowNull: false },
        idempotencyKey: { type: DataTypes.STRING(100), allowNull: true },
        prevHash: { type: DataTypes.STRING(64), allowNull: true },
        hash: { type: DataTypes.STRING(64), allowNull: false },
      },
      { sequelize, tableName: 'incident_entries', timestamps: false },
    );
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { Role } from '@/shared/schemas/auth';
import type { UnitSystem } from '@/shared/units/unit-systems';
import type { OrganizationModel } from './organization';

export class UserModel extends Model<InferAttributes<UserModel>, InferCreationAttributes<UserModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: ForeignKey<OrganizationModel['id']>;
  /** Stored lower-cased. */
  declare email: string;
  declare name: string;
  declare role: Role;
  /** bcrypt hash; null until an invited user sets a password. */
  declare passwordHash: string | null;
  declare active: CreationOptional<boolean>;
  /** sha256 of the one-time set-password token. */
  declare inviteTokenHash: string | null;
  declare inviteExpiresAt: Date | null;
  declare lastSignInAt: Date | null;
  declare version: CreationOptional<number>;
  /** Sealed into session cookies at sign-in; bumping it ends every earlier session. */
  declare sessionGeneration: CreationOptional<number>;
  /** The person's own unit system; null = each site's default units. */
  declare unitPreference: CreationOptional<UnitSystem | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare organization?: NonAttribute<OrganizationModel>;

  static register(sequelize: Sequelize) {
    UserModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.ENUM('admin', 'planner', 'reviewer', 'observer'), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: true },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        inviteTokenHash: { type: DataTypes.STRING(64), allowNull: true },
        inviteExpiresAt: { type: DataTypes.DATE, allowNull: true },
        lastSignInAt: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        sessionGeneration: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        unitPreference: { type: DataTypes.STRING(16), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users' },
    );
  }
}

import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { SiteKind } from '@/shared/schemas/site';
import type { OrganizationModel } from './organization';

export class SiteModel extends Model<InferAttributes<SiteModel>, InferCreationAttributes<SiteModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: ForeignKey<OrganizationModel['id']>;
  declare name: string;
  declare kind: SiteKind;
  declare notes: CreationOptional<string>;
  declare version: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    SiteModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        kind: { type: DataTypes.ENUM('forest-district', 'coast-stretch', 'search-area'), allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deletedAt: DataTypes.DATE,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sites', paranoid: true },
    );
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A named reference mark of a site (see migration 0030). */
export class LandmarkModel extends Model<InferAttributes<LandmarkModel>, InferCreationAttributes<LandmarkModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare siteId: string;
  declare name: string;
  declare latDeg: number;
  declare lonDeg: number;
  declare heightM: number | null;
  declare note: CreationOptional<string>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static register(sequelize: Sequelize) {
    LandmarkModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        siteId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        latDeg: { type: DataTypes.DOUBLE, allowNull: false },
        lonDeg: { type: DataTypes.DOUBLE, allowNull: false },
        heightM: { type: DataTypes.DOUBLE, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'site_landmarks', underscored: true },
    );
  }
}

import type { Sequelize } from 'sequelize';
import { OrganizationModel } from './organization';
import { SiteModel } from './site';
import { UserModel } from './user';

export { OrganizationModel, SiteModel, UserModel };

/** Registers every model and declares all associations, in one place. */
export function initModels(sequelize: Sequelize): void {
  OrganizationModel.register(sequelize);
  UserModel.register(sequelize);
  SiteModel.register(sequelize);

  OrganizationModel.hasMany(UserModel, { foreignKey: 'organizationId', as: 'users' });
  UserModel.belongsTo(OrganizationModel, { foreignKey: 'organizationId', as: 'organization' });
  OrganizationModel.hasMany(SiteModel, { foreignKey: 'organizationId', as: 'sites' });
  SiteModel.belongsTo(OrganizationModel, { foreignKey: 'organizationId', as: 'organization' });
}

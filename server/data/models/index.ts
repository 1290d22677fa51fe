import type { Sequelize } from 'sequelize';
import { AssignmentModel } from './assignment';
import { AttachmentModel } from './attachment';
import { AuditEventModel } from './audit-event';
import { IncidentEntryModel, IncidentModel } from './incident';
import { ConditionSetModel, TargetProfileModel } from './library';
import { OrganizationModel } from './organization';
import { PlanModel, PlanReviewModel, PlanRevisionModel } from './plan';
import { PostModel } from './post';
import { PriorityZoneModel, SiteModel } from './site';
import { SiteTerrainModel } from './site-terrain';
import { SweepWidthTableModel } from './sweep-width-table';
import { CoverageLayerModel, CoverageRunModel } from './coverage-run';
import { SitingRunModel } from './siting-run';
import { FieldCalibrationModel } from './field-calibration';
import { LandmarkModel } from './landmark';
import { TrainerCourseAssigneeModel, TrainerCourseAttemptModel, TrainerCourseModel } from './trainer-course';
import { TrainerDrillModel } from './trainer-drill';
import { UserModel } from './user';
import { VisibilityIndexLayerModel } from './visibility-index-layer';

export {
  CoverageLayerModel,
  CoverageRunModel,
  AssignmentModel,
  AttachmentModel,
  AuditEventModel,
  ConditionSetModel,
  IncidentEntryModel,
  IncidentModel,
  PlanModel,
  PlanReviewModel,
  PlanRevisionModel,
  TargetProfileModel,
  OrganizationModel,
  PostModel,
  PriorityZoneModel,
  SiteModel,
  SiteTerrainModel,
  SitingRunModel,
  SweepWidthTableModel,
  FieldCalibrationModel,
  LandmarkModel,
  TrainerCourseAssigneeModel,
  TrainerCourseAttemptModel,
  TrainerCourseModel,
  TrainerDrillModel,
  UserModel,
  VisibilityIndexLayerModel,
};

/** Registers every model and declares all associations, in one place. */
export function initModels(sequelize: Sequelize): void {
  OrganizationModel.register(sequelize);
  UserModel.register(sequelize);
  SiteModel.register(sequelize);
  PriorityZoneModel.register(sequelize);
  PostModel.register(sequelize);
  AuditEventModel.register(sequelize);
  TargetProfileModel.register(sequelize);
  ConditionSetModel.register(sequelize);
  PlanModel.register(sequelize);
  PlanRevisionModel.register(sequelize);
  PlanReviewModel.register(sequelize);
  AssignmentModel.register(sequelize);
  AttachmentModel.register(sequelize);
  FieldCalibrationModel.register(sequelize);
  LandmarkModel.register(sequelize);
  TrainerDrillModel.register(sequelize);
  TrainerCourseModel.register(sequelize);
  TrainerCourseAssigneeModel.register(sequelize);
  TrainerCourseAttemptModel.register(sequelize);
  SiteTerrainModel.register(sequelize);
  CoverageRunModel.register(sequelize);
  CoverageLayerModel.register(sequelize);
  SitingRunModel.register(sequelize);
  SweepWidthTableModel.register(sequelize);
  VisibilityIndexLayerModel.register(sequelize);
  IncidentModel.register(sequelize);
  IncidentEntryModel.register(sequelize);

  OrganizationModel.hasMany(UserModel, { foreignKey: 'organizationId', as: 'users' });
  UserModel.belongsTo(OrganizationModel, { foreignKey: 'organizationId', as: 'organization' });
  OrganizationModel.hasMany(SiteModel, { foreignKey: 'organizationId', as: 'sites' });
  SiteModel.belongsTo(OrganizationModel, { foreignKey: 'organizationId', as: 'organization' });
  SiteModel.hasMany(PriorityZoneModel, { foreignKey: 'siteId', as: 'zones' });
  PriorityZoneModel.belongsTo(SiteModel, { foreignKey: 'siteId', as: 'site' });
  OrganizationModel.hasMany(PostModel, { foreignKey: 'organizationId', as: 'posts' });
  PostModel.belongsTo(OrganizationModel, { foreignKey: 'organizationId', as: 'organization' });
  SiteModel.hasMany(PostModel, { foreignKey: 'siteId', as: 'sitePosts' });
  PostModel.belongsTo(SiteModel, { foreignKey: 'siteId', as: 'site' });
  OrganizationModel.hasMany(AssignmentModel, { foreignKey: 'organizationId', as: 'assignments' });
  PostModel.hasMany(AssignmentModel, { foreignKey: 'postId', as: 'assignments' });
  AssignmentModel.belongsTo(PostModel, { foreignKey: 'postId', as: 'post' });
  UserModel.hasMany(AssignmentModel, { foreignKey: 'userId', as: 'assignments' });
  AssignmentModel.belongsTo(UserModel, { foreignKey: 'userId', as: 'user' });
  FieldCalibrationModel.belongsTo(PostModel, { foreignKey: 'postId', as: 'post' });
  FieldCalibrationModel.belongsTo(UserModel, { foreignKey: 'observerId', as: 'observer' });
  // Attachments: the owner (post, site or plan) is polymorphic and checked by the use case, not by an association.
  OrganizationModel.hasMany(AttachmentModel, { foreignKey: 'organizationId', as: 'attachments' });
  AttachmentModel.belongsTo(OrganizationModel, { foreignKey: 'organizationId', as: 'organization' });
  UserModel.hasMany(AttachmentModel, { foreignKey: 'uploadedById', as: 'uploads' });
  AttachmentModel.belongsTo(UserModel, { foreignKey: 'uploadedById', as: 'uploadedBy' });
  SiteModel.hasMany(IncidentModel, { foreignKey: 'siteId', as: 'incidents' });
  IncidentModel.belongsTo(SiteModel, { foreignKey: 'siteId', as: 'site' });
  IncidentModel.belongsTo(UserModel, { foreignKey: 'openedById', as: 'openedBy' });
  IncidentModel.hasMany(IncidentEntryModel, { foreignKey: 'incidentId', as: 'entries' });
  IncidentEntryModel.belongsTo(IncidentModel, { foreignKey: 'incidentId', as: 'incident' });
  IncidentEntryModel.belongsTo(UserModel, { foreignKey: 'actorId', as: 'actor' });
}

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
import type { AttachmentContentType, AttachmentKind, AttachmentOwnerType } from '@/shared/schemas/attachment';
import type { OrganizationModel } from './organization';
import type { UserModel } from './user';

/** A photo or document kept with a post, a site or a plan; the bytes are in the file store under `storeKey`. */
export class AttachmentModel extends Model<InferAttributes<AttachmentModel>, InferCreationAttributes<AttachmentModel>> {
  declare id: CreationOptional<string>;
  declare organizationId: ForeignKey<OrganizationModel['id']>;
  declare ownerType: AttachmentOwnerType;
  /** A post, site or plan id (no foreign key: the owner is polymorphic). */
  declare ownerId: string;
  declare kind: AttachmentKind;
  declare originalName: string;
  /** As sniffed from the bytes. */
  declare contentType: AttachmentContentType;
  declare bytes: number;
  declare sha256: string;
  declare storeKey: string;
  declare widthPx: number | null;
  declare heightPx: number | null;
  /** Degrees clockwise from true north; photos only. */
  declare bearingDeg: number | null;
  declare caption: CreationOptional<string>;
  declare uploadedById: ForeignKey<UserModel['id']>;
  declare version: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare uploadedBy?: NonAttribute<UserModel>;

  static register(sequelize: Sequelize) {
    AttachmentModel.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        ownerType: { type: DataTypes.STRING(8), allowNull: false },
        ownerId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.STRING(16), allowNull: false },
        originalName: { type: DataTypes.STRING(255), allowNull: false },
        contentType: { type: DataTypes.STRING(64), allowNull: false },
        bytes: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        storeKey: { type: DataTypes.STRING(64), allowNull: false },
        widthPx: { type: DataTypes.INTEGER, allowNull: true },
        heightPx: { type: DataTypes.INTEGER, allowNull: true },
        bearingDeg: { type: DataTypes.DOUBLE, allowNull: true },
        caption: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deletedAt: DataTypes.DATE,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'attachments', paranoid: true },
    );
  }
}

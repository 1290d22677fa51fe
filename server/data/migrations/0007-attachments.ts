import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Attachments: photos and documents kept with a post, a site or a plan. The
 * bytes live in the file store under `store_key`; this row is their metadata.
 * The owner is polymorphic (owner_type + owner_id), so it has no foreign key;
 * the use case checks it exists in the caller's organisation. Deletes are soft
 * (plan revisions may refer to an attachment), and the bytes are kept.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('attachments', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    owner_type: { type: DataTypes.STRING(8), allowNull: false },
    owner_id: { type: DataTypes.UUID, allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    original_name: { type: DataTypes.STRING(255), allowNull: false },
    content_type: { type: DataTypes.STRING(64), allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    store_key: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    width_px: { type: DataTypes.INTEGER, allowNull: true },
    height_px: { type: DataTypes.INTEGER, allowNull: true },
    bearing_deg: { type: DataTypes.DOUBLE, allowNull: true },
    caption: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    uploaded_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    deleted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(`
    ALTER TABLE attachments
      ADD CONSTRAINT attachments_owner_type_check CHECK (owner_type IN ('post','site','plan')),
      ADD CONSTRAINT attachments_kind_check CHECK (kind IN ('photo','document')),
      ADD CONSTRAINT attachments_bytes_check CHECK (bytes >= 0),
      ADD CONSTRAINT attachments_sha256_check CHECK (sha256 ~ '^[0-9a-f]{64}$'),
      ADD CONSTRAINT attachments_bearing_check CHECK (bearing_deg IS NULL OR (bearing_deg >= 0 AND bearing_deg <= 360)),
      ADD CONSTRAINT attachments_size_check CHECK ((width_px IS NULL) = (height_px IS NULL) AND (width_px IS NULL OR (width_px > 0 AND height_px > 0))),
      ADD CONSTRAINT attachments_photo_bearing_check CHECK (kind = 'photo' OR bearing_deg IS NULL)
  `);
  await qi.sequelize.query(
    'CREATE INDEX attachments_owner ON attachments (organization_id, owner_type, owner_id, created_at) WHERE deleted_at IS NULL',
  );
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('attachments');
};

import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Incidents (a smoke, a light, a vessel … being fixed from a site's posts)
 * and their log. The log is append-only and tamper-evident: each entry
 * carries the sha256 of the previous entry's hash and its own content, and
 * the database refuses to change or remove an entry. The incident row keeps
 * the title and status for lists; every change to it is also a log entry.
 * A report's idempotency key is unique per incident, so a report sent twice
 * (a phone retrying after the network came back) is stored once.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('incidents', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    site_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'RESTRICT' },
    title: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'open' },
    opened_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' } },
    opened_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    closed_at: { type: DataTypes.DATE, allowNull: true },
    entry_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    last_hash: { type: DataTypes.STRING(64), allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query("ALTER TABLE incidents ADD CONSTRAINT incidents_status CHECK (status IN ('open', 'closed'))");
  await qi.addIndex('incidents', ['organization_id', 'site_id', 'opened_at']);

  await qi.createTable('incident_entries', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    organization_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'organizations', key: 'id' } },
    incident_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'incidents', key: 'id' },
      onDelete: 'RESTRICT',
    },
    seq: { type: DataTypes.INTEGER, allowNull: false },
    kind: { type: DataTypes.STRING(20), allowNull: false },
    actor_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' } },
    recorded_at: { type: DataTypes.DATE, allowNull: false },
    body: { type: DataTypes.JSONB, allowNull: false },
    idempotency_key: { type: DataTypes.STRING(100), allowNull: true },
    prev_hash: { type: DataTypes.STRING(64), allowNull: true },
    hash: { type: DataTypes.STRING(64), allowNull: false },
  });
  await qi.sequelize.query(`
    ALTER TABLE incident_entries ADD CONSTRAINT incident_entries_seq UNIQUE (incident_id, seq);
    ALTER TABLE incident_entries ADD CONSTRAINT incident_entries_kind
      CHECK (kind IN ('opened', 'updated', 'report', 'fix', 'closed', 'reopened'));
    CREATE UNIQUE INDEX incident_entries_idempotency ON incident_entries (incident_id, idempotency_key)
      WHERE idempotency_key IS NOT NULL;
    CREATE FUNCTION incident_entries_frozen() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'incident log entries cannot be changed'; END $$;
    CREATE TRIGGER incident_entries_frozen BEFORE UPDATE OR DELETE ON incident_entries
      FOR EACH ROW EXECUTE FUNCTION incident_entries_frozen();
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(
    'DROP TRIGGER IF EXISTS incident_entries_frozen ON incident_entries; DROP FUNCTION IF EXISTS incident_entries_frozen()',
  );
  await qi.dropTable('incident_entries');
  await qi.dropTable('incidents');
};

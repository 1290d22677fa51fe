import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Server-side session ends. A per-user session generation, sealed into the
 * session cookie at sign-in and compared on every request: bumping it (sign out
 * everywhere, a new password, a role change, deactivation) ends every cookie
 * issued before. Signing out ends one session: its nonce is kept in
 * `ended_sessions` until the cookie would have expired anyway.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('users', 'session_generation', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  await qi.createTable('ended_sessions', {
    nonce: { type: DataTypes.STRING(64), primaryKey: true },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    expires_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('ended_sessions', ['expires_at']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('ended_sessions');
  await qi.removeColumn('users', 'session_generation');
};

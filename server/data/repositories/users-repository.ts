import { literal, Op, type Transaction } from 'sequelize';
import type { ManagedUser, Role, User } from '@/shared/schemas/auth';
import type { UnitSystem } from '@/shared/units/unit-systems';
import { OrganizationModel, UserModel } from '../models';
import { announceSessionsEnded } from '../session-notices';

/** What sign-in needs to know about an account. */
export interface Credentials {
  user: User;
  passwordHash: string | null;
  active: boolean;
  sessionGeneration: number;
}

/** The person's unit system when they chose one (left out otherwise: each site's default applies). */
const ownUnits = (unitPreference: User['unitPreference']) => (unitPreference ? { unitPreference } : {});

function toUser(row: UserModel): User {
  const org = row.organization;
  if (!org) throw new Error('users-repository: organization not loaded');
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    organization: { id: org.id, name: org.name },
    ...ownUnits(row.unitPreference),
  };
}

function toManaged(row: UserModel): ManagedUser {
  const status = !row.active ? 'deactivated' : row.passwordHash ? 'active' : 'invited';
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    status,
    lastSignInAt: row.lastSignInAt ? row.lastSignInAt.toISOString() : null,
    version: row.version,
  };
}

const withOrg = { include: [{ model: OrganizationModel, as: 'organization' }] };

export const usersRepository = {
  async credentialsByEmail(email: string): Promise<Credentials | null> {
    const row = await UserModel.findOne({ where: { email }, ...withOrg });
    return row
      ? { user: toUser(row), passwordHash: row.passwordHash, active: row.active, sessionGeneration: row.sessionGeneration }
      : null;
  },

  /**
   * The signed-in user, or null when the account is gone or deactivated. Runs
   * on every authenticated request, so it reads plain rows (no model instances).
   */
  async activeById(
    id: string,
    sessionNonce?: string,
  ): Promise<(User & { sessionGeneration: number; sessionEnded?: boolean }) | null> {
    const ended = sessionNonce
      ? [
          [
            literal(`EXISTS (SELECT 1 FROM ended_sessions WHERE nonce = ${UserModel.sequelize!.escape(sessionNonce)})`),
            'sessionEnded',
          ] as const,
        ]
      : [];
    const row = (await UserModel.findOne({
      where: { id, active: true },
      attributes: ['id', 'email', 'name', 'role', 'unitPreference', 'sessionGeneration', ...ended],
      include: [{ model: OrganizationModel, as: 'organization', attributes: ['id', 'name'] }],
      raw: true,
      nest: true,
    })) as unknown as
      | (Pick<User, 'id' | 'email' | 'name' | 'role' | 'unitPreference'> & {
          organization: User['organization'];
          sessionGeneration: number;
          sessionEnded?: boolean;
        })
      | null;
    return row
      ? {
          id: row.id,
          email: row.email,
          name: row.name,
          role: row.role,
          organization: { id: row.organization.id, name: row.organization.name },
          ...ownUnits(row.unitPreference),
          sessionGeneration: row.sessionGeneration,
          sessionEnded: row.sessionEnded === true,
        }
      : null;
  },

  /**
   * Sets the person's own unit system (null = each site's default); returns
   * the previous one, or undefined when the account is gone. A personal
   * setting, not an edit of the account: no version bump.
   */
  async setUnitPreference(
    id: string,
    unitPreference: UnitSystem | null,
    transaction: Transaction,
  ): Promise<UnitSystem | null | undefined> {
    const row = await UserModel.findOne({ where: { id }, attributes: ['id', 'unitPreference'], transaction, lock: true });
    if (!row) return undefined;
    await UserModel.update({ unitPreference }, { where: { id }, transaction, silent: true });
    // Every process forgets its cached copy of this person (the cached row carries the preference).
    await announceSessionsEnded(UserModel.sequelize!, id, transaction);
    return row.unitPreference ?? null;
  },

  /** Ends one session (by its cookie's nonce) until `expiresAt`, when its cookie has lapsed anyway. */
  async endSession(userId: string, nonce: string, expiresAt: Date): Promise<void> {
    const db = UserModel.sequelize!;
    await db.query('DELETE FROM ended_sessions WHERE expires_at < now()');
    await db.query(
      'INSERT INTO ended_sessions (nonce, user_id, expires_at) VALUES (:nonce, :userId, :expiresAt) ON CONFLICT DO NOTHING',
      { replacements: { nonce, userId, expiresAt } },
    );
    await announceSessionsEnded(db, userId);
  },

  /** Ends every session of the user issued so far (their cookies carry an older generation). */
  async endSessions(id: string, transaction?: Transaction): Promise<void> {
    // Not an edit of the account: no version bump, no updatedAt.
    await UserModel.increment({ sessionGeneration: 1 }, { where: { id }, transaction, silent: true });
    // Every API process forgets the user's cached sessions when this commits.
    await announceSessionsEnded(UserModel.sequelize!, id, transaction);
  },

  /** Every e-mail address of the organisation's accounts (any status). */
  async emailsInOrganization(organizationId: string): Promise<string[]> {
    const rows = await UserModel.findAll({ where: { organizationId }, attributes: ['email'], raw: true });
    return rows.map((r) => r.email);
  },

  async recordSignIn(id: string, at: Date): Promise<void> {
    // A plain UPDATE: signing in is not an edit and must not bump the row's version.
    await UserModel.update({ lastSignInAt: at }, { where: { id }, silent: true });
  },

  async pageInOrganization(organizationId: string, page: number, pageSize: number) {
    const { rows, count } = await UserModel.findAndCountAll({
      where: { organizationId },
      order: [
        ['name', 'ASC'],
        ['id', 'ASC'],
      ],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    });
    return { items: rows.map(toManaged), total: count, page, pageSize };
  },

  async listInOrganization(organizationId: string): Promise<ManagedUser[]> {
    const rows = await UserModel.findAll({ where: { organizationId }, order: [['name', 'ASC']] });
    return rows.map(toManaged);
  },

  async findInOrganization(organizationId: string, id: string, transaction?: Transaction): Promise<ManagedUser | null> {
    const row = await UserModel.findOne({ where: { id, organizationId }, transaction });
    return row ? toManaged(row) : null;
  },

  async emailExists(email: string, transaction?: Transaction): Promise<boolean> {
    return (await UserModel.count({ where: { email }, transaction })) > 0;
  },

  async countActiveAdmins(organizationId: string, exceptId: string, transaction?: Transaction): Promise<number> {
    return UserModel.count({
      where: { organizationId, role: 'admin', active: true, id: { [Op.ne]: exceptId } },
      transaction,
    });
  },

  async createInvited(
    input: { organizationId: string; email: string; name: string; role: Role; inviteTokenHash: string; inviteExpiresAt: Date },
    transaction?: Transaction,
  ): Promise<ManagedUser> {
    const row = await UserModel.create({ ...input, passwordHash: null, lastSignInAt: null }, { transaction });
    return toManaged(row);
  },

  /**
   * Applies `changes` if the row still has `expectedVersion`; returns null when
   * another edit got there first.
   */
  async updateIfVersion(
    organizationId: string,
    id: string,
    expectedVersion: number,
    changes: { role?: Role; active?: boolean },
    transaction?: Transaction,
  ): Promise<ManagedUser | null> {
    const [count, rows] = await UserModel.update(
      { ...changes, version: expectedVersion + 1 },
      { where: { id, organizationId, version: expectedVersion }, returning: true, transaction },
    );
    const row = rows[0];
    return count === 1 && row ? toManaged(row) : null;
  },

  async findByInviteToken(tokenHash: string, transaction?: Transaction) {
    const row = await UserModel.findOne({ where: { inviteTokenHash: tokenHash, active: true }, transaction });
    return row ? { id: row.id, expiresAt: row.inviteExpiresAt } : null;
  },

  async setPassword(id: string, passwordHash: string, transaction?: Transaction): Promise<void> {
    await UserModel.update({ passwordHash, inviteTokenHash: null, inviteExpiresAt: null }, { where: { id }, transaction });
  },
};

import { Op, type Transaction } from 'sequelize';
import type { ManagedUser, Role, User } from '@/shared/schemas/auth';
import { OrganizationModel, UserModel } from '../models';

/** What sign-in needs to know about an account. */
export interface Credentials {
  user: User;
  passwordHash: string | null;
  active: boolean;
}

function toUser(row: UserModel): User {
  const org = row.organization;
  if (!org) throw new Error('users-repository: organization not loaded');
  return { id: row.id, email: row.email, name: row.name, role: row.role, organization: { id: org.id, name: org.name } };
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
    return row ? { user: toUser(row), passwordHash: row.passwordHash, active: row.active } : null;
  },

  /**
   * The signed-in user, or null when the account is gone or deactivated. Runs
   * on every authenticated request, so it reads plain rows (no model instances).
   */
  async activeById(id: string): Promise<User | null> {
    const row = (await UserModel.findOne({
      where: { id, active: true },
      attributes: ['id', 'email', 'name', 'role'],
      include: [{ model: OrganizationModel, as: 'organization', attributes: ['id', 'name'] }],
      raw: true,
      nest: true,
    })) as unknown as (Pick<User, 'id' | 'email' | 'name' | 'role'> & { organization: User['organization'] }) | null;
    return row
      ? {
          id: row.id,
          email: row.email,
          name: row.name,
          role: row.role,
          organization: { id: row.organization.id, name: row.organization.name },
        }
      : null;
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

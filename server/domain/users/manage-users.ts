import { createHash, randomBytes } from 'node:crypto';
import type { InviteUserRequest, ManagedUser, MeUpdate, UpdateUserRequest, User } from '@/shared/schemas/auth';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { usersRepository } from '@/server/data/repositories/users-repository';
import { AppError } from '@/server/domain/app-error';
import { hashPassword } from '../auth/passwords';
import type { Actor } from '../actor';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import { staleMessage } from '@/server/domain/audit/versioned-write';

const INVITE_DAYS = 7;

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

export function listUsers(actor: Actor, page: number, pageSize: number) {
  return usersRepository.pageInOrganization(actor.organizationId, page, pageSize);
}

/** Creates an invited account and returns the one-time token for its set-password link. */
export async function inviteUser(
  { db }: UseCaseDeps,
  actor: Actor,
  input: InviteUserRequest,
): Promise<{ user: ManagedUser; token: string }> {
  const token = randomBytes(24).toString('base64url');
  const user = await db.transaction(async (transaction) => {
    if (await usersRepository.emailExists(input.email, transaction)) {
      throw new AppError(409, 'email_taken', 'An account with this e-mail address already exists.', {
        email: 'Already in use.',
      });
    }
    const invited = await usersRepository.createInvited(
      {
        ...input,
        organizationId: actor.organizationId,
        inviteTokenHash: hashToken(token),
        inviteExpiresAt: new Date(Date.now() + INVITE_DAYS * 86_400_000),
      },
      transaction,
    );
    // Never the token: the audit trail is readable by people who must not use the link.
    await auditRepository.record(
      actor,
      {
        action: 'invite',
        entityType: 'user',
        entityId: invited.id,
        after: { email: invited.email, name: invited.name, role: invited.role },
      },
      transaction,
    );
    return invited;
  });
  return { user, token };
}

/** Changes role or active state, refusing stale versions and the last active admin. */
export async function updateUser({ db }: UseCaseDeps, actor: Actor, id: string, input: UpdateUserRequest): Promise<ManagedUser> {
  return db.transaction(async (transaction) => {
    const current = await usersRepository.findInOrganization(actor.organizationId, id, transaction);
    if (!current) throw AppError.notFound('That user');
    const demotes = (input.role !== undefined && input.role !== 'admin') || input.active === false;
    if (current.role === 'admin' && demotes) {
      const others = await usersRepository.countActiveAdmins(actor.organizationId, id, transaction);
      if (others === 0) {
        throw AppError.conflict('An organisation needs at least one active administrator.', 'last_admin');
      }
    }
    const { version, ...changes } = input;
    const updated = await usersRepository.updateIfVersion(actor.organizationId, id, version, changes, transaction);
    if (!updated) {
      throw AppError.conflict(staleMessage('this user'), 'stale_version');
    }
    // A new role or a deactivation takes effect on the person's open sessions too: they sign in again.
    const roleChanged = changes.role !== undefined && changes.role !== current.role;
    const activeChanged = changes.active !== undefined && changes.active !== (current.status !== 'deactivated');
    if (roleChanged || activeChanged) await usersRepository.endSessions(id, transaction);
    if (roleChanged) {
      await auditRepository.record(
        actor,
        {
          action: 'change-role',
          entityType: 'user',
          entityId: id,
          before: { role: current.role },
          after: { role: updated.role },
        },
        transaction,
      );
    }
    if (activeChanged) {
      await auditRepository.record(
        actor,
        {
          action: changes.active ? 'reactivate' : 'deactivate',
          entityType: 'user',
          entityId: id,
          before: { status: current.status },
          after: { status: updated.status },
        },
        transaction,
      );
    }
    return updated;
  });
}

/** Redeems a set-password link. */
export async function setPasswordWithToken({ db }: UseCaseDeps, token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await db.transaction(async (transaction) => {
    const found = await usersRepository.findByInviteToken(hashToken(token), transaction);
    if (!found || !found.expiresAt || found.expiresAt.getTime() < Date.now()) {
      throw new AppError(
        400,
        'invalid_token',
        'This link has expired or was already used. Ask your administrator for a new one.',
      );
    }
    await usersRepository.setPassword(found.id, passwordHash, transaction);
    await usersRepository.endSessions(found.id, transaction);
  });
}

/**
 * The signed-in person's own settings (`PATCH /me`): their unit system, or
 * null to follow each site's default units. Recorded in the audit trail.
 */
export async function updateOwnSettings({ db }: UseCaseDeps, actor: Actor, user: User, input: MeUpdate): Promise<User> {
  return db.transaction(async (transaction) => {
    const before = await usersRepository.setUnitPreference(actor.userId, input.unitPreference, transaction);
    if (before === undefined) throw AppError.notFound('That user');
    if (before !== input.unitPreference) {
      await auditRepository.record(
        actor,
        {
          action: 'set-unit-preference',
          entityType: 'user',
          entityId: actor.userId,
          before: { unitPreference: before },
          after: { unitPreference: input.unitPreference },
        },
        transaction,
      );
    }
    return { ...user, unitPreference: input.unitPreference };
  });
}

import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { ManagedUser } from '@/shared/schemas/auth';
import { useSession } from '@/components/data/session';
import { useUpdateUser } from '@/components/data/users';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError } from '@/components/ui/states';
import { colors, radius, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { RolePicker } from './role-picker';

const COLUMN_FLEX = [2.2, 5, 1.4, 1.8, 2];

const STATUS_LABEL = { active: 'Active', invited: 'Invited', deactivated: 'Deactivated' } as const;

type Changes = { role?: ManagedUser['role']; active?: boolean };

/** What each role may do, for the confirmation of a role change. */
const ROLE_POWERS: Record<ManagedUser['role'], string> = {
  admin: 'invite people, change roles and deactivate accounts',
  planner: 'prepare sites, posts, plans and watches and submit plans for review',
  reviewer: 'approve and return plans other people submitted',
  observer: 'read sites and approved plans, without changing anything',
};

const article = (word: string) => (/^[aeiou]/i.test(word) ? 'an' : 'a');

/** The dialog's words for a role change or a deactivation. */
function confirmText(u: ManagedUser, changes: Changes) {
  if (changes.role) {
    const to = changes.role;
    return {
      title: `Make ${u.name} ${article(to)} ${to}?`,
      consequence:
        `${u.name} is ${article(u.role)} ${u.role} now. As ${article(to)} ${to} they can ${ROLE_POWERS[to]}. ` +
        'The change applies from their next step in Kenning.',
      confirmLabel: `Make ${to}`,
      tone: 'primary' as const,
    };
  }
  return {
    title: `Deactivate ${u.name}?`,
    consequence:
      `${u.name} (${u.email}) is signed out at once and can no longer sign in. Their plans, reviews and watches stay on record. ` +
      'You can reactivate the account later.',
    confirmLabel: 'Deactivate',
    tone: 'danger' as const,
  };
}

/** A table on wide screens, cards on phones. */
export function UserTable({ users }: { users: ManagedUser[] }) {
  const { wide } = useLayout();
  const update = useUpdateUser();
  const { data: me } = useSession();
  const [error, setError] = useState('');
  const [pending, setPending] = useState<{ user: ManagedUser; changes: Changes } | null>(null);
  const change = (u: ManagedUser, changes: Changes) => {
    setError('');
    update.mutate(
      { id: u.id, version: u.version, ...changes },
      { onSuccess: () => setPending(null), onError: (e) => setError(e.message) },
    );
  };
  // Changing a role and deactivating are asked first; reactivating gives back what was there.
  const ask = (u: ManagedUser, changes: Changes) => {
    setError('');
    if (changes.active === true) change(u, changes);
    else setPending({ user: u, changes });
  };

  // Nobody deactivates themselves; the server also keeps the last active admin.
  const activeToggle = (u: ManagedUser) =>
    u.id === me?.id ? null : (
      <Button
        kind="secondary"
        label={u.status === 'deactivated' ? 'Reactivate' : 'Deactivate'}
        onPress={() => ask(u, { active: u.status === 'deactivated' })}
      />
    );

  return (
    <View style={{ gap: space.md }}>
      <FormError message={error} />
      {pending ? (
        <ConfirmDialog
          visible
          {...confirmText(pending.user, pending.changes)}
          busy={update.isPending}
          error={error}
          onConfirm={() => change(pending.user, pending.changes)}
          onCancel={() => {
            setPending(null);
            setError('');
          }}
        />
      ) : null}
      {wide ? (
        <View style={styles.table} role="table" aria-label="Users">
          <View style={[styles.tr, styles.th]} role="row">
            {['Name', 'Role', 'Status', 'Last sign-in', ''].map((h, i) => (
              <AppText key={i} variant="label" tone="muted" role="columnheader" style={[styles.td, { flex: COLUMN_FLEX[i] }]}>
                {h}
              </AppText>
            ))}
          </View>
          {users.map((u) => (
            <View key={u.id} style={styles.tr} role="row">
              <View style={styles.td} role="cell">
                <AppText variant="label">{u.name}</AppText>
                <AppText variant="small" tone="muted">
                  {u.email}
                </AppText>
              </View>
              <View style={[styles.td, { flex: COLUMN_FLEX[1] }]} role="cell">
                <RolePicker
                  label={`Role of ${u.name}`}
                  value={u.role}
                  disabled={update.isPending || u.id === me?.id}
                  onChange={(role) => role !== u.role && ask(u, { role })}
                />
              </View>
              <AppText style={[styles.td, { flex: COLUMN_FLEX[2] }]} role="cell">
                {STATUS_LABEL[u.status]}
              </AppText>
              <AppText style={styles.td} role="cell" tone="muted">
                {u.lastSignInAt ? new Date(u.lastSignInAt).toLocaleString() : 'never'}
              </AppText>
              <View style={styles.td} role="cell">
                {activeToggle(u)}
              </View>
            </View>
          ))}
        </View>
      ) : (
        users.map((u) => (
          <Card key={u.id} aria-label={u.name}>
            <View>
              <AppText variant="heading">{u.name}</AppText>
              <AppText variant="small" tone="muted">
                {u.email} · {STATUS_LABEL[u.status]}
              </AppText>
            </View>
            <RolePicker
              label={`Role of ${u.name}`}
              value={u.role}
              disabled={update.isPending || u.id === me?.id}
              onChange={(role) => role !== u.role && ask(u, { role })}
            />
            {activeToggle(u)}
          </Card>
        ))
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  table: {
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    overflow: 'hidden',
  },
  tr: {
    flexDirection: 'row',
    alignItems: 'center',
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
    paddingVertical: space.sm,
  },
  th: { backgroundColor: colors.paper },
  td: { flex: 2, paddingHorizontal: space.sm },
});

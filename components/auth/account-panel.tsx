import { View } from 'react-native';
import { ROLE_LABELS } from '@/shared/schemas/auth';
import { useSession, useSignOut, useSignOutEverywhere } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SignOutIcon } from '@/components/ui/icons';
import { Screen } from '@/components/ui/screen';
import { colors, space } from '@/components/ui/theme';

export function AccountPanel() {
  const { data: user } = useSession();
  const signOut = useSignOut();
  const everywhere = useSignOutEverywhere();
  if (!user) return null;
  const rows: [string, string][] = [
    ['Name', user.name],
    ['E-mail', user.email],
    ['Role', ROLE_LABELS[user.role]],
    ['Organisation', user.organization.name],
  ];
  return (
    <Screen title="Account" maxWidth={640}>
      <Card accent="ember">
        {rows.map(([k, v]) => (
          <View key={k} style={{ gap: 2 }}>
            <AppText variant="label" tone="muted">
              {k}
            </AppText>
            <AppText>{v}</AppText>
          </View>
        ))}
      </Card>
      <Button
        kind="secondary"
        label="Sign out"
        icon={<SignOutIcon color={colors.ink} size={20} />}
        busy={signOut.isPending}
        onPress={() => signOut.mutate()}
        style={{ alignSelf: 'flex-start' }}
      />
      <View style={{ gap: space.xs }}>
        <Button
          kind="secondary"
          label="Sign out everywhere"
          busy={everywhere.isPending}
          onPress={() => everywhere.mutate()}
          style={{ alignSelf: 'flex-start' }}
        />
        <AppText variant="small" tone="muted">
          Ends every session of this account, on other computers and phones too — for a lost phone or a shared computer.
        </AppText>
        {everywhere.isError ? (
          <AppText variant="small" tone="danger">
            Could not sign out everywhere. Try again.
          </AppText>
        ) : null}
      </View>
      <AppText variant="small" tone="muted" style={{ marginTop: space.lg }}>
        Kenning gives estimates for planning. Follow your agency's procedures and local regulations.
      </AppText>
    </Screen>
  );
}

import { View } from 'react-native';
import { useUsers } from '@/components/data/users';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { InviteUserForm } from './invite-user-form';
import { UserTable } from './user-table';

export function UserAdmin() {
  const users = useUsers();
  const { wide } = useLayout();
  return (
    <Screen title="Users" subtitle="People in your organisation, their roles and whether they can sign in.">
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        <View style={{ flex: wide ? 2 : undefined, width: wide ? undefined : '100%' }}>
          {users.isPending ? (
            <LoadingState label="Loading users…" />
          ) : users.isError ? (
            <ErrorState error={users.error} onRetry={() => void users.refetch()} />
          ) : (
            <UserTable users={users.data} />
          )}
        </View>
        <View style={{ flex: wide ? 1 : undefined, width: wide ? undefined : '100%' }}>
          <InviteUserForm />
        </View>
      </View>
    </Screen>
  );
}

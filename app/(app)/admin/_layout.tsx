import { Slot } from 'expo-router';
import { useSession } from '@/components/data/session';
import { Screen } from '@/components/ui/screen';
import { Notice } from '@/components/ui/states';
import { AppText } from '@/components/ui/app-text';

/** Administration is for administrators only; the server enforces the same rule. */
export default function AdminLayout() {
  const { data: user } = useSession();
  if (user?.role !== 'admin') {
    return (
      <Screen title="Administration">
        <Notice tone="danger" title="Not available to your role">
          <AppText>Only an administrator of your organisation can manage users and read the organisation's mail.</AppText>
        </Notice>
      </Screen>
    );
  }
  return <Slot />;
}

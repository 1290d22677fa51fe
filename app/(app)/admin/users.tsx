import { UserAdmin } from '@/components/admin/user-admin';

export default function UsersScreen() {
  return <UserAdmin />;
}

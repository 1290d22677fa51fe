import { AccountPanel } from '@/components/auth/account-panel';

export default function AccountScreen() {
  return <AccountPanel />;
}

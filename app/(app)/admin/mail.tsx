import { CaughtMailList } from '@/components/admin/caught-mail-list';

export default function MailScreen() {
  return <CaughtMailList />;
}

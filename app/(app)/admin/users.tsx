import { UserAdmin } from '@/components/admin/user-admin';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

function UsersScreenContent() {
  return <UserAdmin />;
}

/** The tab's title until the page below names itself more precisely. */
export default function UsersScreen() {
  return (
    <>
      <PageTitle title={documentTitle('People and roles')} />
      <UsersScreenContent />
    </>
  );
}

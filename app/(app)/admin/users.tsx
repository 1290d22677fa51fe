import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const UserAdmin = deferredScreen('UserAdmin');

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

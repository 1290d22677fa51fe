import { deferredScreen } from '@/components/shell/deferred-screen';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

const AccountPanel = deferredScreen('AccountPanel');

function AccountScreenContent() {
  return <AccountPanel />;
}

/** The tab's title until the page below names itself more precisely. */
export default function AccountScreen() {
  return (
    <>
      <PageTitle title={documentTitle('Your account')} />
      <AccountScreenContent />
    </>
  );
}

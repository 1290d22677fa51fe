import { AccountPanel } from '@/components/auth/account-panel';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

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

import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const CaughtMailList = deferredScreen('CaughtMailList');

function MailScreenContent() {
  return <CaughtMailList />;
}

/** The tab's title until the page below names itself more precisely. */
export default function MailScreen() {
  return (
    <>
      <PageTitle title={documentTitle('Caught mail')} />
      <MailScreenContent />
    </>
  );
}

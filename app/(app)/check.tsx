import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const QuickCheck = deferredScreen('QuickCheck');

function QuickCheckScreenContent() {
  return <QuickCheck />;
}

/** The tab's title until the page below names itself more precisely. */
export default function QuickCheckScreen() {
  return (
    <>
      <PageTitle title={documentTitle('Quick check')} />
      <QuickCheckScreenContent />
    </>
  );
}

import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const LibraryScreen = deferredScreen('LibraryScreen');

function LibraryRouteContent() {
  return <LibraryScreen />;
}

/** The tab's title until the page below names itself more precisely. */
export default function LibraryRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Library')} />
      <LibraryRouteContent />
    </>
  );
}

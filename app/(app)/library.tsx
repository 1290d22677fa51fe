import { LibraryScreen } from '@/components/library/library-screen';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

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

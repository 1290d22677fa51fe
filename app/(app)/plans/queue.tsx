import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const ReviewQueue = deferredScreen('ReviewQueue');

function ReviewQueueRouteContent() {
  return <ReviewQueue />;
}

/** The tab's title until the page below names itself more precisely. */
export default function ReviewQueueRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Review queue')} />
      <ReviewQueueRouteContent />
    </>
  );
}

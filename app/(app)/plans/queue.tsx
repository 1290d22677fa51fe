import { ReviewQueue } from '@/components/plans/review-queue';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

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

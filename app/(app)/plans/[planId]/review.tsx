import { usePlanId } from '@/components/plans/use-plan-id';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const ReviewPanel = deferredScreen('ReviewPanel');

function ReviewRouteContent() {
  const planId = usePlanId();
  return planId ? <ReviewPanel planId={planId} /> : <BadAddress title="Review" what="a plan" />;
}

/** The tab's title until the page below names itself more precisely. */
export default function ReviewRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Review a plan')} />
      <ReviewRouteContent />
    </>
  );
}

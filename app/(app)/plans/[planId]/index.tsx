import { usePlanId } from '@/components/plans/use-plan-id';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const PlanOverview = deferredScreen('PlanOverview');

function PlanRouteContent() {
  const planId = usePlanId();
  return planId ? <PlanOverview planId={planId} /> : <BadAddress title="Plan" what="a plan" />;
}

/** The tab's title until the page below names itself more precisely. */
export default function PlanRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Plan')} />
      <PlanRouteContent />
    </>
  );
}

import { PlanOverview } from '@/components/plans/plan-overview';
import { usePlanId } from '@/components/plans/use-plan-id';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

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

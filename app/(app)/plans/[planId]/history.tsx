import { usePlanId } from '@/components/plans/use-plan-id';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const PlanHistory = deferredScreen('PlanHistory');

function PlanHistoryRouteContent() {
  const planId = usePlanId();
  return planId ? <PlanHistory planId={planId} /> : <BadAddress title="History" what="a plan" />;
}

/** The tab's title until the page below names itself more precisely. */
export default function PlanHistoryRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Plan history')} />
      <PlanHistoryRouteContent />
    </>
  );
}

import { usePlanId } from '@/components/plans/use-plan-id';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const EditPlanScreen = deferredScreen('EditPlanScreen');

function EditPlanRouteContent() {
  const planId = usePlanId();
  return planId ? <EditPlanScreen planId={planId} /> : <BadAddress title="Edit plan" what="a plan" />;
}

/** The tab's title until the page below names itself more precisely. */
export default function EditPlanRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Edit plan')} />
      <EditPlanRouteContent />
    </>
  );
}

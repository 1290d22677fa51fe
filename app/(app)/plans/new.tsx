import { useIdParams } from '@/components/data/route-params';
import { Screen } from '@/components/ui/screen';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const PlanEditor = deferredScreen('PlanEditor');

function NewPlanRouteContent() {
  // A wrong site id in the address is left out: the editor then asks for the site.
  const siteId = useIdParams([], ['siteId'])?.siteId;
  return (
    <Screen
      title="New coverage plan"
      subtitle="Pick the posts, targets and conditions, and the standard the plan must meet."
      maxWidth={760}
    >
      <PlanEditor siteId={siteId} />
    </Screen>
  );
}

/** The tab's title until the page below names itself more precisely. */
export default function NewPlanRoute() {
  return (
    <>
      <PageTitle title={documentTitle('New coverage plan')} />
      <NewPlanRouteContent />
    </>
  );
}

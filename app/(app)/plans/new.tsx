import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { Screen } from '@/components/ui/screen';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const PlanEditor = deferredScreen('PlanEditor');

const Params = z.object({ siteId: z.uuid().optional().catch(undefined) });

function NewPlanRouteContent() {
  const { siteId } = Params.parse(useLocalSearchParams());
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

import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const PlansScreen = deferredScreen('PlansScreen');

function PlansRouteContent() {
  return <PlansScreen />;
}

/** The tab's title until the page below names itself more precisely. */
export default function PlansRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Plans')} />
      <PlansRouteContent />
    </>
  );
}

import { PlansScreen } from '@/components/plans/plans-screen';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

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

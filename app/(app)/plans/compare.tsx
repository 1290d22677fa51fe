import { useIdParams } from '@/components/data/route-params';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const PlanCompareScreen = deferredScreen('PlanCompareScreen');

function ComparePlansRouteContent() {
  const ids = useIdParams([], ['a', 'b']);
  if (!ids) return <BadAddress title="Compare plans" what="two plans" />;
  return <PlanCompareScreen a={ids.a ?? null} b={ids.b ?? null} />;
}

/** The tab's title until the page below names itself more precisely. */
export default function ComparePlansRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Compare plans')} />
      <ComparePlansRouteContent />
    </>
  );
}

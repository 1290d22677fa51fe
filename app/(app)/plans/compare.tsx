import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const PlanCompareScreen = deferredScreen('PlanCompareScreen');

const Params = z.object({ a: z.uuid().optional(), b: z.uuid().optional() });

function ComparePlansRouteContent() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) return <BadAddress title="Compare plans" what="two plans" />;
  return <PlanCompareScreen a={parsed.data.a ?? null} b={parsed.data.b ?? null} />;
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

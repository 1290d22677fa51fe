import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const SitingScreen = deferredScreen('SitingScreen');

const Params = z.object({ siteId: z.uuid(), runId: z.uuid().optional() });

function SitingRouteContent() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) return <BadAddress title="Tower siting" what="a site" />;
  return <SitingScreen siteId={parsed.data.siteId} runId={parsed.data.runId ?? null} />;
}

/** The tab's title until the page below names itself more precisely. */
export default function SitingRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Tower siting')} />
      <SitingRouteContent />
    </>
  );
}

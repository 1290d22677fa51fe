import { useIdParams } from '@/components/data/route-params';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const SitingScreen = deferredScreen('SitingScreen');

function SitingRouteContent() {
  const ids = useIdParams(['siteId'], ['runId']);
  if (!ids) return <BadAddress title="Tower siting" what="a site" />;
  return <SitingScreen siteId={ids.siteId} runId={ids.runId ?? null} />;
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

import { useIdParams } from '@/components/data/route-params';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const CrewCardScreen = deferredScreen('CrewCardScreen');

function CrewCardRouteContent() {
  const ids = useIdParams(['siteId', 'postId']);
  return ids ? <CrewCardScreen {...ids} /> : <BadAddress title="Crew card" what="a post" />;
}

/** The tab's title until the page below names itself more precisely. */
export default function CrewCardRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Crew card')} />
      <CrewCardRouteContent />
    </>
  );
}

import { useIdParams } from '@/components/data/route-params';
import { BadAddress } from '@/components/ui/bad-address';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const SiteOverview = deferredScreen('SiteOverview');

function SiteScreenContent() {
  const ids = useIdParams(['siteId']);
  if (!ids) {
    return <BadAddress title="Site" what="a site" />;
  }
  return <SiteOverview siteId={ids.siteId} />;
}

/** The tab's title until the page below names itself more precisely. */
export default function SiteScreen() {
  return (
    <>
      <PageTitle title={documentTitle('Site')} />
      <SiteScreenContent />
    </>
  );
}

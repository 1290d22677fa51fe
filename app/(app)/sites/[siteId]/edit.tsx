import { useIdParams } from '@/components/data/route-params';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { BadAddress } from '@/components/ui/bad-address';

const SiteEditScreen = deferredScreen('SiteEditScreen');

export default function EditSiteRoute() {
  const ids = useIdParams(['siteId']);
  if (!ids) {
    return <BadAddress title="Edit site" what="a site" />;
  }
  return <SiteEditScreen siteId={ids.siteId} />;
}

import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const SiteMapRouteContent = deferredScreen('SiteMapRouteContent');

/** The tab's title until the page below names itself more precisely. */
export default function SiteMapRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Site map')} />
      <SiteMapRouteContent />
    </>
  );
}

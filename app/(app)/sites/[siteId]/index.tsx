import { useIdParams } from '@/components/data/route-params';
import { Screen } from '@/components/ui/screen';
import { Notice } from '@/components/ui/states';
import { AppText } from '@/components/ui/app-text';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const SiteOverview = deferredScreen('SiteOverview');

function SiteScreenContent() {
  const ids = useIdParams(['siteId']);
  if (!ids) {
    return (
      <Screen title="Site">
        <Notice tone="danger">
          <AppText>This address does not name a site.</AppText>
        </Notice>
      </Screen>
    );
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

import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { Screen } from '@/components/ui/screen';
import { Notice } from '@/components/ui/states';
import { AppText } from '@/components/ui/app-text';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const SiteOverview = deferredScreen('SiteOverview');

const Params = z.object({ siteId: z.uuid() });

function SiteScreenContent() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) {
    return (
      <Screen title="Site">
        <Notice tone="danger">
          <AppText>This address does not name a site.</AppText>
        </Notice>
      </Screen>
    );
  }
  return <SiteOverview siteId={parsed.data.siteId} />;
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

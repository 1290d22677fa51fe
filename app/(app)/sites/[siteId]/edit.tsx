import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { AppText } from '@/components/ui/app-text';
import { Screen } from '@/components/ui/screen';
import { Notice } from '@/components/ui/states';

const SiteEditScreen = deferredScreen('SiteEditScreen');

const Params = z.object({ siteId: z.uuid() });

export default function EditSiteRoute() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) {
    return (
      <Screen title="Edit site">
        <Notice tone="danger">
          <AppText>This address does not name a site.</AppText>
        </Notice>
      </Screen>
    );
  }
  return <SiteEditScreen siteId={parsed.data.siteId} />;
}

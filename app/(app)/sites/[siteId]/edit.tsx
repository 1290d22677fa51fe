import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { BadAddress } from '@/components/ui/bad-address';

const SiteEditScreen = deferredScreen('SiteEditScreen');

const Params = z.object({ siteId: z.uuid() });

export default function EditSiteRoute() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) {
    return <BadAddress title="Edit site" what="a site" />;
  }
  return <SiteEditScreen siteId={parsed.data.siteId} />;
}

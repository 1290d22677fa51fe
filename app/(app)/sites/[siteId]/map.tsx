import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { SiteMapScreen } from '@/components/map/site-map-screen';
import { AppText } from '@/components/ui/app-text';
import { Screen } from '@/components/ui/screen';
import { Notice } from '@/components/ui/states';

const Params = z.object({ siteId: z.uuid(), postId: z.uuid().optional() });

export default function SiteMapRoute() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) {
    return (
      <Screen title="Map">
        <Notice tone="danger">
          <AppText>This address does not name a site (or names a post wrongly).</AppText>
        </Notice>
      </Screen>
    );
  }
  return <SiteMapScreen siteId={parsed.data.siteId} focusPostId={parsed.data.postId ?? null} />;
}

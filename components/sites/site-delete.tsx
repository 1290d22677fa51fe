import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import type { Site } from '@/shared/schemas/site';
import { ApiRequestError } from '@/components/data/api-client';
import { useDeleteSite } from '@/components/data/sites';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';

/**
 * Deleting a site, asked twice. The server keeps a site that approved plans
 * depend on (409 `site_has_approved_plans`); its reason shows here.
 */
export function SiteDelete({ site }: { site: Site }) {
  const router = useRouter();
  const remove = useDeleteSite(site.id);
  const [asking, setAsking] = useState(false);
  const refused = remove.error instanceof ApiRequestError && remove.error.status === 409 ? remove.error : null;
  return (
    <Card aria-label="Delete this site" style={{ gap: space.sm }}>
      <AppText variant="heading">Delete this site</AppText>
      <AppText tone="muted">
        The site, its posts and its draft plans leave the lists; their history stays. A site that approved plans depend on cannot
        be deleted.
      </AppText>
      {refused ? (
        <Notice tone="danger" title="Not deleted">
          <AppText>{refused.message}</AppText>
        </Notice>
      ) : remove.error ? (
        <Notice tone="danger" title="Not deleted">
          <AppText>{remove.error.message}</AppText>
        </Notice>
      ) : null}
      {asking ? (
        <View style={{ gap: space.sm }}>
          <AppText>Delete “{site.name}”?</AppText>
          <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
            <Button
              kind="danger"
              label="Yes, delete the site"
              busy={remove.isPending}
              onPress={() =>
                // mutateAsync: the screen may unmount this card when the record goes, before a per-call callback ran.
                remove.mutateAsync().then(
                  () => router.replace('/'),
                  () => setAsking(false),
                )
              }
            />
            <Button kind="quiet" label="Keep it" onPress={() => setAsking(false)} />
          </View>
        </View>
      ) : (
        <Button kind="secondary" label="Delete site…" onPress={() => setAsking(true)} style={{ alignSelf: 'flex-start' }} />
      )}
    </Card>
  );
}

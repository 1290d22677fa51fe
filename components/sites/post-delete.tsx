import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import type { Post } from '@/shared/schemas/site';
import { useDeletePost } from '@/components/data/sites';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';

/**
 * Deleting a post, asked twice. The server keeps a post that a submitted or
 * approved plan uses (409 `post_in_frozen_plan`); its reason, naming the
 * plans, shows here.
 */
export function PostDelete({ siteId, post }: { siteId: string; post: Post }) {
  const router = useRouter();
  const remove = useDeletePost(siteId, post.id);
  const [asking, setAsking] = useState(false);
  return (
    <Card aria-label="Delete this post" style={{ gap: space.sm }}>
      <AppText variant="heading">Delete this post</AppText>
      <AppText tone="muted">
        The post leaves the site’s lists and maps; its history and photos stay. A post that a submitted or approved plan uses
        cannot be deleted.
      </AppText>
      {remove.error ? (
        <Notice tone="danger" title="Not deleted">
          <AppText>{remove.error.message}</AppText>
        </Notice>
      ) : null}
      {asking ? (
        <View style={{ gap: space.sm }}>
          <AppText>Delete “{post.name}”?</AppText>
          <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
            <Button
              kind="danger"
              label="Yes, delete the post"
              busy={remove.isPending}
              onPress={() =>
                // mutateAsync: the screen may unmount this card when the record goes, before a per-call callback ran.
                remove.mutateAsync().then(
                  () => router.replace({ pathname: '/sites/[siteId]', params: { siteId } }),
                  () => setAsking(false),
                )
              }
            />
            <Button kind="quiet" label="Keep it" onPress={() => setAsking(false)} />
          </View>
        </View>
      ) : (
        <Button kind="secondary" label="Delete post…" onPress={() => setAsking(true)} style={{ alignSelf: 'flex-start' }} />
      )}
    </Card>
  );
}

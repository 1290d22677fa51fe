import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { SITE_KIND_LABELS } from '@/shared/schemas/site';
import { HistoryLink } from '@/components/audit/history-link';
import { useSession } from '@/components/data/session';
import { useSite, useSitePosts } from '@/components/data/sites';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { PostForm } from './post-form';
import { SitePlans } from './site-plans';
import { SiteLandmarks } from './site-landmarks';
import { SitePosts } from './site-posts';
import { SiteRoster } from './site-roster';
import { SiteSketch } from './site-sketch';
import { TerrainPanel } from './terrain-panel';

export function SiteOverview({ siteId }: { siteId: string }) {
  const site = useSite(siteId);
  const posts = useSitePosts(siteId);
  const { data: user } = useSession();
  const { wide } = useLayout();
  const router = useRouter();
  if (site.isPending) return <LoadingState label="Loading the site…" />;
  if (site.isError) return <ErrorState error={site.error} onRetry={() => void site.refetch()} />;
  const s = site.data;
  const list = posts.data ?? [];
  return (
    <Screen
      title={s.name}
      subtitle={`${SITE_KIND_LABELS[s.kind]} · ${s.timeZone}${s.notes ? ` · ${s.notes}` : ''}`}
      actions={
        <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
          <HistoryLink entityType="site" entityId={siteId} />
          {user?.role === 'planner' ? (
            <Button
              kind="secondary"
              label="Edit site"
              role="link"
              onPress={() => router.navigate({ pathname: '/sites/[siteId]/edit', params: { siteId } })}
            />
          ) : null}
        </View>
      }
    >
      {!s.boundary && user?.role === 'planner' ? (
        <Notice tone="info" title="Next: the boundary">
          <AppText>
            This site has no boundary yet. Edit the site to draw it on the map, type its corners or import a GeoJSON file;
            coverage figures are worked out inside it.
          </AppText>
        </Notice>
      ) : null}
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        <View style={{ flex: wide ? 3 : undefined, width: wide ? undefined : '100%', gap: space.lg }}>
          <Card>
            <SiteSketch site={s} posts={list} />
            <Button
              kind="secondary"
              label="Open the map"
              role="link"
              onPress={() => router.navigate({ pathname: '/sites/[siteId]/map', params: { siteId } })}
              style={{ alignSelf: 'flex-start' }}
            />
            {user?.role === 'planner' || user?.role === 'reviewer' ? (
              <Button
                kind="secondary"
                label="Where to put the next tower"
                role="link"
                onPress={() => router.navigate({ pathname: '/sites/[siteId]/siting', params: { siteId } })}
                style={{ alignSelf: 'flex-start' }}
              />
            ) : null}
          </Card>
          <TerrainPanel site={s} canUpload={user?.role === 'planner'} />
          <AppText variant="heading">Coverage plans</AppText>
          <SitePlans siteId={siteId} />
          <SiteRoster siteId={siteId} timeZone={s.timeZone} />
          <AppText variant="heading">Posts</AppText>
          <SitePosts siteId={siteId} />
          <SiteLandmarks siteId={siteId} canWrite={user?.role === 'planner'} />
        </View>
        {user?.role === 'planner' ? (
          <View style={{ flex: wide ? 2 : undefined, width: wide ? undefined : '100%' }}>
            <PostForm siteId={siteId} />
          </View>
        ) : null}
      </View>
    </Screen>
  );
}

import { useRouter } from 'expo-router';
import { Pressable, View } from 'react-native';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { POST_KIND_LABELS, SITE_KIND_LABELS } from '@/shared/schemas/site';
import { useSession } from '@/components/data/session';
import { useSite, useSitePosts } from '@/components/data/sites';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { PostForm } from './post-form';
import { SitePlans } from './site-plans';
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
  const eye = (p: (typeof list)[number]) => p.groundElevationM + p.structureHeightM + p.eyeHeightM;
  return (
    <Screen title={s.name} subtitle={`${SITE_KIND_LABELS[s.kind]} · ${s.timeZone}${s.notes ? ` · ${s.notes}` : ''}`}>
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
          </Card>
          <TerrainPanel site={s} canUpload={user?.role === 'planner'} />
          <AppText variant="heading">Coverage plans</AppText>
          <SitePlans siteId={siteId} />
          <SiteRoster siteId={siteId} timeZone={s.timeZone} />
          <AppText variant="heading">Posts</AppText>
          {posts.isPending ? (
            <LoadingState label="Loading posts…" />
          ) : posts.isError ? (
            <ErrorState error={posts.error} onRetry={() => void posts.refetch()} />
          ) : list.length === 0 ? (
            <EmptyState
              title="No posts yet"
              body="A post is a tower, hilltop, shore post, vessel or aircraft someone watches from."
            />
          ) : (
            list.map((p) => (
              <Pressable
                key={p.id}
                role="link"
                aria-label={p.name}
                onPress={() => router.navigate({ pathname: '/sites/[siteId]/posts/[postId]', params: { siteId, postId: p.id } })}
              >
                <Card style={{ gap: space.xs }}>
                  <AppText variant="heading">{p.name}</AppText>
                  <AppText variant="small" tone="muted">
                    {POST_KIND_LABELS[p.kind]} · {p.status} · {formatCoordinate(p.location, 'ddm')}
                  </AppText>
                  <AppText variant="small">
                    Eye {eye(p).toFixed(1)} m above datum (ground {p.groundElevationM} m + structure {p.structureHeightM} m + eye{' '}
                    {p.eyeHeightM} m)
                    {p.sector ? ` · sector ${p.sector.fromDeg}°–${p.sector.toDeg}°` : ' · all round'}
                  </AppText>
                </Card>
              </Pressable>
            ))
          )}
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

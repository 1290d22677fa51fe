import { useQuery } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Pressable, View } from 'react-native';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { POST_KIND_LABELS, POST_KINDS, type Post } from '@/shared/schemas/site';
import { lengthIn } from '@/components/check/format';
import { useLengthUnits } from '@/components/data/session';
import { sitePostsPageQuery, useSite } from '@/components/data/sites';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { Pager } from '@/components/ui/pager';
import { useSession } from '@/components/data/session';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';

const PAGE_SIZE = 25;
const SORTS = [
  { value: 'name', label: 'Name A–Z' },
  { value: 'kind', label: 'Kind' },
  { value: '-updatedAt', label: 'Recently changed' },
] as const;

const eye = (p: Post) => p.groundElevationM + p.structureHeightM + p.eyeHeightM;

/** A site's posts as cards: search by name, filter by kind and status, sort, and page through a large site. */
export function SitePosts({ siteId }: { siteId: string }) {
  const router = useRouter();
  const { height } = useLengthUnits(useSite(siteId).data?.defaultUnits);
  const planner = useSession().data?.role === 'planner';
  const [q, setQ] = useState('');
  const [kind, setKind] = useState<string | undefined>();
  const [status, setStatus] = useState<string | undefined>();
  const [sort, setSort] = useState<(typeof SORTS)[number]['value']>('name');
  const [page, setPage] = useState(1);
  const posts = useQuery(sitePostsPageQuery(siteId, { q: q.trim(), kind, status, sort, page, pageSize: PAGE_SIZE }));
  const filtered = q.trim() !== '' || kind !== undefined || status !== undefined;
  const change =
    <T,>(set: (v: T) => void) =>
    (v: T) => {
      set(v);
      setPage(1);
    };

  return (
    <View style={{ gap: space.sm }} aria-label="Posts">
      {(posts.data?.total ?? 0) > 5 || filtered ? (
        <View style={{ gap: space.sm }}>
          <TextField label="Search posts" value={q} onChangeText={change(setQ)} placeholder="Name" />
          <ChipRow label="Kind">
            {POST_KINDS.map((k) => (
              <Chip
                key={k}
                label={POST_KIND_LABELS[k]}
                on={kind === k}
                onPress={() => change(setKind)(kind === k ? undefined : k)}
              />
            ))}
          </ChipRow>
          <ChipRow label="Status">
            {(['existing', 'proposed'] as const).map((s) => (
              <Chip
                key={s}
                label={s === 'existing' ? 'Existing' : 'Proposed'}
                on={status === s}
                onPress={() => change(setStatus)(status === s ? undefined : s)}
              />
            ))}
          </ChipRow>
          <ChipRow label="Order">
            {SORTS.map((s) => (
              <Chip key={s.value} label={s.label} on={sort === s.value} onPress={() => change(setSort)(s.value)} />
            ))}
          </ChipRow>
        </View>
      ) : null}
      {posts.isPending ? (
        <LoadingState label="Loading posts…" />
      ) : posts.isError ? (
        <ErrorState error={posts.error} onRetry={() => void posts.refetch()} />
      ) : posts.data.items.length === 0 ? (
        <EmptyState
          title={filtered ? 'No post matches' : 'No posts yet'}
          body={
            filtered
              ? 'Loosen the search or the filters.'
              : `A post is a tower, hilltop, shore post, vessel or aircraft someone watches from. ${planner ? 'Add the first with the New post form on this page (its place in any coordinate format; its ground can come from the terrain), or duplicate a post later to make a similar one.' : 'A planner adds them.'}`
          }
        />
      ) : (
        <>
          {posts.data.items.map((p) => (
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
                  Eye {lengthIn(eye(p), height, (m) => `${m.toFixed(1)} m`)} above sea level (ground{' '}
                  {lengthIn(p.groundElevationM, height)} + structure {lengthIn(p.structureHeightM, height)} + eye{' '}
                  {lengthIn(p.eyeHeightM, height)})
                  {p.sector ? ` · sector ${p.sector.fromDeg}°–${p.sector.toDeg}°` : ' · all round'}
                </AppText>
              </Card>
            </Pressable>
          ))}
          <Pager page={posts.data.page} pageSize={posts.data.pageSize} total={posts.data.total} onPage={setPage} />
        </>
      )}
    </View>
  );
}

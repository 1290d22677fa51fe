import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import type { PlanResultRow } from '@/shared/schemas/plan';
import { POST_KIND_LABELS } from '@/shared/schemas/site';
import { CautionsPanel } from '@/components/check/cautions-panel';
import { formatLength, lengthIn, LIMIT_LABELS } from '@/components/check/format';
import { useLengthUnits } from '@/components/data/session';
import { useBriefing } from '@/components/data/roster';
import { when } from '@/components/plans/when';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { DueTrainingCard } from '@/components/trainer/due-training-card';
import { TerrainViewCard } from './terrain-view-card';
import { CrewCardLinks } from '@/components/reports/crew-card-links';

/**
 * A lookout's own briefing: their watches for the next two weeks and, for each
 * post, what the approved plan expects them to see from it and how far.
 */
export function BriefingScreen() {
  const briefing = useBriefing();
  const router = useRouter();
  const { wide } = useLayout();
  const { height, distance } = useLengthUnits();
  if (briefing.isPending) return <LoadingState label="Loading your briefing…" />;
  if (briefing.isError) return <ErrorState error={briefing.error} onRetry={() => void briefing.refetch()} />;
  const { assignments, posts } = briefing.data;
  return (
    <Screen
      title="Your watch"
      subtitle="Your posts for the next two weeks and what the approved plans expect you to see from them."
    >
      <DueTrainingCard />
      {assignments.length === 0 ? (
        <EmptyState
          title="No watches"
          body="Nobody has put you on a post for the next two weeks. Your supervisor does that on the site's roster."
        />
      ) : (
        <Card style={{ gap: space.xs }} aria-label="Your watches">
          <AppText variant="heading">Watches</AppText>
          {assignments.map((a) => (
            <AppText key={a.id}>
              {a.postName} ({a.siteName}) · {when(a.startsAt)} → {a.endsAt ? when(a.endsAt) : 'until further notice'}
              {a.note ? ` · ${a.note}` : ''}
            </AppText>
          ))}
        </Card>
      )}
      {posts.map(({ post, siteName, plan, results, cautions, basis, terrainView, siteHasTerrain }) => (
        <View key={post.id} style={{ gap: space.md }}>
          <AppText variant="title">{post.name}</AppText>
          <CrewCardLinks siteId={post.siteId} postId={post.id} />
          <AppText tone="muted">
            {POST_KIND_LABELS[post.kind]} · {siteName} · {formatCoordinate(post.location, 'ddm')} · eye{' '}
            {lengthIn(post.groundElevationM + post.structureHeightM + post.eyeHeightM, height, (m) => `${m.toFixed(1)} m`)} above
            sea level
            {post.sector ? ` · watch ${post.sector.fromDeg}°–${post.sector.toDeg}°` : ' · all round'}
          </AppText>
          {plan ? (
            <>
              <AppText>
                Approved plan “{plan.title}” v{plan.version}, revision {plan.revision}, approved {when(plan.approvedAt)}.
              </AppText>
              {terrainView ? (
                <TerrainViewCard view={terrainView} siteName={siteName} wide={wide} watch={post.sector} distance={distance} />
              ) : siteHasTerrain ? (
                <Notice tone="caution">
                  <AppText>
                    The site has terrain, but this plan was approved without terrain coverage: the figures below are for a smooth
                    earth and leave out every hill and valley. Ask your supervisor for a plan with terrain coverage.
                  </AppText>
                </Notice>
              ) : null}
              <View style={{ gap: space.xs }}>
                <AppText variant="heading">
                  {basis === 'terrain' ? 'Detection ranges per target' : 'Ranges per target — smooth earth, no terrain'}
                </AppText>
                <AppText variant="small" tone="muted">
                  {basis === 'terrain'
                    ? 'How far each target can be detected from this post when nothing is in the way (the terrain view above says where something is).'
                    : 'Figures for a smooth earth: they hold over open sea and flat ground, not where hills or trees are in the way.'}
                </AppText>
              </View>
              <View style={{ flexDirection: wide ? 'row' : 'column', flexWrap: 'wrap', gap: space.sm }}>
                {byTarget(results).map(({ targetId, targetName, rows }) => (
                  <Card key={targetId} style={{ gap: space.xs, width: wide ? 360 : '100%' }} aria-label={targetName}>
                    <AppText variant="label">{targetName}</AppText>
                    {rows.map((r) => (
                      <View
                        key={`${r.conditionSetId}|${r.conditionIndex}`}
                        style={{ flexDirection: 'row', gap: space.sm, alignItems: 'baseline' }}
                      >
                        <AppText variant="figure" style={{ minWidth: 84 }}>
                          {formatLength(r.result.detectionRangeM, distance)}
                        </AppText>
                        <AppText variant="small" tone="muted" style={{ flex: 1 }}>
                          {r.conditionSetName}, k = {r.result.k.toFixed(2)} ·{' '}
                          {r.result.limitedBy ? `limited by ${LIMIT_LABELS[r.result.limitedBy]}` : 'no limit found'}
                          {basis === 'smooth-earth' && r.zones.length
                            ? ` · ${r.zones.map((z) => `${z.name}: ${z.reach}`).join(', ')}`
                            : ''}
                        </AppText>
                      </View>
                    ))}
                  </Card>
                ))}
              </View>
              <CautionsPanel cautions={cautions} />
              <View style={{ alignSelf: 'flex-start' }}>
                <Button
                  kind="secondary"
                  label="Open the plan"
                  onPress={() => router.navigate({ pathname: '/plans/[planId]', params: { planId: plan.id } })}
                />
              </View>
            </>
          ) : (
            <Notice tone="caution">
              <AppText>No approved plan uses this post yet. Ask your supervisor before relying on any range from it.</AppText>
            </Notice>
          )}
        </View>
      ))}
    </Screen>
  );
}

/** Result lines grouped by target, in the order they first appear. */
function byTarget(results: PlanResultRow[]) {
  const groups = new Map<string, { targetId: string; targetName: string; rows: PlanResultRow[] }>();
  for (const r of results) {
    const g = groups.get(r.targetId) ?? { targetId: r.targetId, targetName: r.targetName, rows: [] };
    g.rows.push(r);
    groups.set(r.targetId, g);
  }
  return [...groups.values()];
}

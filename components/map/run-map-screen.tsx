import { useRouter } from 'expo-router';
import { useCallback, useState } from 'react';
import { View } from 'react-native';
import type { LatLon } from '@/shared/geo/types';
import { useCoverageRun, isActiveRun } from '@/components/data/coverage';
import { CoverageCasePicker } from '@/components/plans/coverage-case-picker';
import { caseLabel, pickCase } from '@/components/plans/coverage-format';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { LoadingState, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { useCoverageRunLayers } from './coverage-run-layers';
import { SiteMapScreen } from './site-map-screen';

/**
 * The site map with a coverage run's layers for one case (target ×
 * condition): posts per cell, cross-bearings and the chosen post's own
 * classes. The case is in the address (`caseKey`), so a link opens the same
 * picture; the legend panel picks another case.
 */
export function RunMapScreen({
  siteId,
  runId,
  caseKey: initialCaseKey,
  focusPostId,
  focusAt,
  outlineBlindArea = false,
}: {
  siteId: string;
  runId: string;
  caseKey: string | null;
  focusPostId: string | null;
  focusAt: LatLon | null;
  /** `focusAt` is inside a blind area of this case: outline it. */
  outlineBlindArea?: boolean;
}) {
  const router = useRouter();
  const run = useCoverageRun(runId);
  const [caseKey, setCaseKey] = useState(initialCaseKey);
  const [postId, setPostId] = useState<string | null>(null);
  const onChosenPost = useCallback((id: string | null) => setPostId(id), []);

  const done = run.data?.status === 'done' ? run.data : null;
  const shownCase = done ? pickCase(done.cases, caseKey) : null;
  const runPost = shownCase?.posts.find((p) => p.postId === postId) ?? null;
  // The chosen post's patrol layer when it patrols, else the case's first patrol's.
  const patrols = shownCase?.patrols ?? [];
  const patrol = patrols.find((p) => p.postId === postId) ?? patrols[0] ?? null;
  const layers = useCoverageRunLayers(
    done?.id ?? null,
    shownCase?.key ?? null,
    runPost ? { id: runPost.postId, name: runPost.postName } : null,
    patrol ? { id: patrol.postId, name: patrol.postName } : null,
  );

  const onCase = (key: string) => {
    setCaseKey(key);
    router.setParams({ caseKey: key });
  };

  const panel = (
    <View style={{ gap: space.sm }} aria-label="Coverage run">
      <AppText variant="label">Coverage run</AppText>
      {run.isPending ? (
        <LoadingState label="Loading the coverage run…" />
      ) : run.isError ? (
        <Notice tone="danger" title="The coverage run cannot be loaded">
          <AppText variant="small">{run.error.message}</AppText>
        </Notice>
      ) : run.data.siteId !== siteId ? (
        <Notice tone="danger">
          <AppText variant="small">This coverage run belongs to another site; its layers are not drawn here.</AppText>
        </Notice>
      ) : !done ? (
        <Notice tone="caution">
          <AppText variant="small">
            {isActiveRun(run.data)
              ? `This run is still computing (${Math.round(run.data.progress * 100)} %); its layers show when it is done.`
              : `This run ${run.data.status === 'failed' ? 'failed' : 'was cancelled'}: it has no layers.`}
          </AppText>
        </Notice>
      ) : (
        <>
          <CoverageCasePicker cases={done.cases} value={shownCase?.key ?? null} onChange={onCase} />
          {shownCase ? <AppText variant="small">Showing {caseLabel(shownCase)}</AppText> : null}
          {layers.pending ? <LoadingState label="Loading the layers…" /> : null}
          {layers.error ? (
            <Notice tone="danger" title="A layer cannot be loaded">
              <AppText variant="small">{layers.error.message}</AppText>
            </Notice>
          ) : null}
          {patrol ? (
            <AppText variant="small" tone="muted">
              {patrol.postName} patrols its route: watched at least once {patrol.sweptPct.toFixed(1)} % of the judged area, in
              view {(100 * patrol.meanFractionInView).toFixed(1)} % of the cycle on average
              {patrol.pod !== null ? `; probability of detection in one cycle ${(100 * patrol.pod).toFixed(1)} %` : ''}.
            </AppText>
          ) : null}
          {shownCase && shownCase.gaps.length > 0 ? (
            <AppText variant="small" tone="muted" aria-label="Gaps on the map">
              {shownCase.gaps.length} gap{shownCase.gaps.length === 1 ? '' : 's'} along the shore in this case, drawn in red on
              the shoreline (the plan’s coverage card lists them with what would close them).
            </AppText>
          ) : null}
          {postId && !runPost ? (
            <AppText variant="small" tone="muted">
              The chosen post is not in this plan: pick one of its posts above to see what it sees.
            </AppText>
          ) : null}
        </>
      )}
      {run.data ? (
        <Button
          kind="quiet"
          role="link"
          label="Back to the plan"
          style={{ alignSelf: 'flex-start' }}
          onPress={() => router.navigate({ pathname: '/plans/[planId]', params: { planId: run.data.planId } })}
        />
      ) : null}
    </View>
  );

  return (
    <SiteMapScreen
      siteId={siteId}
      focusPostId={focusPostId}
      focusAt={focusAt}
      coverageLayers={run.data?.siteId === siteId ? layers.layers : []}
      coveragePanel={panel}
      onChosenPost={onChosenPost}
      outlineBlindArea={outlineBlindArea && caseKey === initialCaseKey}
      shoreGaps={shownCase?.gaps ?? []}
    />
  );
}

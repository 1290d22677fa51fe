import { useState } from 'react';
import { View } from 'react-native';
import type { CoverageRun, CoverageSnapshot, PlanCoverage } from '@/shared/schemas/coverage';
import { useCancelCoverage, useCoverageRun, usePlanCoverage, useStartCoverage } from '@/components/data/coverage';
import { useLengthUnits } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ProgressBar } from '@/components/ui/progress-bar';
import { ErrorState, FormError, LoadingState, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { coverageCardState, progressText, type CoverageCardState } from './coverage-format';
import { CoverageFigures } from './coverage-figures';
import { when } from './when';

/**
 * The plan page's "Terrain coverage" section. Editable plans show today's
 * coverage (compute, progress, cancel, figures, stale or failed runs);
 * frozen plans show the run their latest revision froze.
 */
export function PlanCoveragePanel({
  planId,
  siteId,
  editable,
  canRun,
  frozen,
}: {
  planId: string;
  siteId: string;
  editable: boolean;
  /** Planners on a draft or returned plan. */
  canRun: boolean;
  /** The frozen revision's coverage (frozen plans), null when none was frozen, undefined while it loads. */
  frozen?: CoverageSnapshot | null;
}) {
  return (
    <Card accent={editable ? 'none' : 'moss'} style={{ gap: space.md }} aria-label="Terrain coverage" role="region">
      <AppText variant="heading" role="heading">
        Terrain coverage
      </AppText>
      {editable ? <LiveCoverage planId={planId} canRun={canRun} /> : <FrozenCoverage siteId={siteId} frozen={frozen} />}
    </Card>
  );
}

function LiveCoverage({ planId, canRun }: { planId: string; canRun: boolean }) {
  const coverage = usePlanCoverage(planId);
  if (coverage.isPending) return <LoadingState label="Loading the plan’s coverage…" />;
  if (coverage.isError) return <ErrorState error={coverage.error} onRetry={() => void coverage.refetch()} />;
  return <CoverageCard planId={planId} coverage={coverage.data} canRun={canRun} />;
}

function CoverageCard({ planId, coverage, canRun }: { planId: string; coverage: PlanCoverage; canRun: boolean }) {
  const initial = coverageCardState(coverage);
  // An active run is polled by id, so its progress shows without asking for the whole plan's coverage each second.
  const polled = useCoverageRun(initial.kind === 'active' ? initial.run.id : null);
  const state: CoverageCardState =
    initial.kind === 'active' && polled.data
      ? coverageCardState({ current: polled.data.current ? polled.data : null, latest: polled.data })
      : initial;
  const start = useStartCoverage(planId);
  const cancel = useCancelCoverage();
  const units = useLengthUnits();
  const [error, setError] = useState('');
  const [caseKey, setCaseKey] = useState<string | null>(null);

  const onStart = () => {
    setError('');
    start.mutate(undefined, { onError: (e) => setError(e.message) });
  };
  const onCancel = (run: CoverageRun) => {
    setError('');
    cancel.mutate(run.id, { onError: (e) => setError(e.message) });
  };
  const startButton = (label: string) =>
    canRun ? <Button label={label} onPress={onStart} busy={start.isPending} style={{ alignSelf: 'flex-start' }} /> : null;

  return (
    <View style={{ gap: space.md }}>
      <AppText variant="small" tone="muted">
        {coverage.hasTerrain
          ? 'What this plan’s posts see over the site’s terrain, for every target and condition: needed before the plan can be submitted.'
          : 'This site has no terrain, so coverage is worked out on a flat datum at sea level. It is not needed for submitting.'}
      </AppText>
      <FormError message={error} />
      {state.kind === 'none' ? (
        <>
          <AppText>Not computed yet.</AppText>
          {startButton('Compute coverage')}
          {!canRun ? (
            <AppText variant="small" tone="muted">
              A planner computes it while the plan is a draft.
            </AppText>
          ) : null}
        </>
      ) : state.kind === 'active' ? (
        <>
          <ProgressBar
            label={state.run.status === 'queued' ? 'Coverage queued' : 'Computing coverage'}
            fraction={state.run.progress}
            detail={progressText(state.run)}
          />
          <AppText variant="small" tone="muted">
            Asked by {state.run.requestedBy.name} · {when(state.run.createdAt)}. You can leave this page; the run goes on.
          </AppText>
          {canRun ? (
            <Button
              label="Cancel the run"
              kind="secondary"
              onPress={() => onCancel(state.run)}
              busy={cancel.isPending}
              style={{ alignSelf: 'flex-start' }}
            />
          ) : null}
        </>
      ) : state.kind === 'failed' ? (
        <>
          <Notice tone="danger" title="The coverage run failed">
            <AppText variant="small">{state.run.error ?? 'No reason was given.'}</AppText>
          </Notice>
          {startButton('Try again')}
        </>
      ) : state.kind === 'cancelled' ? (
        <>
          <Notice tone="caution" title="Cancelled">
            <AppText variant="small">
              The last run was cancelled{state.run.finishedAt ? ` (${when(state.run.finishedAt)})` : ''}; there are no figures for
              today’s inputs.
            </AppText>
          </Notice>
          {startButton('Compute coverage')}
        </>
      ) : (
        <>
          {state.kind === 'stale' ? (
            <Notice tone="caution" title="Out of date">
              <AppText variant="small">
                The posts, targets, conditions or standard changed since this was computed. The figures below are for the earlier
                inputs; compute again before relying on them or submitting.
              </AppText>
            </Notice>
          ) : null}
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' }}>
            <AppText variant="small" tone="muted" style={{ flex: 1, minWidth: 220 }}>
              {runSummary(state.run)}
            </AppText>
            {state.kind === 'stale' ? startButton('Compute again') : null}
          </View>
          <CoverageFigures run={state.run} caseKey={caseKey} onCase={setCaseKey} units={units} />
        </>
      )}
    </View>
  );
}

/** Who asked for a finished run, when it finished and how long it took. */
function runSummary(run: CoverageRun): string {
  const took = run.elapsedS === null ? '' : ` in ${run.elapsedS < 10 ? run.elapsedS.toFixed(1) : Math.round(run.elapsedS)} s`;
  const grid = run.grid ? ` · ${Math.round(run.grid.cellSizeM)} m cells` : '';
  return `Computed for ${run.requestedBy.name} · ${when(run.finishedAt ?? run.createdAt)}${took}${grid}`;
}

/** A frozen plan: the run its revision froze (asked for by id), never the live one. */
function FrozenCoverage({ siteId, frozen }: { siteId: string; frozen: CoverageSnapshot | null | undefined }) {
  const run = useCoverageRun(frozen?.runId ?? null);
  const units = useLengthUnits();
  const [caseKey, setCaseKey] = useState<string | null>(null);
  if (frozen === undefined) return <LoadingState label="Loading the frozen revision…" />;
  if (frozen === null) {
    return (
      <AppText tone="muted">
        No coverage run was frozen with this revision (it was submitted before coverage was computed, or the site had no terrain).
      </AppText>
    );
  }
  if (run.isPending) return <LoadingState label="Loading the frozen coverage run…" />;
  // The revision carries the cases itself: if the run cannot be fetched, its frozen figures still show.
  const shown = run.data ?? { id: frozen.runId, siteId, cases: frozen.cases, datum: frozen.datum };
  return (
    <View style={{ gap: space.md }}>
      <AppText variant="small" tone="muted">
        The figures frozen with the plan when it was submitted
        {run.data ? ` · computed ${when(run.data.finishedAt ?? run.data.createdAt)} for ${run.data.requestedBy.name}` : ''}.
      </AppText>
      {run.isError ? (
        <Notice tone="caution">
          <AppText variant="small">
            The run itself could not be loaded ({run.error.message}); the revision’s own copy shows.
          </AppText>
        </Notice>
      ) : null}
      <CoverageFigures run={shown} caseKey={caseKey} onCase={setCaseKey} units={units} />
    </View>
  );
}

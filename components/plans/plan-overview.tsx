import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { isEditablePlanStatus } from '@/shared/plans/editable-plan-statuses';
import type { Plan, PlanSnapshot } from '@/shared/schemas/plan';
import {
  useNewPlanVersion,
  usePlan,
  usePlanHistory,
  usePlanPreview,
  usePlanRevision,
  useSubmitPlan,
} from '@/components/data/plans';
import { useSession } from '@/components/data/session';
import { DocumentsPanel } from '@/components/attachments/documents-panel';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { ErrorState, FormError, LoadingState, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { ApiRequestError } from '@/components/data/api-client';
import { usePlanCoverage } from '@/components/data/coverage';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TextField } from '@/components/ui/text-field';
import { standardVerdict } from '@/shared/plans/standard-verdict';
import { VerdictSummary } from './verdict-summary';
import { coverageCardState } from './coverage-format';
import { PlanCoveragePanel } from './plan-coverage-panel';
import { PlanResults } from './plan-results';
import { AssumptionsPanel, InputsPanel, SnapshotCautions, unitsOf } from './plan-snapshot-panels';
import { PlanStatusBadge } from './plan-status';
import { when } from './when';
import { HistoryLink } from '@/components/audit/history-link';
import { PlanPackageLink } from '@/components/reports/plan-package-link';
import { PlanExports } from '@/components/reports/plan-exports';

/** A plan's page: status, what to do next, and its results (frozen once submitted). */
export function PlanOverview({ planId }: { planId: string }) {
  const plan = usePlan(planId);
  const history = usePlanHistory(planId);
  if (plan.isPending) return <LoadingState label="Loading the plan…" />;
  if (plan.isError) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  const latest = history.data?.revisions.at(-1)?.number ?? null;
  return <PlanPage plan={plan.data} latestRevision={latest} history={history.data} />;
}

function PlanPage({
  plan,
  latestRevision,
  history,
}: {
  plan: Plan;
  latestRevision: number | null;
  history: ReturnType<typeof usePlanHistory>['data'];
}) {
  const router = useRouter();
  const { data: user } = useSession();
  const { wide } = useLayout();
  const editable = isEditablePlanStatus(plan.status);
  const preview = usePlanPreview(plan.id, editable);
  const frozen = usePlanRevision(plan.id, editable ? null : latestRevision);
  const submit = useSubmitPlan(plan.id);
  const newVersion = useNewPlanVersion(plan.id);
  const [notice, setNotice] = useState('');
  const [error, setError] = useState('');
  const [coverageMissing, setCoverageMissing] = useState('');
  // The same query as the coverage card (shared cache): the refusal notice goes once coverage is done.
  const coverage = usePlanCoverage(plan.id, editable);
  const coverageDone = coverage.data ? coverageCardState(coverage.data).kind === 'done' : false;
  const isPlanner = user?.role === 'planner';
  const canReview = user?.role === 'reviewer' && plan.status === 'submitted' && plan.preparedBy.id !== user.id;
  const lastReview = history?.reviews.at(-1);

  const snapshot: PlanSnapshot | undefined = editable ? preview.data : frozen.data?.snapshot;
  const results = editable ? preview : frozen;

  const [confirming, setConfirming] = useState(false);
  const [exceptionNote, setExceptionNote] = useState('');
  const [noteError, setNoteError] = useState('');
  const [dialogError, setDialogError] = useState('');
  // What submitting now would freeze: today's finished run against the standard.
  const current = coverage.data?.current;
  const verdict = current?.status === 'done' ? standardVerdict(current.cases) : null;
  const failing = verdict !== null && !verdict.passed;

  const askSubmit = () => {
    setError('');
    setDialogError('');
    setNoteError('');
    setConfirming(true);
  };
  const onSubmit = () => {
    setCoverageMissing('');
    setDialogError('');
    if (failing && exceptionNote.trim() === '') {
      setNoteError('Say why this plan should be reviewed although it does not meet its standard.');
      return;
    }
    submit.mutate(
      { rowVersion: plan.rowVersion, ...(failing && { exceptionNote: exceptionNote.trim() }) },
      {
        onSuccess: (r) => {
          setConfirming(false);
          setExceptionNote('');
          setNotice(
            `Revision ${r.revision} is frozen and waiting for review.${r.mailed ? ' The reviewers were e-mailed.' : ' No e-mail went out; tell the reviewers.'}`,
          );
        },
        onError: (e) => {
          if (e instanceof ApiRequestError && e.code === 'coverage_missing') {
            setConfirming(false);
            setCoverageMissing(e.message);
          } else if (e instanceof ApiRequestError && e.fields.exceptionNote) {
            setNoteError(e.fields.exceptionNote);
            setDialogError(e.message);
          } else setDialogError(e.message);
        },
      },
    );
  };
  const onNewVersion = () =>
    newVersion.mutate(undefined, {
      onSuccess: (r) => router.navigate({ pathname: '/plans/[planId]', params: { planId: r.plan.id } }),
      onError: (e) => setError(e.message),
    });

  // The plan's next step; on a phone it stays in a bar at the bottom while the page scrolls.
  const decisionButtons = [
    isPlanner && editable ? <Button key="submit" label="Submit for review" onPress={askSubmit} busy={submit.isPending} /> : null,
    isPlanner && plan.status === 'approved' ? (
      <Button key="version" label="Start a new version" kind="secondary" onPress={onNewVersion} busy={newVersion.isPending} />
    ) : null,
    canReview ? (
      <Button
        key="review"
        label="Review this plan"
        onPress={() => router.navigate({ pathname: '/plans/[planId]/review', params: { planId: plan.id } })}
      />
    ) : null,
  ].filter((b) => b !== null);
  const decision = decisionButtons.length > 0 ? <>{decisionButtons}</> : null;

  return (
    <Screen
      footer={wide ? undefined : decision}
      title={`${plan.title} · v${plan.version}`}
      subtitle={`${plan.siteName} · prepared by ${plan.preparedBy.name} · updated ${when(plan.updatedAt)}`}
      actions={<PlanStatusBadge status={plan.status} />}
    >
      <FormError message={error} />
      <ConfirmDialog
        visible={confirming}
        title={failing ? 'Submit as an exception?' : 'Submit this plan for review?'}
        consequence={
          'Every input and result is frozen in a new revision and the plan goes to the reviewers. ' +
          'Nobody can edit it until a reviewer returns it.'
        }
        confirmLabel={failing ? 'Submit as an exception' : 'Submit for review'}
        busy={submit.isPending}
        error={dialogError}
        onConfirm={onSubmit}
        onCancel={() => setConfirming(false)}
      >
        <VerdictSummary verdict={verdict} />
        {failing ? (
          <TextField
            label="Exception note"
            hint="Why the reviewers should consider it anyway. Frozen with the revision and shown in the plan's history."
            value={exceptionNote}
            onChangeText={(text) => {
              setExceptionNote(text);
              setNoteError('');
            }}
            error={noteError}
            multiline
            numberOfLines={4}
            style={{ minHeight: 96, paddingTop: space.sm, textAlignVertical: 'top' }}
          />
        ) : null}
      </ConfirmDialog>
      {coverageMissing && !coverageDone ? (
        <Notice tone="danger" title="Coverage first">
          <AppText>{coverageMissing}</AppText>
          <AppText variant="small">Compute it in the Terrain coverage section below, then submit again.</AppText>
        </Notice>
      ) : null}
      {notice ? (
        <Notice tone="info" title="Submitted">
          <AppText>{notice}</AppText>
        </Notice>
      ) : null}
      {plan.status === 'returned' && lastReview ? (
        <Notice tone="danger" title={`Returned by ${lastReview.reviewer.name} · ${when(lastReview.at)}`}>
          <AppText>{lastReview.comment}</AppText>
        </Notice>
      ) : null}
      {plan.status === 'superseded' ? (
        <Notice tone="caution" title="Superseded">
          <AppText>A newer approved version of this plan replaces it. It stays on record as it was approved.</AppText>
        </Notice>
      ) : null}

      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        {isPlanner && editable ? (
          <Button
            label="Edit"
            kind="secondary"
            onPress={() => router.navigate({ pathname: '/plans/[planId]/edit', params: { planId: plan.id } })}
          />
        ) : null}
        {wide ? decision : null}
        <HistoryLink entityType="plan" entityId={plan.id} />
        <Button
          label="Compare with…"
          kind="quiet"
          role="link"
          onPress={() =>
            router.navigate({
              pathname: '/plans/compare',
              params: plan.previousId ? { a: plan.previousId, b: plan.id } : { b: plan.id },
            })
          }
        />
        <Button
          label="History and signatures"
          kind="quiet"
          onPress={() => router.navigate({ pathname: '/plans/[planId]/history', params: { planId: plan.id } })}
        />
        <Button
          label="Site"
          kind="quiet"
          onPress={() => router.navigate({ pathname: '/sites/[siteId]', params: { siteId: plan.siteId } })}
        />
      </View>

      <Card accent={editable ? 'none' : 'moss'} style={{ gap: space.xs }}>
        <AppText variant="heading">
          {editable ? 'Results from today’s inputs' : `Results frozen in revision ${latestRevision ?? '—'}`}
        </AppText>
        <AppText variant="small" tone="muted">
          {editable
            ? 'Not frozen yet: these figures follow any change to the posts, targets or conditions until the plan is submitted.'
            : frozen.data
              ? `Submitted by ${frozen.data.submittedBy.name} · ${when(frozen.data.submittedAt)} · content hash ${frozen.data.contentHash.slice(0, 12)}…`
              : 'Loading the frozen revision…'}
        </AppText>
      </Card>

      <PlanPackageLink planId={plan.id} revision={editable ? null : (latestRevision ?? undefined)} />
      <PlanCoveragePanel
        planId={plan.id}
        siteId={plan.siteId}
        editable={editable}
        canRun={isPlanner && editable}
        frozen={editable || !history ? undefined : latestRevision === null ? null : frozen.data?.snapshot.coverage}
      />

      <PlanExports planId={plan.id} revision={editable ? null : latestRevision} />
      <DocumentsPanel
        owner={{ ownerType: 'plan', ownerId: plan.id }}
        canEdit={isPlanner && editable}
        frozenNote={
          editable ? undefined : 'These files were frozen with the plan when it was submitted; a new version can change them.'
        }
      />

      {results.isPending && (editable || latestRevision !== null) ? (
        <LoadingState label="Computing the results…" />
      ) : results.isError ? (
        <ErrorState error={results.error} onRetry={() => void results.refetch()} />
      ) : snapshot && wide ? (
        <>
          <View style={{ flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' }}>
            <View style={{ flex: 1 }}>
              <SnapshotCautions snapshot={snapshot} />
            </View>
            <View style={{ flex: 1 }}>
              <InputsPanel snapshot={snapshot} />
            </View>
            <View style={{ flex: 1 }}>
              <AssumptionsPanel snapshot={snapshot} />
            </View>
          </View>
          <PlanResults snapshot={snapshot} units={unitsOf(snapshot)} />
        </>
      ) : snapshot ? (
        <>
          <SnapshotCautions snapshot={snapshot} />
          <PlanResults snapshot={snapshot} units={unitsOf(snapshot)} />
          <InputsPanel snapshot={snapshot} />
          <AssumptionsPanel snapshot={snapshot} />
        </>
      ) : null}
    </Screen>
  );
}

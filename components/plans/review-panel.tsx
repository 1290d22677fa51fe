import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { diffSnapshots } from '@/shared/plans/diff-snapshots';
import { ApiRequestError } from '@/components/data/api-client';
import { usePlan, usePlanHistory, usePlanRevision, useReviewPlan } from '@/components/data/plans';
import { useSession } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { ErrorState, FormError, LoadingState, Notice } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { PlanCoveragePanel } from './plan-coverage-panel';
import { PlanResults } from './plan-results';
import { AssumptionsPanel, InputsPanel, SnapshotCautions, unitsOf } from './plan-snapshot-panels';
import { PlanStatusBadge } from './plan-status';
import { SnapshotDiffView } from './snapshot-diff-view';
import { when } from './when';

/**
 * The reviewer's screen: the frozen revision's inputs and assumptions beside
 * its results, what changed since the previous revision, and the decision.
 */
export function ReviewPanel({ planId }: { planId: string }) {
  const router = useRouter();
  const { wide } = useLayout();
  const { data: user } = useSession();
  const plan = usePlan(planId);
  const history = usePlanHistory(planId);
  const latest = history.data?.revisions.at(-1)?.number ?? null;
  const revision = usePlanRevision(planId, latest);
  const previous = usePlanRevision(planId, latest !== null && latest > 1 ? latest - 1 : null);
  const review = useReviewPlan(planId);
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState('');
  const [formError, setFormError] = useState('');

  if (plan.isPending || history.isPending) return <LoadingState label="Loading the plan…" />;
  if (plan.isError) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  if (history.isError) return <ErrorState error={history.error} onRetry={() => void history.refetch()} />;
  const p = plan.data;
  if (latest === null) {
    return (
      <Screen title={p.title}>
        <Notice tone="info">
          <AppText>This plan has not been submitted yet; there is nothing to review.</AppText>
        </Notice>
      </Screen>
    );
  }
  if (revision.isPending) return <LoadingState label="Loading the frozen revision…" />;
  if (revision.isError) return <ErrorState error={revision.error} onRetry={() => void revision.refetch()} />;
  const snapshot = revision.data.snapshot;
  const own = p.preparedBy.id === user?.id;
  const open = p.status === 'submitted' && user?.role === 'reviewer' && !own;

  const decide = (decision: 'approve' | 'return') => {
    setFormError('');
    setCommentError('');
    if (decision === 'return' && comment.trim() === '') {
      setCommentError('Say what needs to change before returning the plan.');
      return;
    }
    review.mutate(
      { decision, comment: comment.trim(), revision: latest },
      {
        onSuccess: () => router.replace({ pathname: '/plans/[planId]', params: { planId } }),
        onError: (e) => {
          if (e instanceof ApiRequestError && e.fields.comment) setCommentError(e.fields.comment);
          else setFormError(e.message);
        },
      },
    );
  };

  const inputs = (
    <>
      <InputsPanel snapshot={snapshot} />
      <AssumptionsPanel snapshot={snapshot} />
      {previous.data ? (
        <SnapshotDiffView diff={diffSnapshots(previous.data.snapshot, snapshot)} from={latest - 1} to={latest} />
      ) : null}
    </>
  );
  const results = (
    <>
      <SnapshotCautions snapshot={snapshot} />
      <PlanCoveragePanel planId={p.id} siteId={p.siteId} editable={false} canRun={false} frozen={snapshot.coverage} />
      <PlanResults snapshot={snapshot} units={unitsOf(snapshot)} />
    </>
  );
  const decision = open ? (
    <Card accent="ember" style={{ gap: space.md }}>
      <AppText variant="heading">Your decision on revision {latest}</AppText>
      <FormError message={formError} />
      <TextField
        label="Comment"
        hint="Required when you return the plan; kept with the revision in the plan's history."
        value={comment}
        onChangeText={setComment}
        error={commentError}
        multiline
        numberOfLines={4}
        style={{ minHeight: 96, paddingTop: space.sm, textAlignVertical: 'top' }}
      />
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button
          label="Approve"
          onPress={() => decide('approve')}
          busy={review.isPending && review.variables?.decision === 'approve'}
        />
        <Button
          label="Return for changes"
          kind="secondary"
          onPress={() => decide('return')}
          busy={review.isPending && review.variables?.decision === 'return'}
        />
      </View>
    </Card>
  ) : null;

  return (
    <Screen
      title={`Review: ${p.title} · v${p.version}`}
      subtitle={`${p.siteName} · revision ${latest} submitted by ${revision.data.submittedBy.name}, ${when(revision.data.submittedAt)}`}
      actions={<PlanStatusBadge status={p.status} />}
      maxWidth={1400}
    >
      {!open ? (
        <Notice tone="caution">
          <AppText>
            {own
              ? 'You prepared this plan, so someone else must review it. You can read it here.'
              : p.status !== 'submitted'
                ? 'This plan is not waiting for review; the decision controls are off.'
                : 'Only reviewers decide on plans.'}
          </AppText>
        </Notice>
      ) : null}
      {wide ? (
        <View style={{ flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' }}>
          <View style={{ flex: 2, gap: space.lg }} aria-label="Assumptions and inputs">
            {inputs}
            {decision}
          </View>
          <View style={{ flex: 3, gap: space.lg }} aria-label="Results">
            {results}
          </View>
        </View>
      ) : (
        <>
          {results}
          {inputs}
          {decision}
        </>
      )}
    </Screen>
  );
}

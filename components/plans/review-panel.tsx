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
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { standardVerdict } from '@/shared/plans/standard-verdict';
import { VerdictSummary } from './verdict-summary';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { PlanCoveragePanel } from './plan-coverage-panel';
import { PlanResults } from './plan-results';
import { AssumptionsPanel, InputsPanel, SnapshotCautions, unitsOf } from './plan-snapshot-panels';
import { PlanStatusBadge } from './plan-status';
import { SnapshotDiffView } from './snapshot-diff-view';
import { when } from './when';
import { PlanPackageLink } from '@/components/reports/plan-package-link';

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
  const [asking, setAsking] = useState<'approve' | 'return' | null>(null);
  const [justification, setJustification] = useState('');
  const [justificationError, setJustificationError] = useState('');
  const [dialogError, setDialogError] = useState('');

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

  // The verdict frozen with the revision; revisions from before verdicts were frozen are judged from their coverage.
  const verdict = revision.data.verdict ?? standardVerdict(snapshot.coverage?.cases);
  const failing = !verdict.passed;

  const ask = (decision: 'approve' | 'return') => {
    setFormError('');
    setCommentError('');
    setDialogError('');
    setJustificationError('');
    setAsking(decision);
  };
  const decide = (decision: 'approve' | 'return') => {
    setDialogError('');
    setCommentError('');
    setJustificationError('');
    if (decision === 'return' && comment.trim() === '') {
      setCommentError('Say what needs to change before returning the plan.');
      return;
    }
    const why = justification.trim();
    if (decision === 'approve' && failing && why === '') {
      setJustificationError('Write why this plan is approved although it does not meet its standard.');
      return;
    }
    review.mutate(
      { decision, comment: comment.trim(), revision: latest, ...(decision === 'approve' && failing && { justification: why }) },
      {
        onSuccess: () => {
          setAsking(null);
          router.replace({ pathname: '/plans/[planId]', params: { planId } });
        },
        onError: (e) => {
          if (e instanceof ApiRequestError && e.fields.justification) {
            setJustificationError(e.fields.justification);
            setDialogError(e.message);
          } else if (e instanceof ApiRequestError && e.fields.comment) {
            setCommentError(e.fields.comment);
          } else setDialogError(e.message);
        },
      },
    );
  };
  const commentField = (hint: string) => (
    <TextField
      label="Comment"
      hint={hint}
      value={comment}
      onChangeText={(text) => {
        setComment(text);
        setCommentError('');
      }}
      error={commentError}
      multiline
      numberOfLines={4}
      style={{ minHeight: 96, paddingTop: space.sm, textAlignVertical: 'top' }}
    />
  );
  const decisionButtons = (
    <>
      <Button label={failing ? 'Approve as an exception' : 'Approve'} onPress={() => ask('approve')} />
      <Button label="Return for changes" kind="secondary" onPress={() => ask('return')} />
    </>
  );
  // Both decisions are asked in a dialog that says what will happen; the comment is written there.
  const dialogs = open ? (
    <>
      <ConfirmDialog
        visible={asking === 'approve'}
        title={failing ? 'Approve as an exception?' : `Approve revision ${latest}?`}
        consequence={
          `${p.title} becomes the approved plan` +
          (p.previousId ? ', replacing the version it changes' : '') +
          `, and ${p.preparedBy.name} is told. The decision is kept with revision ${latest} and cannot be changed.`
        }
        confirmLabel={failing ? 'Approve as an exception' : 'Approve'}
        busy={review.isPending}
        error={dialogError}
        onConfirm={() => decide('approve')}
        onCancel={() => setAsking(null)}
      >
        <VerdictSummary verdict={verdict} />
        {failing ? (
          <TextField
            label="Justification"
            hint="Why the plan is approved although it does not meet its standard. Frozen with your decision and shown in the history."
            value={justification}
            onChangeText={(text) => {
              setJustification(text);
              setJustificationError('');
            }}
            error={justificationError}
            multiline
            numberOfLines={4}
            style={{ minHeight: 96, paddingTop: space.sm, textAlignVertical: 'top' }}
          />
        ) : null}
        {commentField('Optional; kept with the revision in the plan’s history.')}
      </ConfirmDialog>
      <ConfirmDialog
        visible={asking === 'return'}
        title="Return for changes?"
        consequence={`The plan goes back to ${p.preparedBy.name} with your comment; they can change it and submit it again. Revision ${latest} stays on record as it is.`}
        confirmLabel="Return for changes"
        busy={review.isPending}
        error={dialogError}
        onConfirm={() => decide('return')}
        onCancel={() => setAsking(null)}
      >
        {commentField('Say what needs to change; kept with the revision in the plan’s history.')}
      </ConfirmDialog>
    </>
  ) : null;

  const inputs = (
    <>
      {revision.data.exceptionNote ? (
        <Notice tone="caution" title={`Submitted as an exception by ${revision.data.submittedBy.name}`}>
          <AppText>{revision.data.exceptionNote}</AppText>
        </Notice>
      ) : null}
      <PlanPackageLink planId={p.id} revision={latest} />
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
      <AppText variant="small" tone="muted">
        Approving or returning asks once more and says what will happen; your comment is written there.
      </AppText>
      <FormError message={formError} />
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>{decisionButtons}</View>
    </Card>
  ) : null;
  // On a phone the decision stays at the bottom of the screen while the revision scrolls above it.
  const footer =
    open && !wide ? (
      <>
        <AppText variant="label" style={{ flexBasis: '100%' }}>
          Your decision on revision {latest}
        </AppText>
        {decisionButtons}
      </>
    ) : undefined;

  return (
    <Screen
      title={`Review: ${p.title} · v${p.version}`}
      subtitle={`${p.siteName} · revision ${latest} submitted by ${revision.data.submittedBy.name}, ${when(revision.data.submittedAt)}`}
      actions={<PlanStatusBadge status={p.status} />}
      maxWidth={1400}
      footer={footer}
    >
      {dialogs}
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
        </>
      )}
    </Screen>
  );
}

import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { diffSnapshots } from '@/shared/plans/diff-snapshots';
import { usePlan, usePlanHistory, usePlanRevision } from '@/components/data/plans';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { colors, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { PlanStatusBadge } from './plan-status';
import { SnapshotDiffView } from './snapshot-diff-view';
import { VerdictSummary } from './verdict-summary';
import { when } from './when';

const STEP = { prepared: 'Prepared', submitted: 'Submitted', returned: 'Returned', approved: 'Approved' } as const;

/** Revisions, the signature chain (prepared → reviewed → approved) and the difference between any two revisions. */
export function PlanHistory({ planId }: { planId: string }) {
  const { wide } = useLayout();
  const plan = usePlan(planId);
  const history = usePlanHistory(planId);
  const count = history.data?.revisions.length ?? 0;
  const [pair, setPair] = useState<{ from: number; to: number } | null>(null);
  const from = pair?.from ?? Math.max(1, count - 1);
  const to = pair?.to ?? count;
  const a = usePlanRevision(planId, count > 1 ? from : null);
  const b = usePlanRevision(planId, count > 1 ? to : null);

  if (plan.isPending || history.isPending) return <LoadingState label="Loading the history…" />;
  if (plan.isError) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  if (history.isError) return <ErrorState error={history.error} onRetry={() => void history.refetch()} />;
  const { revisions, reviews, signatures } = history.data;
  const numbers = revisions.map((r) => r.number);

  return (
    <Screen
      title={`History: ${plan.data.title} · v${plan.data.version}`}
      subtitle={`${plan.data.siteName} · ${revisions.length} revision${revisions.length === 1 ? '' : 's'}`}
      actions={<PlanStatusBadge status={plan.data.status} />}
    >
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        <View style={{ flex: wide ? 2 : undefined, width: wide ? undefined : '100%', gap: space.lg }}>
          <Card style={{ gap: 0 }} aria-label="Signature chain">
            <AppText variant="heading" style={{ marginBottom: space.sm }}>
              Signature chain
            </AppText>
            {signatures.map((s, i) => (
              <View key={`${s.step}-${s.at}-${i}`} style={styles.step} role="listitem">
                <View style={styles.rail}>
                  <View
                    style={[
                      styles.dot,
                      s.step === 'approved' && { backgroundColor: colors.moss },
                      s.step === 'returned' && { backgroundColor: colors.danger },
                    ]}
                  />
                  {i < signatures.length - 1 ? <View style={styles.line} /> : null}
                </View>
                <View style={{ flex: 1, paddingBottom: space.md, gap: 2 }}>
                  <AppText variant="label">
                    {STEP[s.step]}
                    {s.revision !== null ? ` · revision ${s.revision}` : ''}
                  </AppText>
                  <AppText variant="small">
                    {s.person.name} ({s.person.role}) · {when(s.at)}
                  </AppText>
                  {s.step === 'submitted'
                    ? revisions
                        .filter((r) => r.number === s.revision && r.exceptionNote)
                        .map((r) => (
                          <AppText key={r.number} variant="small" tone="danger">
                            Submitted as an exception: “{r.exceptionNote}”
                          </AppText>
                        ))
                    : null}
                  {s.step === 'returned' || s.step === 'approved'
                    ? reviews
                        .filter((r) => r.at === s.at)
                        .map((r) => (
                          <View key={r.at} style={{ gap: 2 }}>
                            {r.comment ? (
                              <AppText variant="small" tone="muted">
                                “{r.comment}”
                              </AppText>
                            ) : null}
                            {r.justification ? (
                              <AppText variant="small" tone="danger">
                                Approved as an exception: “{r.justification}”
                              </AppText>
                            ) : null}
                          </View>
                        ))
                    : null}
                </View>
              </View>
            ))}
          </Card>
          <Card style={{ gap: space.xs }} aria-label="Revisions">
            <AppText variant="heading">Revisions</AppText>
            {revisions.length === 0 ? <AppText tone="muted">Not submitted yet.</AppText> : null}
            {revisions.map((r) => (
              <View key={r.number} style={{ gap: 2, paddingVertical: space.xs }}>
                <AppText variant="label">
                  Revision {r.number} · {when(r.submittedAt)}
                </AppText>
                <AppText variant="small" tone="muted" selectable>
                  by {r.submittedBy.name} · sha256 {r.contentHash}
                </AppText>
                {r.verdict ? <VerdictSummary verdict={r.verdict} /> : null}
              </View>
            ))}
          </Card>
        </View>
        <View style={{ flex: wide ? 3 : undefined, width: wide ? undefined : '100%', gap: space.lg }}>
          <AppText variant="heading">Compare revisions</AppText>
          {count < 2 ? (
            <EmptyState
              title="Nothing to compare yet"
              body="Once the plan has been submitted twice, the differences between revisions show here."
            />
          ) : (
            <>
              <ChipRow label="From">
                {numbers.map((n) => (
                  <Chip key={n} label={`Rev. ${n}`} on={n === from} onPress={() => setPair({ from: n, to })} />
                ))}
              </ChipRow>
              <ChipRow label="To">
                {numbers.map((n) => (
                  <Chip key={n} label={`Rev. ${n}`} on={n === to} onPress={() => setPair({ from, to: n })} />
                ))}
              </ChipRow>
              {a.isError || b.isError ? (
                <ErrorState error={a.error ?? b.error} onRetry={() => void (a.refetch(), b.refetch())} />
              ) : a.data && b.data ? (
                <SnapshotDiffView diff={diffSnapshots(a.data.snapshot, b.data.snapshot)} from={from} to={to} />
              ) : (
                <LoadingState label="Loading both revisions…" />
              )}
            </>
          )}
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  step: { flexDirection: 'row', gap: space.md },
  rail: { width: 14, alignItems: 'center' },
  dot: { width: 12, height: 12, borderRadius: 6, backgroundColor: colors.ember, marginTop: 3 },
  line: { flex: 1, width: 2, backgroundColor: colors.line, marginTop: 2 },
});

import { StyleSheet, View } from 'react-native';
import type { PlanStatus } from '@/shared/schemas/plan';
import { usePlans } from '@/components/data/plans';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { colors, radius, space } from '@/components/ui/theme';

const STATUS: Record<PlanStatus, { label: string; bg: string; fg: string }> = {
  draft: { label: 'Draft', bg: colors.paper, fg: colors.ink },
  submitted: { label: 'Awaiting review', bg: colors.cautionSoft, fg: colors.ink },
  returned: { label: 'Returned', bg: colors.dangerSoft, fg: colors.danger },
  approved: { label: 'Approved', bg: colors.mossSoft, fg: colors.moss },
  superseded: { label: 'Superseded', bg: colors.paper, fg: colors.muted },
};

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** The site's coverage plans with their status and who prepared them. */
export function SitePlans({ siteId }: { siteId: string }) {
  const plans = usePlans({ siteId });
  if (plans.isPending) return <LoadingState label="Loading plans…" />;
  if (plans.isError) return <ErrorState error={plans.error} onRetry={() => void plans.refetch()} />;
  if (plans.data.length === 0)
    return (
      <EmptyState
        title="No plans yet"
        body="A coverage plan picks posts, targets and conditions and is checked against your standard."
      />
    );
  return (
    <View style={{ gap: space.sm }}>
      {plans.data.map((p) => (
        <Card key={p.id} aria-label={p.title} style={{ gap: 2 }}>
          <View style={{ flexDirection: 'row', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' }}>
            <AppText variant="label">
              {p.title} · v{p.version}
            </AppText>
            <AppText variant="small" style={[styles.badge, { backgroundColor: STATUS[p.status].bg, color: STATUS[p.status].fg }]}>
              {STATUS[p.status].label}
            </AppText>
          </View>
          <AppText variant="small" tone="muted">
            {plural(p.postIds.length, 'post')} · {plural(p.targetIds.length, 'target')} · standard ≥ {p.standard.minSeenPct} % seen, priority zones by
            ≥ {p.standard.priorityMinPosts} · prepared by {p.preparedBy.name}
          </AppText>
        </Card>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  badge: { paddingHorizontal: space.sm, paddingVertical: 2, borderRadius: radius.pill, overflow: 'hidden' },
});

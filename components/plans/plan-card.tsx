import { useRouter } from 'expo-router';
import { Pressable, View } from 'react-native';
import type { Plan } from '@/shared/schemas/plan';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { space } from '@/components/ui/theme';
import { PlanStatusBadge } from './plan-status';
import { when } from './when';

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** One plan in a list; opens the plan's page. */
export function PlanCard({ plan, showSite, waiting }: { plan: Plan; showSite?: boolean; waiting?: boolean }) {
  const router = useRouter();
  return (
    <Pressable
      role="link"
      aria-label={`${plan.title}, version ${plan.version}`}
      onPress={() => router.navigate({ pathname: '/plans/[planId]', params: { planId: plan.id } })}
    >
      <Card style={{ gap: 2 }}>
        <View style={{ flexDirection: 'row', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' }}>
          <AppText variant="label" style={{ flexShrink: 1 }}>
            {plan.title} · v{plan.version}
          </AppText>
          <PlanStatusBadge status={plan.status} />
        </View>
        <AppText variant="small" tone="muted">
          {showSite ? `${plan.siteName} · ` : ''}
          {plural(plan.postIds.length, 'post')} · {plural(plan.targetIds.length, 'target')} · standard ≥{' '}
          {plan.standard.minSeenPct} % seen, priority zones by ≥ {plan.standard.priorityMinPosts} · prepared by{' '}
          {plan.preparedBy.name}
        </AppText>
        {waiting && plan.submittedAt ? <AppText variant="small">Waiting since {when(plan.submittedAt)}</AppText> : null}
      </Card>
    </Pressable>
  );
}

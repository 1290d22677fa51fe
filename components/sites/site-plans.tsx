import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { usePlans } from '@/components/data/plans';
import { useSession } from '@/components/data/session';
import { PlanCard } from '@/components/plans/plan-card';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { space } from '@/components/ui/theme';

/** The site's coverage plans with their status and who prepared them; planners start new ones here. */
export function SitePlans({ siteId }: { siteId: string }) {
  const plans = usePlans({ siteId, pageSize: 200 });
  const { data: user } = useSession();
  const router = useRouter();
  const add =
    user?.role === 'planner' ? (
      <Button
        kind="secondary"
        label="New plan for this site"
        onPress={() => router.navigate({ pathname: '/plans/new', params: { siteId } })}
      />
    ) : null;
  if (plans.isPending) return <LoadingState label="Loading plans…" />;
  if (plans.isError) return <ErrorState error={plans.error} onRetry={() => void plans.refetch()} />;
  if (plans.data.items.length === 0)
    return (
      <EmptyState
        title="No plans yet"
        body={`A coverage plan picks posts, targets and conditions and is checked against your standard. ${add ? 'Place the site’s posts first, then start one here.' : 'A planner prepares them; you see them here once they exist.'}`}
        action={add}
      />
    );
  return (
    <View style={{ gap: space.sm }}>
      {plans.data.items.map((p) => (
        <PlanCard key={p.id} plan={p} />
      ))}
      {add ? <View style={{ alignSelf: 'flex-start' }}>{add}</View> : null}
    </View>
  );
}

import { useState } from 'react';
import { View } from 'react-native';
import { useQuery } from '@tanstack/react-query';
import { plansQuery } from '@/components/data/plans';
import { useSession } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Pager } from '@/components/ui/pager';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { PlanCard } from './plan-card';

/** A reviewer's queue: submitted plans prepared by others, the longest waiting first. */
export function ReviewQueue() {
  const { data: user } = useSession();
  const [page, setPage] = useState(1);
  const reviewer = user?.role === 'reviewer';
  const plans = useQuery({ ...plansQuery({ queue: 'review', sort: 'submittedAt', page, pageSize: 20 }), enabled: reviewer });
  if (!reviewer) {
    return (
      <Screen title="Review queue">
        <Notice tone="info">
          <AppText>Only reviewers have a review queue.</AppText>
        </Notice>
      </Screen>
    );
  }
  return (
    <Screen title="Review queue" subtitle="Submitted plans prepared by others, the longest waiting first.">
      {plans.isPending ? (
        <LoadingState label="Loading the queue…" />
      ) : plans.isError ? (
        <ErrorState error={plans.error} onRetry={() => void plans.refetch()} />
      ) : plans.data.items.length === 0 ? (
        <EmptyState title="Nothing waiting" body="When a planner submits a plan, it appears here and you get an e-mail." />
      ) : (
        <View style={{ gap: space.sm }}>
          {plans.data.items.map((p) => (
            <PlanCard key={p.id} plan={p} showSite waiting />
          ))}
          <Pager page={plans.data.page} pageSize={plans.data.pageSize} total={plans.data.total} onPage={setPage} />
        </View>
      )}
    </Screen>
  );
}

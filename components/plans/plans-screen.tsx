import { useQuery } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { PLAN_STATUSES, type PlanStatus } from '@/shared/schemas/plan';
import { plansQuery, usePlans, type PlanFilter } from '@/components/data/plans';
import { useSession } from '@/components/data/session';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow, toggled } from '@/components/ui/chip';
import { Pager } from '@/components/ui/pager';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { PlanCard } from './plan-card';
import { PLAN_STATUS } from './plan-status';

const SORTS = [
  { value: '-updatedAt', label: 'Recently changed' },
  { value: 'title', label: 'Title A–Z' },
  { value: '-submittedAt', label: 'Recently submitted' },
] as const;
const PAGE_SIZE = 20;

/** Every plan of the organisation, across sites: filter by status, search titles, sort, page. */
export function PlansScreen() {
  const router = useRouter();
  const { wide } = useLayout();
  const { data: user } = useSession();
  const observer = user?.role === 'observer';
  const [statuses, setStatuses] = useState<PlanStatus[]>([]);
  const [text, setText] = useState('');
  const [sort, setSort] = useState<(typeof SORTS)[number]['value']>('-updatedAt');
  const [page, setPage] = useState(1);
  const filter: PlanFilter = { status: statuses.join(','), q: text.trim(), sort, page, pageSize: PAGE_SIZE };
  const plans = usePlans(filter);
  const showQueue = user?.role === 'reviewer';
  const queue = useQuery({ ...plansQuery({ queue: 'review', pageSize: 1 }), enabled: showQueue });

  const flip = (s: PlanStatus) => {
    setPage(1);
    setStatuses((list) => toggled(list, s));
  };

  return (
    <Screen
      title="Coverage plans"
      subtitle={observer ? 'Approved plans your organisation works to.' : 'Every plan of your organisation, on every site.'}
      actions={user?.role === 'planner' ? <Button label="New plan" onPress={() => router.navigate('/plans/new')} /> : null}
    >
      {showQueue ? (
        <Card
          accent="ember"
          style={{ flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', flexWrap: 'wrap' }}
        >
          <View style={{ gap: 2, flexShrink: 1 }}>
            <AppText variant="heading">Your review queue</AppText>
            <AppText tone="muted">
              {queue.data
                ? queue.data.total === 0
                  ? 'Nothing is waiting for you.'
                  : `${queue.data.total} plan${queue.data.total === 1 ? ' is' : 's are'} waiting for a decision.`
                : 'Counting…'}
            </AppText>
          </View>
          <Button label="Open the queue" kind="secondary" onPress={() => router.navigate('/plans/queue')} />
        </Card>
      ) : null}
      <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        <View style={{ width: wide ? 300 : '100%', gap: space.md }} role="group" aria-label="Filter plans">
          <TextField
            label="Search titles"
            value={text}
            onChangeText={(t) => {
              setText(t);
              setPage(1);
            }}
            placeholder="e.g. fire season"
          />
          {observer ? null : (
            <ChipRow label="Status">
              {PLAN_STATUSES.map((s) => (
                <Chip key={s} label={PLAN_STATUS[s].label} on={statuses.includes(s)} onPress={() => flip(s)} />
              ))}
            </ChipRow>
          )}
          <ChipRow label="Order">
            {SORTS.map((s) => (
              <Chip
                key={s.value}
                label={s.label}
                on={sort === s.value}
                onPress={() => {
                  setSort(s.value);
                  setPage(1);
                }}
              />
            ))}
          </ChipRow>
        </View>
        <View style={{ flex: wide ? 1 : undefined, width: wide ? undefined : '100%', gap: space.sm }}>
          {plans.isPending ? (
            <LoadingState label="Loading plans…" />
          ) : plans.isError ? (
            <ErrorState error={plans.error} onRetry={() => void plans.refetch()} />
          ) : plans.data.items.length === 0 ? (
            <EmptyState
              title={statuses.length || text ? 'No plan matches' : 'No plans yet'}
              body={
                statuses.length || text
                  ? 'Loosen the filters to see more.'
                  : `A coverage plan picks posts, targets and conditions on a site and is checked against your standard.${user?.role === 'planner' ? ' Start one with New plan once a site has posts.' : ' Planners prepare them; they appear here once they exist.'}`
              }
            />
          ) : (
            <>
              {plans.data.items.map((p) => (
                <PlanCard key={p.id} plan={p} showSite />
              ))}
              <Pager page={plans.data.page} pageSize={plans.data.pageSize} total={plans.data.total} onPage={setPage} />
            </>
          )}
        </View>
      </View>
    </Screen>
  );
}

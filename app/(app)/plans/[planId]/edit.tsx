import { usePlan } from '@/components/data/plans';
import { usePlanId } from '@/components/plans/use-plan-id';
import { AppText } from '@/components/ui/app-text';
import { BadAddress } from '@/components/ui/bad-address';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { documentTitle, PageTitle } from '@/components/ui/page-title';
import { deferredScreen } from '@/components/shell/deferred-screen';

const PlanEditor = deferredScreen('PlanEditor');

function EditPlanRouteContent() {
  const planId = usePlanId();
  return planId ? <EditPlan planId={planId} /> : <BadAddress title="Edit plan" what="a plan" />;
}

function EditPlan({ planId }: { planId: string }) {
  const plan = usePlan(planId);
  if (plan.isPending) return <LoadingState label="Loading the plan…" />;
  if (plan.isError) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  const editable = plan.data.status === 'draft' || plan.data.status === 'returned';
  return (
    <Screen title="Edit coverage plan" subtitle={plan.data.siteName} maxWidth={760}>
      {editable ? (
        <PlanEditor plan={plan.data} />
      ) : (
        <Notice tone="caution">
          <AppText>
            A {plan.data.status} plan cannot be edited. Open the plan and start a new version to change an approved plan.
          </AppText>
        </Notice>
      )}
    </Screen>
  );
}

/** The tab's title until the page below names itself more precisely. */
export default function EditPlanRoute() {
  return (
    <>
      <PageTitle title={documentTitle('Edit plan')} />
      <EditPlanRouteContent />
    </>
  );
}

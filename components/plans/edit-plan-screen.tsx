import { isEditablePlanStatus } from '@/shared/plans/editable-plan-statuses';
import { usePlan } from '@/components/data/plans';
import { PlanEditor } from '@/components/plans/plan-editor';
import { AppText } from '@/components/ui/app-text';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';

/** Editing a draft or returned plan; any other status says why it cannot be edited. */
export function EditPlanScreen({ planId }: { planId: string }) {
  const plan = usePlan(planId);
  if (plan.isPending) return <LoadingState label="Loading the plan…" />;
  if (plan.isError) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  const editable = isEditablePlanStatus(plan.data.status);
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

import type { Plan, PlanSnapshot } from '@/shared/schemas/plan';
import { isEditablePlanStatus } from '@/shared/plans/editable-plan-statuses';
import { usePlanHistory, usePlanPreview, usePlanRevision } from '@/components/data/plans';

/** Whether a plan can still change (draft or returned). */
export const isEditablePlan = (plan: Pick<Plan, 'status'>) => isEditablePlanStatus(plan.status);

/**
 * What a plan stands on: today's preview for a draft or returned plan, its
 * latest frozen revision otherwise (null when it was never submitted).
 */
export function usePlanSnapshot(plan: Plan | undefined): {
  snapshot: PlanSnapshot | null | undefined;
  error: Error | null;
} {
  const editable = plan ? isEditablePlan(plan) : false;
  const preview = usePlanPreview(plan?.id ?? '', !!plan && editable);
  const history = usePlanHistory(plan?.id ?? '', !!plan && !editable);
  const latest = history.data?.revisions.at(-1)?.number ?? null;
  const revision = usePlanRevision(plan?.id ?? '', plan && !editable ? latest : null);
  if (!plan) return { snapshot: undefined, error: null };
  if (editable) return { snapshot: preview.data, error: preview.error };
  if (history.isError) return { snapshot: undefined, error: history.error };
  if (history.data && latest === null) return { snapshot: null, error: null };
  return { snapshot: revision.data?.snapshot, error: revision.error };
}

import { PlanHistory } from '@/components/plans/plan-history';
import { usePlanId } from '@/components/plans/use-plan-id';
import { BadAddress } from '@/components/ui/bad-address';

export default function PlanHistoryRoute() {
  const planId = usePlanId();
  return planId ? <PlanHistory planId={planId} /> : <BadAddress title="History" what="a plan" />;
}

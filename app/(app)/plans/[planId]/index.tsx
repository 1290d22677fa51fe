import { PlanOverview } from '@/components/plans/plan-overview';
import { usePlanId } from '@/components/plans/use-plan-id';
import { BadAddress } from '@/components/ui/bad-address';

export default function PlanRoute() {
  const planId = usePlanId();
  return planId ? <PlanOverview planId={planId} /> : <BadAddress title="Plan" what="a plan" />;
}

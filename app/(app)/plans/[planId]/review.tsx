import { ReviewPanel } from '@/components/plans/review-panel';
import { usePlanId } from '@/components/plans/use-plan-id';
import { BadAddress } from '@/components/ui/bad-address';

export default function ReviewRoute() {
  const planId = usePlanId();
  return planId ? <ReviewPanel planId={planId} /> : <BadAddress title="Review" what="a plan" />;
}

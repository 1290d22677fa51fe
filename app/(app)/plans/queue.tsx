import { ReviewQueue } from '@/components/plans/review-queue';

export default function ReviewQueueRoute() {
  return <ReviewQueue />;
}

import { useIdParams } from '@/components/data/route-params';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { BadAddress } from '@/components/ui/bad-address';

const AttemptScreen = deferredScreen('AttemptScreen');

/** `/training/attempt?courseId=&attemptId=`: one course attempt, question by question. */
export default function AttemptRoute() {
  const ids = useIdParams(['courseId', 'attemptId']);
  if (!ids) return <BadAddress title="Course attempt" what="a course attempt" />;
  return <AttemptScreen courseId={ids.courseId} attemptId={ids.attemptId} />;
}

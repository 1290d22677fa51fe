import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { deferredScreen } from '@/components/shell/deferred-screen';
import { BadAddress } from '@/components/ui/bad-address';

const AttemptScreen = deferredScreen('AttemptScreen');

const Params = z.object({ courseId: z.uuid(), attemptId: z.uuid() });

/** `/training/attempt?courseId=&attemptId=`: one course attempt, question by question. */
export default function AttemptRoute() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) return <BadAddress title="Course attempt" what="a course attempt" />;
  return <AttemptScreen courseId={parsed.data.courseId} attemptId={parsed.data.attemptId} />;
}

import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { PlanEditor } from '@/components/plans/plan-editor';
import { Screen } from '@/components/ui/screen';

const Params = z.object({ siteId: z.uuid().optional().catch(undefined) });

export default function NewPlanRoute() {
  const { siteId } = Params.parse(useLocalSearchParams());
  return (
    <Screen
      title="New coverage plan"
      subtitle="Pick the posts, targets and conditions, and the standard the plan must meet."
      maxWidth={760}
    >
      <PlanEditor siteId={siteId} />
    </Screen>
  );
}

import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';
import { PlanCompareScreen } from '@/components/plans/plan-compare-screen';
import { BadAddress } from '@/components/ui/bad-address';

const Params = z.object({ a: z.uuid().optional(), b: z.uuid().optional() });

export default function ComparePlansRoute() {
  const parsed = Params.safeParse(useLocalSearchParams());
  if (!parsed.success) return <BadAddress title="Compare plans" what="two plans" />;
  return <PlanCompareScreen a={parsed.data.a ?? null} b={parsed.data.b ?? null} />;
}

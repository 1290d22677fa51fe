import { useLocalSearchParams } from 'expo-router';
import { z } from 'zod';

const Params = z.object({ planId: z.uuid() });

/** The `[planId]` of the current route, or null when it is not a plan id. */
export function usePlanId(): string | null {
  const parsed = Params.safeParse(useLocalSearchParams());
  return parsed.success ? parsed.data.planId : null;
}

import { useIdParams } from '@/components/data/route-params';

/** The `[planId]` of the current route, or null when it is not a plan id. */
export function usePlanId(): string | null {
  return useIdParams(['planId'])?.planId ?? null;
}

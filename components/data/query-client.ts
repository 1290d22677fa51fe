import { QueryClient } from '@tanstack/react-query';
import { ApiRequestError } from './api-client';

/** How long fetched data counts as fresh. */
export const STALE = {
  session: 5 * 60_000,
  list: 30_000,
  reference: 10 * 60_000,
} as const;

export function createQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: STALE.list,
        // 4xx answers are final; retry only network trouble and 5xx.
        retry: (count, error) => !(error instanceof ApiRequestError && error.status < 500) && count < 2,
        refetchOnWindowFocus: false,
      },
    },
  });
}

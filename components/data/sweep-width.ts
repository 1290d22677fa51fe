import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import {
  SweepWidthResultSchema,
  SweepWidthTableListSchema,
  type SweepWidthRequest,
  type SweepWidthResult,
} from '@/shared/schemas/sweep-width';
import { evaluateSweep } from '@/shared/sightline/evaluate-sweep';
import { api, NetworkError } from './api-client';
import { STALE } from './query-client';
import type { ComputedOn } from './sightline';

export const sweepWidthKeys = {
  all: ['sweep-width'] as const,
  tables: () => [...sweepWidthKeys.all, 'tables'] as const,
};

/** The organisation's sweep-width tables that are not retired. */
export const sweepWidthTablesQuery = () =>
  queryOptions({
    queryKey: sweepWidthKeys.tables(),
    staleTime: STALE.reference,
    queryFn: async () => (await api.get('/v1/sweep-width-tables', SweepWidthTableListSchema)).items,
  });

export const useSweepWidthTables = () => useQuery(sweepWidthTablesQuery());

/**
 * W → C → POD. The server answers when it can be reached; offline the same
 * pure core runs on the device, and the answer says so.
 */
export function useEvaluateSweep() {
  return useMutation({
    mutationFn: async (request: SweepWidthRequest): Promise<SweepWidthResult & { computedOn: ComputedOn }> => {
      try {
        return { ...(await api.post('/v1/sweep-width', request, SweepWidthResultSchema)), computedOn: 'server' };
      } catch (e) {
        if (e instanceof NetworkError) return { ...evaluateSweep(request), computedOn: 'device' };
        throw e;
      }
    },
  });
}

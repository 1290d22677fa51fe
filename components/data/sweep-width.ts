import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  SweepWidthResultSchema,
  SweepWidthTableListSchema,
  SweepWidthTableSchema,
  type SweepWidthRequest,
  type SweepWidthTableInput,
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

const TableAnswer = z.object({ table: SweepWidthTableSchema });

/** Adds a sweep-width table (planners). */
export function useCreateSweepWidthTable() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SweepWidthTableInput) => api.post('/v1/sweep-width-tables', input, TableAnswer),
    onSuccess: () => qc.invalidateQueries({ queryKey: sweepWidthKeys.tables() }),
  });
}

/** Retires a table (planners): kept for the record, no longer offered. */
export function useRetireSweepWidthTable() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, version }: { id: string; version: number }) =>
      api.post(`/v1/sweep-width-tables/${id}/retire`, { version }, TableAnswer),
    onSuccess: () => qc.invalidateQueries({ queryKey: sweepWidthKeys.tables() }),
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ConditionSetListSchema, TargetListSchema, TargetSchema, type TargetInput } from '@/shared/schemas/library';
import { api } from './api-client';
import { STALE } from './query-client';

export const libraryKeys = {
  all: ['library'] as const,
  targets: () => [...libraryKeys.all, 'targets'] as const,
  conditions: () => [...libraryKeys.all, 'conditions'] as const,
};

export const targetsQuery = () =>
  queryOptions({
    queryKey: libraryKeys.targets(),
    staleTime: STALE.reference,
    queryFn: async () => (await api.get('/v1/targets', TargetListSchema)).items,
  });

export const conditionSetsQuery = () =>
  queryOptions({
    queryKey: libraryKeys.conditions(),
    staleTime: STALE.reference,
    queryFn: async () => (await api.get('/v1/conditions', ConditionSetListSchema)).items,
  });

export const useTargets = () => useQuery(targetsQuery());
export const useConditionSets = () => useQuery(conditionSetsQuery());

export function useCreateTarget() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: TargetInput) => api.post('/v1/targets', input, z.object({ target: TargetSchema })),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.targets() }),
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  ConditionSetListSchema,
  ConditionSetSchema,
  TargetListSchema,
  TargetSchema,
  type ConditionSet,
  type ConditionSetInput,
  type Target,
  type TargetInput,
} from '@/shared/schemas/library';
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

export function useCreateConditionSet() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ConditionSetInput) => api.post('/v1/conditions', input, z.object({ conditionSet: ConditionSetSchema })),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.conditions() }),
  });
}

/** Saves changes to a target with the version last seen (409 `stale_version` when someone else saved first). */
export function useUpdateTarget(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (input: Partial<TargetInput> & { version: number }): Promise<Target> =>
      (await api.patch(`/v1/targets/${id}`, input, z.object({ target: TargetSchema }))).target,
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.targets() }),
  });
}

/** Replaces a condition set, with the version last seen (409 `stale_version` when someone else saved first). */
export function useUpdateConditionSet(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (input: ConditionSetInput & { version: number }): Promise<ConditionSet> =>
      (await api.patch(`/v1/conditions/${id}`, input, z.object({ conditionSet: ConditionSetSchema }))).conditionSet,
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.conditions() }),
  });
}

/** Re-reads the library lists (after a version conflict). */
export function useReloadLibrary() {
  const qc = useQueryClient();
  return () => qc.invalidateQueries({ queryKey: libraryKeys.all });
}

/** Retires (removes) a target or a condition set (soft: plans that used it keep their frozen copy). */
export function useRemoveLibraryEntry(kind: 'targets' | 'conditions') {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete(`/v1/${kind}/${id}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: kind === 'targets' ? libraryKeys.targets() : libraryKeys.conditions() }),
  });
}

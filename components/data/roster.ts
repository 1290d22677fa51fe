import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { AssignmentSchema, BriefingSchema, PeopleSchema, RosterSchema, type AssignmentInput } from '@/shared/schemas/assignment';
import { api } from './api-client';
import { STALE } from './query-client';

export const rosterKeys = {
  all: ['roster'] as const,
  site: (siteId: string, from: string, to: string) => [...rosterKeys.all, 'site', siteId, from, to] as const,
  people: () => [...rosterKeys.all, 'people'] as const,
  briefing: () => [...rosterKeys.all, 'briefing'] as const,
};

export const siteRosterQuery = (siteId: string, from: string, to: string) =>
  queryOptions({
    queryKey: rosterKeys.site(siteId, from, to),
    queryFn: () => api.get(`/v1/sites/${siteId}/roster?${new URLSearchParams({ from, to })}`, RosterSchema),
  });

export const peopleQuery = () =>
  queryOptions({
    queryKey: rosterKeys.people(),
    staleTime: STALE.reference,
    queryFn: async () => (await api.get('/v1/people', PeopleSchema)).items,
  });

export const briefingQuery = () =>
  queryOptions({ queryKey: rosterKeys.briefing(), queryFn: () => api.get('/v1/briefing', BriefingSchema) });

export const useSiteRoster = (siteId: string, from: string, to: string) => useQuery(siteRosterQuery(siteId, from, to));
export const usePeople = (enabled: boolean) => useQuery({ ...peopleQuery(), enabled });
export const useBriefing = () => useQuery(briefingQuery());

/** Watches change rosters and briefings: refresh everything under the roster key. */
function useRosterMutation<V, R>(mutationFn: (vars: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn, onSuccess: () => qc.invalidateQueries({ queryKey: rosterKeys.all }) });
}

export const useCreateAssignment = () =>
  useRosterMutation((input: AssignmentInput) =>
    api.post(
      '/v1/assignments',
      input,
      // `warnings`: courses the person is not qualified in (the watch is kept; see the trainer).
      z.object({ assignment: AssignmentSchema, warnings: z.array(z.string()).default([]) }),
    ),
  );

export const useDeleteAssignment = () => useRosterMutation((id: string) => api.delete(`/v1/assignments/${id}`));

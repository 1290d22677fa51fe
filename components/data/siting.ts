import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ACTIVE_RUN_STATUSES } from '@/shared/schemas/coverage';
import { PlanSchema } from '@/shared/schemas/plan';
import { SitingRunSchema, type SitingRun, type SitingRunInput } from '@/shared/schemas/siting';
import { api } from './api-client';
import { RUN_POLL_MS } from './coverage';
import { planKeys } from './plans';
import { siteKeys } from './sites';

export const sitingKeys = {
  all: ['siting'] as const,
  site: (siteId: string) => [...sitingKeys.all, 'site', siteId] as const,
  run: (runId: string) => [...sitingKeys.all, 'run', runId] as const,
};

const RunBody = z.object({ run: SitingRunSchema });
const ListBody = z.object({ items: z.array(SitingRunSchema) });

/** Whether a run may still change (queued or running). */
export const isActiveSiting = (run: Pick<SitingRun, 'status'> | null | undefined): boolean =>
  !!run && ACTIVE_RUN_STATUSES.includes(run.status);

/** The site's newest siting runs. */
export const siteSitingRunsQuery = (siteId: string) =>
  queryOptions({
    queryKey: sitingKeys.site(siteId),
    queryFn: async () => (await api.get(`/v1/sites/${siteId}/siting-runs`, ListBody)).items,
  });

/** One run, asked again every second while it is active; a finished one does not change (but may get a plan). */
export const sitingRunQuery = (runId: string) =>
  queryOptions({
    queryKey: sitingKeys.run(runId),
    queryFn: async () => (await api.get(`/v1/siting-runs/${runId}`, RunBody)).run,
    refetchInterval: (q) => (isActiveSiting(q.state.data) ? RUN_POLL_MS : false),
  });

export const useSiteSitingRuns = (siteId: string) => useQuery(siteSitingRunsQuery(siteId));
export const useSitingRun = (runId: string | null) => useQuery({ ...sitingRunQuery(runId ?? ''), enabled: runId !== null });

function useStoreRun(siteId: string) {
  const qc = useQueryClient();
  return async (run: SitingRun) => {
    qc.setQueryData(sitingKeys.run(run.id), run);
    await qc.invalidateQueries({ queryKey: sitingKeys.site(siteId) });
  };
}

/** Starts a siting run on the site. */
export function useStartSiting(siteId: string) {
  const store = useStoreRun(siteId);
  return useMutation({
    mutationFn: async (input: SitingRunInput) => (await api.post(`/v1/sites/${siteId}/siting-runs`, input, RunBody)).run,
    onSuccess: store,
  });
}

/** Stops a queued or running run (it keeps nothing). */
export function useCancelSiting(siteId: string) {
  const store = useStoreRun(siteId);
  return useMutation({
    mutationFn: async (runId: string) => (await api.post(`/v1/siting-runs/${runId}/cancel`, {}, RunBody)).run,
    onSuccess: store,
  });
}

/** Makes the draft plan of a finished run (new proposed towers on the site as needed). */
export function useSitingPlan(siteId: string, runId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async () => (await api.post(`/v1/siting-runs/${runId}/plan`, {}, z.object({ plan: PlanSchema }))).plan,
    onSuccess: async () => {
      await Promise.all([
        qc.invalidateQueries({ queryKey: sitingKeys.run(runId) }),
        qc.invalidateQueries({ queryKey: planKeys.lists() }),
        qc.invalidateQueries({ queryKey: siteKeys.all }),
      ]);
      await qc.invalidateQueries({ queryKey: sitingKeys.site(siteId) });
    },
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { z } from 'zod';
import {
  ACTIVE_RUN_STATUSES,
  CoverageComparisonSchema,
  CoverageRunSchema,
  EncodedClassRasterSchema,
  HourlySeriesSchema,
  PlanCoverageSchema,
  type CoverageLayerName,
  type CoverageRun,
  type PlanCoverage,
} from '@/shared/schemas/coverage';
import { api } from './api-client';
import { STALE } from './query-client';

/** How often an active run is asked for its progress, ms. */
export const RUN_POLL_MS = 1000;

/** Which layer of which case (and, for one post's classes, which post). */
export interface CoverageLayerRequest {
  layer: CoverageLayerName;
  caseKey: string;
  postId?: string;
}

/** What to compare: run `a` ("before") against run `b` ("after") for a case (and b's own case when it differs). */
export interface CoverageCompareRequest {
  a: string;
  b: string;
  caseKey: string;
  caseKeyB?: string;
}

export const coverageKeys = {
  all: ['coverage'] as const,
  plans: () => [...coverageKeys.all, 'plan'] as const,
  plan: (planId: string) => [...coverageKeys.plans(), planId] as const,
  run: (runId: string) => [...coverageKeys.all, 'run', runId] as const,
  layer: (runId: string, request: CoverageLayerRequest) => [...coverageKeys.run(runId), 'layer', request] as const,
  compare: (request: CoverageCompareRequest) => [...coverageKeys.all, 'compare', request] as const,
};

const RunBody = z.object({ run: CoverageRunSchema });

/** Whether a run may still change (queued or running). */
export const isActiveRun = (run: Pick<CoverageRun, 'status'> | null | undefined): boolean =>
  !!run && ACTIVE_RUN_STATUSES.includes(run.status);

const params = (values: Record<string, string | undefined>) => {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(values)) if (v !== undefined && v !== '') q.set(k, v);
  return q.toString();
};

/** The plan's coverage today: the run for its current inputs, the newest run, and whether the site has terrain. */
export const planCoverageQuery = (planId: string) =>
  queryOptions({
    queryKey: coverageKeys.plan(planId),
    queryFn: () => api.get(`/v1/plans/${planId}/coverage`, PlanCoverageSchema),
  });

/** One run. A finished run never changes, so it is kept for good; an active one is asked again every second. */
export const coverageRunQuery = (runId: string) =>
  queryOptions({
    queryKey: coverageKeys.run(runId),
    queryFn: async () => (await api.get(`/v1/coverage-runs/${runId}`, RunBody)).run,
    staleTime: (q) => (q.state.data && !isActiveRun(q.state.data) ? Infinity : 0),
    refetchInterval: (q) => (isActiveRun(q.state.data) ? RUN_POLL_MS : false),
  });

/** One layer of a finished run (never changes). */
export const coverageLayerQuery = (runId: string, request: CoverageLayerRequest) =>
  queryOptions({
    queryKey: coverageKeys.layer(runId, request),
    staleTime: Infinity,
    gcTime: STALE.reference,
    queryFn: () =>
      api.get(
        `/v1/coverage-runs/${runId}/layers/${request.layer}?${params({ caseKey: request.caseKey, postId: request.postId })}`,
        EncodedClassRasterSchema,
      ),
  });

/** The difference between two finished runs for one case (never changes). */
export const coverageCompareQuery = (request: CoverageCompareRequest) =>
  queryOptions({
    queryKey: coverageKeys.compare(request),
    staleTime: Infinity,
    gcTime: STALE.reference,
    queryFn: () => api.get(`/v1/coverage-compare?${params({ ...request })}`, CoverageComparisonSchema),
  });

/** A coast run's band shares hour by hour for a day or week, from the roster as it is now (watches change: kept briefly). */
export const coverageHourlyQuery = (runId: string, request: { caseKey: string; date?: string; days: number }) =>
  queryOptions({
    queryKey: [...coverageKeys.run(runId), 'hourly', request] as const,
    queryFn: async () =>
      (
        await api.get(
          `/v1/coverage-runs/${runId}/hourly?${params({ caseKey: request.caseKey, date: request.date, days: String(request.days) })}`,
          z.object({ hourly: HourlySeriesSchema }),
        )
      ).hourly,
  });

export const useCoverageHourly = (runId: string | null, request: { caseKey: string; date?: string; days: number } | null) =>
  useQuery({ ...coverageHourlyQuery(runId ?? '', request ?? { caseKey: '', days: 1 }), enabled: !!runId && !!request });

export const usePlanCoverage = (planId: string, enabled = true) => useQuery({ ...planCoverageQuery(planId), enabled });

/**
 * A run by id, polled while it is active; when it finishes (or fails, or is
 * cancelled) the plan's coverage is asked again so `current`/`latest` follow.
 */
export function useCoverageRun(runId: string | null) {
  const qc = useQueryClient();
  const run = useQuery({ ...coverageRunQuery(runId ?? ''), enabled: runId !== null });
  const wasActive = useRef(false);
  const active = isActiveRun(run.data);
  const planId = run.data?.planId;
  useEffect(() => {
    if (wasActive.current && !active && planId) void qc.invalidateQueries({ queryKey: coverageKeys.plan(planId) });
    wasActive.current = active;
  }, [active, planId, qc]);
  return run;
}

export const useCoverageLayer = (runId: string | null, request: CoverageLayerRequest | null) =>
  useQuery({
    ...coverageLayerQuery(runId ?? '', request ?? { layer: 'posts-per-cell', caseKey: '' }),
    enabled: runId !== null && request !== null && request.caseKey !== '',
  });

export const useCoverageCompare = (request: CoverageCompareRequest | null) =>
  useQuery({
    ...coverageCompareQuery(request ?? { a: '', b: '', caseKey: '' }),
    enabled: request !== null,
  });

/** Puts a run the server answered into the cache and the plan's coverage. */
function storeRun(qc: ReturnType<typeof useQueryClient>, run: CoverageRun) {
  qc.setQueryData(coverageKeys.run(run.id), run);
  qc.setQueryData<PlanCoverage>(coverageKeys.plan(run.planId), (old) =>
    old ? { ...old, current: run.inputsHash === old.inputsHash ? run : old.current, latest: run } : old,
  );
}

/** Starts a coverage run for the plan's inputs today (or gets the current one back when nothing changed). */
export function useStartCoverage(planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async () => (await api.post(`/v1/plans/${planId}/coverage`, {}, RunBody)).run,
    onSuccess: async (run) => {
      storeRun(qc, run);
      await qc.invalidateQueries({ queryKey: coverageKeys.plan(planId) });
    },
  });
}

/** Cancels a queued or running run. */
export function useCancelCoverage() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (runId: string) => (await api.post(`/v1/coverage-runs/${runId}/cancel`, {}, RunBody)).run,
    onSuccess: async (run) => {
      storeRun(qc, run);
      await qc.invalidateQueries({ queryKey: coverageKeys.plan(run.planId) });
    },
  });
}

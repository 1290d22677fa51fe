import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  PlanHistorySchema,
  PlanListSchema,
  PlanRevisionSchema,
  PlanSchema,
  PlanSnapshotSchema,
  type Plan,
  type PlanInput,
} from '@/shared/schemas/plan';
import { api } from './api-client';
import { STALE } from './query-client';

/** Filter of the plan list, as the API takes it (all optional). */
export interface PlanFilter {
  siteId?: string;
  /** Comma-separated statuses. */
  status?: string;
  queue?: 'review';
  sort?: string;
  q?: string;
  page?: number;
  pageSize?: number;
}

export const planKeys = {
  all: ['plans'] as const,
  lists: () => [...planKeys.all, 'list'] as const,
  list: (filter: PlanFilter) => [...planKeys.lists(), filter] as const,
  detail: (id: string) => [...planKeys.all, 'detail', id] as const,
  preview: (id: string) => [...planKeys.detail(id), 'preview'] as const,
  history: (id: string) => [...planKeys.detail(id), 'history'] as const,
  revision: (id: string, n: number) => [...planKeys.detail(id), 'revision', n] as const,
};

const queryString = (filter: PlanFilter) => {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(filter)) if (v !== undefined && v !== '') q.set(k, String(v));
  return q.size ? `?${q}` : '';
};

export const plansQuery = (filter: PlanFilter = {}) =>
  queryOptions({
    queryKey: planKeys.list(filter),
    queryFn: () => api.get(`/v1/plans${queryString(filter)}`, PlanListSchema),
    placeholderData: keepPreviousData,
  });

export const planQuery = (id: string) =>
  queryOptions({
    queryKey: planKeys.detail(id),
    queryFn: async () => (await api.get(`/v1/plans/${id}`, z.object({ plan: PlanSchema }))).plan,
  });

export const planPreviewQuery = (id: string) =>
  queryOptions({
    queryKey: planKeys.preview(id),
    queryFn: async () => (await api.get(`/v1/plans/${id}/preview`, z.object({ snapshot: PlanSnapshotSchema }))).snapshot,
  });

export const planHistoryQuery = (id: string) =>
  queryOptions({
    queryKey: planKeys.history(id),
    queryFn: () => api.get(`/v1/plans/${id}/revisions`, PlanHistorySchema),
  });

/** A frozen revision never changes: cache it for good. */
export const planRevisionQuery = (id: string, n: number) =>
  queryOptions({
    queryKey: planKeys.revision(id, n),
    staleTime: Infinity,
    gcTime: STALE.reference,
    queryFn: async () => (await api.get(`/v1/plans/${id}/revisions/${n}`, z.object({ revision: PlanRevisionSchema }))).revision,
  });

export const usePlans = (filter: PlanFilter = {}) => useQuery(plansQuery(filter));
export const usePlan = (id: string) => useQuery(planQuery(id));
export const usePlanPreview = (id: string, enabled = true) => useQuery({ ...planPreviewQuery(id), enabled });
export const usePlanHistory = (id: string, enabled = true) => useQuery({ ...planHistoryQuery(id), enabled });
export const usePlanRevision = (id: string, n: number | null) =>
  useQuery({ ...planRevisionQuery(id, n ?? 0), enabled: n !== null && n > 0 });

const PlanBody = z.object({ plan: PlanSchema });

/** Every plan write: store the plan it returns and refresh lists and the plan's own queries. */
function usePlanMutation<V, R extends { plan: Plan }>(mutationFn: (vars: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: async ({ plan }) => {
      qc.setQueryData(planKeys.detail(plan.id), plan);
      await Promise.all([
        qc.invalidateQueries({ queryKey: planKeys.lists() }),
        qc.invalidateQueries({ queryKey: planKeys.detail(plan.id), predicate: (q) => q.queryKey.length > 3 }),
        plan.previousId ? qc.invalidateQueries({ queryKey: planKeys.detail(plan.previousId) }) : null,
      ]);
    },
  });
}

export const useCreatePlan = () => usePlanMutation((input: PlanInput) => api.post('/v1/plans', input, PlanBody));

export const useUpdatePlan = (id: string) =>
  usePlanMutation((changes: Partial<Omit<PlanInput, 'siteId'>> & { rowVersion: number }) =>
    api.patch(`/v1/plans/${id}`, changes, PlanBody),
  );

export const useSubmitPlan = (id: string) =>
  usePlanMutation((input: { rowVersion: number; exceptionNote?: string }) =>
    api.post(`/v1/plans/${id}/submit`, input, PlanBody.extend({ revision: z.number().int(), mailed: z.boolean() })),
  );

export const useReviewPlan = (id: string) =>
  usePlanMutation((review: { decision: 'approve' | 'return'; comment: string; revision: number; justification?: string }) =>
    api.post(`/v1/plans/${id}/reviews`, review, PlanBody.extend({ mailed: z.boolean() })),
  );

export const useNewPlanVersion = (id: string) => usePlanMutation(() => api.post(`/v1/plans/${id}/versions`, {}, PlanBody));

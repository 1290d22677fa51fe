import { queryOptions, useQuery } from '@tanstack/react-query';
import { VisibilityIndexResponseSchema, type VisibilityIndex } from '@/shared/schemas/visibility-index';
import { api } from './api-client';

/** How often a layer still being computed is asked for again, ms. */
export const VISIBILITY_INDEX_POLL_MS = 2000;

export const visibilityIndexKeys = {
  all: ['visibility-index'] as const,
  site: (siteId: string) => [...visibilityIndexKeys.all, siteId] as const,
  layer: (siteId: string, heightM: number, radiusM: number) => [...visibilityIndexKeys.site(siteId), heightM, radiusM] as const,
};

const active = (index: VisibilityIndex | undefined) => index?.status === 'queued' || index?.status === 'running';

/**
 * The visibility index of a site for a tower height and a radius: asking
 * starts the job when no layer exists (202), so the query polls until it is
 * done; a finished layer never changes.
 */
export const visibilityIndexQuery = (siteId: string, heightM: number, radiusM: number) =>
  queryOptions({
    queryKey: visibilityIndexKeys.layer(siteId, heightM, radiusM),
    queryFn: async () =>
      (await api.get(`/v1/sites/${siteId}/visibility-index?heightM=${heightM}&radiusM=${radiusM}`, VisibilityIndexResponseSchema))
        .index,
    refetchInterval: (query) => (active(query.state.data) ? VISIBILITY_INDEX_POLL_MS : false),
    staleTime: (query) => (query.state.data?.status === 'done' ? Infinity : 0),
    meta: { keepOnDevice: false },
  });

/** The layer for these parameters, or nothing while `params` is null (the layer is off). */
export function useVisibilityIndex(siteId: string, params: { heightM: number; radiusM: number } | null) {
  return useQuery({
    ...visibilityIndexQuery(siteId, params?.heightM ?? 0, params?.radiusM ?? 0),
    enabled: params !== null,
  });
}

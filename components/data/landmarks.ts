import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { LandmarkSchema, type LandmarkInput } from '@/shared/schemas/landmark';
import { api } from './api-client';

export const landmarkKeys = {
  all: ['landmarks'] as const,
  site: (siteId: string) => [...landmarkKeys.all, 'site', siteId] as const,
};

const LandmarkListSchema = z.object({ items: z.array(LandmarkSchema) });
const LandmarkBodySchema = z.object({ landmark: LandmarkSchema });

export const siteLandmarksQuery = (siteId: string) =>
  queryOptions({
    queryKey: landmarkKeys.site(siteId),
    queryFn: () => api.get(`/v1/sites/${siteId}/landmarks`, LandmarkListSchema).then((r) => r.items),
  });

export const useSiteLandmarks = (siteId: string) => useQuery(siteLandmarksQuery(siteId));

export function useCreateLandmark(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: LandmarkInput) =>
      api.post(`/v1/sites/${siteId}/landmarks`, input, LandmarkBodySchema).then((r) => r.landmark),
    onSuccess: () => qc.invalidateQueries({ queryKey: landmarkKeys.site(siteId) }),
  });
}

export function useDeleteLandmark(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete(`/v1/sites/${siteId}/landmarks/${id}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: landmarkKeys.site(siteId) }),
  });
}

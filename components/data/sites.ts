import { queryOptions, useQuery } from '@tanstack/react-query';
import { SiteListSchema } from '@/shared/schemas/site';
import { api } from './api-client';

export const siteKeys = {
  all: ['sites'] as const,
  list: (page: number) => [...siteKeys.all, 'list', page] as const,
  detail: (id: string) => [...siteKeys.all, 'detail', id] as const,
};

export const sitesQuery = (page = 1) =>
  queryOptions({
    queryKey: siteKeys.list(page),
    queryFn: () => api.get(`/v1/sites?page=${page}`, SiteListSchema),
  });

export function useSites(page = 1) {
  return useQuery(sitesQuery(page));
}

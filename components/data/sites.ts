import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { PostListSchema, PostSchema, SiteListSchema, SiteSchema, type PostInput } from '@/shared/schemas/site';
import { api } from './api-client';

export const siteKeys = {
  all: ['sites'] as const,
  list: (page: number) => [...siteKeys.all, 'list', page] as const,
  detail: (id: string) => [...siteKeys.all, 'detail', id] as const,
  posts: (id: string) => [...siteKeys.all, 'detail', id, 'posts'] as const,
};

export const sitesQuery = (page = 1) =>
  queryOptions({
    queryKey: siteKeys.list(page),
    queryFn: () => api.get(`/v1/sites?page=${page}`, SiteListSchema),
  });

export const siteQuery = (id: string) =>
  queryOptions({
    queryKey: siteKeys.detail(id),
    queryFn: async () => (await api.get(`/v1/sites/${id}`, z.object({ site: SiteSchema }))).site,
  });

export const sitePostsQuery = (id: string) =>
  queryOptions({
    queryKey: siteKeys.posts(id),
    queryFn: async () => (await api.get(`/v1/sites/${id}/posts`, PostListSchema)).items,
  });

export function useSites(page = 1) {
  return useQuery(sitesQuery(page));
}

export function useSite(id: string) {
  return useQuery(siteQuery(id));
}

export function useSitePosts(id: string) {
  return useQuery(sitePostsQuery(id));
}

export function useCreatePost(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: PostInput) => api.post(`/v1/sites/${siteId}/posts`, input, z.object({ post: PostSchema })),
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.all }),
  });
}

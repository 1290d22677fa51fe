import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { PostListSchema, PostSchema, SiteListSchema, SiteSchema, type Post, type PostInput } from '@/shared/schemas/site';
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

/** One post of a site, read from the site's post list (null when the site has no such post). */
export function usePost(siteId: string, postId: string) {
  return useQuery({ ...sitePostsQuery(siteId), select: (posts: Post[]) => posts.find((p) => p.id === postId) ?? null });
}

export function useCreatePost(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: PostInput) => api.post(`/v1/sites/${siteId}/posts`, input, z.object({ post: PostSchema })),
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.all }),
  });
}

/** Saves changes to a post with the version last seen (409 `stale_version` when someone else saved first). */
export function useUpdatePost(siteId: string, postId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (input: Partial<PostInput> & { version: number }) =>
      (await api.patch(`/v1/sites/${siteId}/posts/${postId}`, input, z.object({ post: PostSchema }))).post,
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.detail(siteId) }),
  });
}

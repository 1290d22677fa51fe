import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Post, PostInput, Site, SiteInput } from '@/shared/schemas/site';
import { api, ApiRequestError, lazySchema } from './api-client';
import { loadFirstScreenSchemas } from './deferred-chunk';

// The site list is the signed-in home's first question: its schemas come with the deferred chunk.
const SiteListSchema = lazySchema(() => loadFirstScreenSchemas().then((m) => m.SiteListSchema));
const PostListSchema = lazySchema(() => loadFirstScreenSchemas().then((m) => m.PostListSchema));
const SiteBody = lazySchema(() => loadFirstScreenSchemas().then((m) => m.SiteBodySchema));
const PostBody = lazySchema(() => loadFirstScreenSchemas().then((m) => m.PostBodySchema));

export const siteKeys = {
  all: ['sites'] as const,
  list: (page: number) => [...siteKeys.all, 'list', page] as const,
  detail: (id: string) => [...siteKeys.all, 'detail', id] as const,
  posts: (id: string) => [...siteKeys.all, 'detail', id, 'posts'] as const,
  postsPage: (id: string, filter: PostFilter) => [...siteKeys.posts(id), 'page', filter] as const,
  post: (id: string, postId: string) => [...siteKeys.posts(id), 'one', postId] as const,
};

/** Filter of a site's post list, as the API takes it. */
export interface PostFilter {
  q?: string;
  kind?: string;
  status?: string;
  sort?: string;
  page?: number;
  pageSize?: number;
}

export const sitesQuery = (page = 1) =>
  queryOptions({
    queryKey: siteKeys.list(page),
    queryFn: () => api.get(`/v1/sites?page=${page}`, SiteListSchema),
  });

export const siteQuery = (id: string) =>
  queryOptions({
    queryKey: siteKeys.detail(id),
    queryFn: async () => (await api.get(`/v1/sites/${id}`, SiteBody)).site,
  });

export const sitePostsQuery = (id: string) =>
  queryOptions({
    queryKey: siteKeys.posts(id),
    queryFn: async () => (await api.get(`/v1/sites/${id}/posts`, PostListSchema)).items,
  });

/** One page of a site's posts, filtered and sorted (the list on the site page). */
export const sitePostsPageQuery = (id: string, filter: PostFilter) =>
  queryOptions({
    queryKey: siteKeys.postsPage(id, filter),
    queryFn: () => {
      const q = new URLSearchParams();
      for (const [k, v] of Object.entries(filter)) if (v !== undefined && v !== '') q.set(k, String(v));
      return api.get(`/v1/sites/${id}/posts?${q}`, PostListSchema);
    },
    placeholderData: keepPreviousData,
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

/** One post of a site (null when the site has no such post). */
export function usePost(siteId: string, postId: string) {
  return useQuery({
    queryKey: siteKeys.post(siteId, postId),
    queryFn: async (): Promise<Post | null> => {
      try {
        return (await api.get(`/v1/sites/${siteId}/posts/${postId}`, PostBody)).post;
      } catch (e) {
        if (e instanceof ApiRequestError && e.status === 404) return null;
        throw e;
      }
    },
  });
}

export function useCreatePost(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: PostInput) => api.post(`/v1/sites/${siteId}/posts`, input, PostBody),
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.all }),
  });
}

/** Saves changes to a post with the version last seen (409 `stale_version` when someone else saved first). */
export function useUpdatePost(siteId: string, postId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (input: Partial<PostInput> & { version: number }) =>
      (await api.patch(`/v1/sites/${siteId}/posts/${postId}`, input, PostBody)).post,
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.detail(siteId) }),
  });
}

/** Creates a site (planners); the lists refresh. */
export function useCreateSite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (input: Partial<SiteInput> & Pick<SiteInput, 'name' | 'kind'>): Promise<Site> =>
      (await api.post('/v1/sites', input, SiteBody)).site,
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.all }),
  });
}

/** Saves changes to a site with the version last seen (409 `stale_version` when someone else saved first). */
export function useUpdateSite(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (input: Partial<SiteInput> & { version: number }): Promise<Site> =>
      (await api.patch(`/v1/sites/${siteId}`, input, SiteBody)).site,
    onSuccess: (site) => {
      qc.setQueryData(siteKeys.detail(siteId), site);
      return qc.invalidateQueries({ queryKey: siteKeys.all });
    },
  });
}

/** Deletes a site (soft); refused with 409 `site_has_approved_plans` while approved plans depend on it. */
export function useDeleteSite(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete(`/v1/sites/${siteId}`),
    onSuccess: () => {
      qc.removeQueries({ queryKey: siteKeys.detail(siteId) });
      // Not awaited: the screen leaves the deleted record before the lists refetch.
      void qc.invalidateQueries({ queryKey: siteKeys.all });
    },
  });
}

/** Deletes a post (soft); refused with 409 `post_in_frozen_plan` while a submitted or approved plan uses it. */
export function useDeletePost(siteId: string, postId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete(`/v1/sites/${siteId}/posts/${postId}`),
    onSuccess: () => {
      qc.removeQueries({ queryKey: siteKeys.post(siteId, postId) });
      // Not awaited: the screen leaves the deleted record before the lists refetch.
      void qc.invalidateQueries({ queryKey: siteKeys.all });
    },
  });
}

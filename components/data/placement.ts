import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { LatLon } from '@/shared/geo/types';
import { BoundaryFromTerrainResponseSchema, PostMoveResponseSchema } from '@/shared/schemas/post-actions';
import { PostSchema } from '@/shared/schemas/site';
import { api } from './api-client';
import { siteKeys } from './sites';

/** A new post with the same settings as this one, named “… (copy)” (planners). */
export function useDuplicatePost(siteId: string, postId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async () =>
      (await api.post(`/v1/sites/${siteId}/posts/${postId}/duplicate`, {}, z.object({ post: PostSchema }))).post,
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.posts(siteId) }),
  });
}

/**
 * Moves a post (a drag on the map); the server reads its ground from the site's terrain there.
 * 409 `post_in_frozen_plan` while a submitted or approved plan uses it, 409 `stale_version`.
 */
export function useMovePost(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ postId, location, version }: { postId: string; location: LatLon; version: number }) =>
      api.post(
        `/v1/sites/${siteId}/posts/${postId}/move`,
        { location: { latDeg: location.latDeg, lonDeg: location.lonDeg }, version },
        PostMoveResponseSchema,
      ),
    onSuccess: () => qc.invalidateQueries({ queryKey: siteKeys.posts(siteId) }),
  });
}

/** Makes the site's boundary its terrain's extent (the grid's rectangle reprojected to WGS 84). */
export function useBoundaryFromTerrain(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (version: number) =>
      api.post(`/v1/sites/${siteId}/boundary-from-terrain`, { version }, BoundaryFromTerrainResponseSchema),
    onSuccess: ({ site }) => {
      qc.setQueryData(siteKeys.detail(siteId), site);
      return qc.invalidateQueries({ queryKey: siteKeys.all });
    },
  });
}

const TracedShorelineSchema = z.object({
  shoreline: z.array(z.tuple([z.number(), z.number()])),
  terrainId: z.string(),
  levelM: z.number(),
});

/** A shoreline traced from the site's terrain at a level, metres (not saved: the site form takes it). */
export function useTraceShoreline(siteId: string) {
  return useMutation({
    mutationFn: (levelM: number) => api.post(`/v1/sites/${siteId}/shoreline-from-terrain`, { levelM }, TracedShorelineSchema),
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LatLon } from '@/shared/geo/types';
import {
  ElevationResponseSchema,
  SiteTerrainResponseSchema,
  TerrainProfileResponseSchema,
  type SiteTerrain,
  type TerrainProfileRequest,
} from '@/shared/schemas/terrain';
import { filePart, type PickedFile } from './file-part';
import { api, ApiRequestError, type UploadProgress } from './api-client';
import { STALE } from './query-client';

export const terrainKeys = {
  all: ['terrain'] as const,
  site: (siteId: string) => [...terrainKeys.all, 'site', siteId] as const,
};


/** What the terrain upload form sends. */
export interface TerrainUploadInput {
  file: PickedFile;
  prj?: PickedFile | null;
  /** EPSG code for a grid without a CRS of its own. */
  epsg?: string;
  onProgress?: UploadProgress;
  signal?: AbortSignal;
}

/** The site's active terrain, or null when it has none (404 `no_terrain` is an answer, not an error). */
export const siteTerrainQuery = (siteId: string) =>
  queryOptions({
    queryKey: terrainKeys.site(siteId),
    staleTime: STALE.reference,
    queryFn: async (): Promise<SiteTerrain | null> => {
      try {
        return (await api.get(`/v1/sites/${siteId}/terrain`, SiteTerrainResponseSchema)).terrain;
      } catch (e) {
        if (e instanceof ApiRequestError && e.code === 'no_terrain') return null;
        throw e;
      }
    },
  });

export function useSiteTerrain(siteId: string) {
  return useQuery(siteTerrainQuery(siteId));
}

/** Uploads a terrain (planners); progress through `onProgress`. Replaces the site's terrain on success. */
export function useUploadTerrain(siteId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, prj, epsg, onProgress, signal }: TerrainUploadInput) => {
      const form = new FormData();
      form.append('file', filePart(file) as Blob, file.name);
      if (prj) form.append('prj', filePart(prj) as Blob, prj.name);
      if (epsg?.trim()) form.append('epsg', epsg.trim());
      return api.upload(`/v1/sites/${siteId}/terrain`, form, SiteTerrainResponseSchema, onProgress, signal);
    },
    onSuccess: ({ terrain }) => {
      qc.setQueryData(terrainKeys.site(siteId), terrain);
      return qc.invalidateQueries({ queryKey: terrainKeys.site(siteId) });
    },
  });
}

/** Ground elevation of the site's terrain at a position (bilinear), e.g. to fill a post's ground elevation. */
export function useTerrainElevation(siteId: string) {
  return useMutation({
    mutationFn: ({ latDeg, lonDeg }: LatLon) =>
      api.get(
        `/v1/sites/${siteId}/terrain/elevation?latDeg=${encodeURIComponent(latDeg)}&lonDeg=${encodeURIComponent(lonDeg)}`,
        ElevationResponseSchema,
      ),
  });
}

/** The terrain profile from a post or a position to a target, per refraction condition. */
export function useTerrainProfile(siteId: string) {
  return useMutation({
    mutationFn: (request: TerrainProfileRequest) =>
      api.post(`/v1/sites/${siteId}/terrain/profile`, request, TerrainProfileResponseSchema),
  });
}

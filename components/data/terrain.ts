import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LatLon } from '@/shared/geo/types';
import {
  ElevationResponseSchema,
  SiteTerrainResponseSchema,
  TerrainMeshResponseSchema,
  TerrainProfileResponseSchema,
  type SiteTerrain,
  type TerrainMeshResponse,
  type TerrainProfileRequest,
} from '@/shared/schemas/terrain';
import { filePart, type PickedFile } from './file-part';
import { api, ApiRequestError, type UploadProgress } from './api-client';
import { STALE } from './query-client';

export const terrainKeys = {
  all: ['terrain'] as const,
  site: (siteId: string) => [...terrainKeys.all, 'site', siteId] as const,
  mesh: (siteId: string, maxEdge: number) => [...terrainKeys.site(siteId), 'mesh', maxEdge] as const,
  profile: (siteId: string, request: TerrainProfileRequest) => [...terrainKeys.site(siteId), 'profile', request] as const,
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

/** A terrain mesh with its heights unpacked: width × height metres, row 0 = north, NaN = nodata. */
export type TerrainMesh = Omit<TerrainMeshResponse, 'heights' | 'encoding'> & { heights: Float32Array };

/** Little-endian Float32 values from base64 (RFC 4648 §4), read explicitly as little-endian. */
export function float32FromBase64(text: string): Float32Array {
  const binary = atob(text);
  const view = new DataView(new ArrayBuffer(binary.length));
  for (let i = 0; i < binary.length; i++) view.setUint8(i, binary.charCodeAt(i));
  const out = new Float32Array(Math.floor(binary.length / 4));
  for (let i = 0; i < out.length; i++) out[i] = view.getFloat32(i * 4, true);
  return out;
}

/** The site's terrain decimated to at most `maxEdge` cells a side, for the 3D view. */
export const terrainMeshQuery = (siteId: string, maxEdge = 256) =>
  queryOptions({
    queryKey: terrainKeys.mesh(siteId, maxEdge),
    staleTime: STALE.reference,
    queryFn: async (): Promise<TerrainMesh> => {
      const {
        heights,
        encoding: _encoding,
        ...grid
      } = await api.get(`/v1/sites/${siteId}/terrain/mesh?maxEdge=${maxEdge}`, TerrainMeshResponseSchema);
      return { ...grid, heights: float32FromBase64(heights) };
    },
  });

export function useTerrainMesh(siteId: string, maxEdge = 256) {
  return useQuery(terrainMeshQuery(siteId, maxEdge));
}

/** The profile for one request, cached by its content (switching conditions back does not ask again); off while null. */
export const terrainProfileQuery = (siteId: string, request: TerrainProfileRequest) =>
  queryOptions({
    queryKey: terrainKeys.profile(siteId, request),
    staleTime: STALE.reference,
    queryFn: () => api.post(`/v1/sites/${siteId}/terrain/profile`, request, TerrainProfileResponseSchema),
  });

export function useTerrainProfileFor(siteId: string, request: TerrainProfileRequest | null) {
  return useQuery({
    ...terrainProfileQuery(siteId, request ?? { target: { latDeg: 0, lonDeg: 0 }, targetHeightM: 0, conditions: [] }),
    enabled: request !== null,
  });
}

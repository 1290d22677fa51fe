import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CoverageLayerName } from '@/shared/schemas/coverage';
import { RevisionByHashSchema } from '@/shared/schemas/printout';
import { api } from './api-client';

/** Where a revision's files are downloaded (the server names them: site, plan, revision, date). */
export const exportUrls = {
  resultsCsv: (planId: string, revision: number) => `/api/v1/plans/${planId}/revisions/${revision}/results.csv`,
  featuresGeoJson: (planId: string, revision: number) => `/api/v1/plans/${planId}/revisions/${revision}/features.geojson`,
  layer: (runId: string, layer: CoverageLayerName, format: 'tif' | 'asc', caseKey: string, postId?: string) => {
    const q = new URLSearchParams({ caseKey, ...(postId && { postId }) });
    return `/api/v1/coverage-runs/${runId}/layers/${layer}.${format}?${q}`;
  },
};

export const printoutKeys = {
  all: ['printouts'] as const,
  byHash: (sha256: string) => [...printoutKeys.all, 'by-hash', sha256] as const,
};

/** Which revision a printed content hash belongs to, and where it stands now (asked afresh each time). */
export const revisionByHashQuery = (sha256: string) =>
  queryOptions({
    queryKey: printoutKeys.byHash(sha256),
    staleTime: 0,
    queryFn: () => api.get(`/v1/revisions/by-hash/${sha256}`, RevisionByHashSchema),
  });

export const useRevisionByHash = (sha256: string | null) =>
  useQuery({ ...revisionByHashQuery(sha256 ?? ''), enabled: sha256 !== null });

import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import {
  RefractionPresetListSchema,
  SightlineResponseSchema,
  type SightlineRequest,
  type SightlineResponse,
} from '@/shared/schemas/sightline';
import { evaluateSightline } from '@/shared/sightline/evaluate-sightline';
import { api, NetworkError } from './api-client';
import { STALE } from './query-client';

export const sightlineKeys = {
  all: ['sightline'] as const,
  evaluation: (request: SightlineRequest | null) => [...sightlineKeys.all, 'evaluation', request] as const,
  presets: () => [...sightlineKeys.all, 'presets'] as const,
};

/** Where an answer was computed: by the server, or by the same core on this device when offline. */
export type ComputedOn = 'server' | 'device';

/**
 * The sightline evaluation. The server answers when it can be reached; when it
 * cannot, the same pure core runs on the device, and the answer says so.
 */
export const sightlineQuery = (request: SightlineRequest | null) =>
  queryOptions({
    queryKey: sightlineKeys.evaluation(request),
    enabled: request !== null,
    staleTime: Infinity,
    retry: false,
    queryFn: async (): Promise<SightlineResponse & { computedOn: ComputedOn }> => {
      if (!request) throw new Error('no request');
      try {
        return { ...(await api.post('/v1/sightline', request, SightlineResponseSchema)), computedOn: 'server' };
      } catch (e) {
        if (e instanceof NetworkError) return { ...evaluateSightline(request), computedOn: 'device' };
        throw e;
      }
    },
  });

export function useSightline(request: SightlineRequest | null) {
  return useQuery({ ...sightlineQuery(request), placeholderData: keepPreviousData });
}

export const refractionPresetsQuery = () =>
  queryOptions({
    queryKey: sightlineKeys.presets(),
    staleTime: STALE.reference,
    queryFn: async () => (await api.get('/v1/refraction-presets', RefractionPresetListSchema)).presets,
  });

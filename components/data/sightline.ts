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
  evaluation: (request: SightlineRequest | null, context?: unknown) =>
    [...sightlineKeys.all, 'evaluation', request, context] as const,
  presets: () => [...sightlineKeys.all, 'presets'] as const,
};

/** Where an answer was computed: by the server, or by the same core on this device when offline. */
export type ComputedOn = 'server' | 'device';

/**
 * The sightline evaluation. The server answers when it can be reached; when it
 * cannot, the same pure core runs on the device, and the answer says so.
 */
export const sightlineQuery = <C>(request: SightlineRequest | null, context: C) =>
  queryOptions({
    queryKey: sightlineKeys.evaluation(request, context),
    enabled: request !== null,
    staleTime: Infinity,
    retry: false,
    // Offline too: the query runs and the device answers (a paused query would leave the check blank in the field).
    networkMode: 'always',
    // Every typed change is a new answer: not worth keeping on the device (the device can compute them again).
    meta: { keepOnDevice: false },
    // The answer carries the request it answers and the caller's context (e.g. column labels),
    // so a screen showing a previous answer while the next loads never mixes the two.
    queryFn: async (): Promise<SightlineResponse & { computedOn: ComputedOn; request: SightlineRequest; context: C }> => {
      if (!request) throw new Error('no request');
      try {
        return { ...(await api.post('/v1/sightline', request, SightlineResponseSchema)), computedOn: 'server', request, context };
      } catch (e) {
        if (e instanceof NetworkError) return { ...evaluateSightline(request), computedOn: 'device', request, context };
        throw e;
      }
    },
  });

export function useSightline<C>(request: SightlineRequest | null, context: C) {
  return useQuery({ ...sightlineQuery(request, context), placeholderData: keepPreviousData });
}

export const refractionPresetsQuery = () =>
  queryOptions({
    queryKey: sightlineKeys.presets(),
    staleTime: STALE.reference,
    queryFn: async () => (await api.get('/v1/refraction-presets', RefractionPresetListSchema)).presets,
  });

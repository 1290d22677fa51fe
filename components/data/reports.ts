import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { CrewCardSchema } from '@/shared/schemas/crew-card';
import { api } from './api-client';

export const reportKeys = {
  all: ['reports'] as const,
  crewCard: (siteId: string, postId: string) => [...reportKeys.all, 'crew-card', siteId, postId] as const,
};

/** A post's crew card (the same figures as its PDF). */
export const crewCardQuery = (siteId: string, postId: string) =>
  queryOptions({
    queryKey: reportKeys.crewCard(siteId, postId),
    queryFn: async () => (await api.get(`/v1/sites/${siteId}/posts/${postId}/card`, z.object({ card: CrewCardSchema }))).card,
  });

export const useCrewCard = (siteId: string, postId: string) => useQuery(crewCardQuery(siteId, postId));

/** The crew card PDF's address (A5), positions in the person's coordinate format. */
export const crewCardPdfUrl = (siteId: string, postId: string, coords: string) =>
  `/api/v1/sites/${siteId}/posts/${postId}/card.pdf?coords=${coords}`;

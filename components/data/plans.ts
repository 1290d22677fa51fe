import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { PlanSchema } from '@/shared/schemas/plan';
import { api } from './api-client';

export const planKeys = {
  all: ['plans'] as const,
  list: (filter: { siteId?: string; status?: string }) => [...planKeys.all, 'list', filter] as const,
};

export const plansQuery = (filter: { siteId?: string; status?: string } = {}) =>
  queryOptions({
    queryKey: planKeys.list(filter),
    queryFn: async () => {
      const q = new URLSearchParams(Object.entries(filter).filter((e): e is [string, string] => !!e[1]));
      return (await api.get(`/v1/plans${q.size ? `?${q}` : ''}`, z.object({ items: z.array(PlanSchema) }))).items;
    },
  });

export const usePlans = (filter: { siteId?: string; status?: string } = {}) => useQuery(plansQuery(filter));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { CaughtMailListSchema } from '@/shared/schemas/mail';
import { api } from './api-client';

export const caughtMailKeys = {
  all: ['caught-mail'] as const,
  list: () => [...caughtMailKeys.all, 'list'] as const,
};

export const caughtMailQuery = () =>
  queryOptions({
    queryKey: caughtMailKeys.list(),
    staleTime: 5_000,
    queryFn: async () => (await api.get('/v1/caught-mail', CaughtMailListSchema)).messages,
  });

export function useCaughtMail() {
  return useQuery(caughtMailQuery());
}

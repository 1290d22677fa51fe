import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  InviteUserResponseSchema,
  ManagedUserListSchema,
  ManagedUserSchema,
  type InviteUserRequest,
  type UpdateUserRequest,
} from '@/shared/schemas/auth';
import { z } from 'zod';
import { api } from './api-client';

export const userKeys = {
  all: ['users'] as const,
  list: () => [...userKeys.all, 'list'] as const,
};

export const usersQuery = () =>
  queryOptions({
    queryKey: userKeys.list(),
    queryFn: async () => (await api.get('/v1/users?pageSize=200', ManagedUserListSchema)).items,
  });

export function useUsers() {
  return useQuery(usersQuery());
}

export function useInviteUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteUserRequest) => api.post('/v1/users', input, InviteUserResponseSchema),
    onSuccess: () => qc.invalidateQueries({ queryKey: userKeys.all }),
  });
}

export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: UpdateUserRequest & { id: string }) =>
      api.patch(`/v1/users/${id}`, input, z.object({ user: ManagedUserSchema })),
    onSettled: () => qc.invalidateQueries({ queryKey: userKeys.all }),
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LoginInput, RegisterInput, UserDto } from '../../../shared/protocol';
import { sessionChanged } from '../session-change';
import { api, ApiError } from './client';

export async function getMe(): Promise<UserDto | null> {
  try {
    return (await api<{ user: UserDto }>('/auth/me')).user;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export const meQuery = queryOptions({ queryKey: ['me'], queryFn: getMe });

export function useMe() {
  return useQuery(meQuery);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LoginInput) => api<{ user: UserDto }>('/auth/login', { method: 'POST', body: input }),
    onSuccess: ({ user }) => {
      queryClient.setQueryData(meQuery.queryKey, user);
      sessionChanged();
    },
  });
}

export function useRegister() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RegisterInput) => api<{ user: UserDto }>('/auth/register', { method: 'POST', body: input }),
    onSuccess: ({ user }) => {
      queryClient.setQueryData(meQuery.queryKey, user);
      sessionChanged();
    },
  });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<{ ok: true }>('/auth/logout', { method: 'POST' }),
    onSuccess: () => {
      queryClient.setQueryData(meQuery.queryKey, null);
      sessionChanged();
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'me' });
    },
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { RoleName, UserDto } from '../../../../shared/protocol';
import { api } from '../../../lib/api/client';

export const adminUsersQuery = queryOptions({
  queryKey: ['admin', 'users'],
  queryFn: async () => (await api<{ users: UserDto[] }>('/admin/users')).users,
});

export function useAdminUsers(enabled: boolean) {
  return useQuery({ ...adminUsersQuery, enabled });
}

export function useChangeRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, role }: { id: number; role: RoleName }) =>
      api<{ user: UserDto }>(`/admin/users/${id}`, { method: 'PATCH', body: { role } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminUsersQuery.queryKey }),
  });
}

import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api/client';

export function useRequestReset() {
  return useMutation({ mutationFn: (email: string) => api<{ ok: true; message: string }>('/auth/password-reset', { method: 'POST', body: { email } }) });
}

export function resetLinkQuery(token: string) {
  return queryOptions({ queryKey: ['password-reset', token], queryFn: () => api<{ ok: true; expiresAt: string }>(`/auth/password-reset/${encodeURIComponent(token)}`) });
}
export const useResetLink = (token: string) => useQuery(resetLinkQuery(token));

export function useConfirmReset() {
  return useMutation({
    mutationFn: (input: { token: string; password: string }) => api<{ ok: true; message: string }>('/auth/password-reset/confirm', { method: 'POST', body: input }),
  });
}

import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import type { ReceiptDto } from '../../../../shared/lessons';
import { api } from '../../../lib/api/client';

/** Sends the browser to the payment service's own checkout page. */
export function useCheckout() {
  return useMutation({
    mutationFn: (lessonId: number) => api<{ url: string; paymentId: number }>('/payments/checkout', { method: 'POST', body: { lessonId } }),
    onSuccess: ({ url }) => window.location.assign(url),
  });
}

export function receiptQuery(sessionId: string) {
  return queryOptions({
    queryKey: ['receipts', sessionId],
    queryFn: async () => (await api<{ receipt: ReceiptDto }>(`/payments/session/${encodeURIComponent(sessionId)}`)).receipt,
    // The webhook may land a moment after the browser comes back: look again until it has.
    refetchInterval: (query) => (query.state.data?.status === 'pending' ? 1500 : false),
  });
}

export const useReceipt = (sessionId: string) => useQuery({ ...receiptQuery(sessionId), enabled: Boolean(sessionId) });

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExchangeReplayDto } from '../../../../shared/protocol';
import { api } from '../../../lib/api/client';

export function replayQuery(id: string) {
  return queryOptions({
    queryKey: ['exchanges', id, 'replay'],
    queryFn: async () => (await api<{ replay: ExchangeReplayDto }>(`/exchanges/${encodeURIComponent(id)}/replay`)).replay,
    // A finished exchange never changes.
    staleTime: Infinity,
  });
}

export function useReplay(id: string) {
  return useQuery(replayQuery(id));
}

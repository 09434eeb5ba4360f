import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExchangeSummaryDto } from '../../../../shared/protocol';
import { api } from '../../../lib/api/client';

export const exchangesQuery = queryOptions({
  queryKey: ['exchanges'],
  queryFn: async () => (await api<{ exchanges: ExchangeSummaryDto[] }>('/exchanges')).exchanges,
});

export function useExchanges() {
  return useQuery(exchangesQuery);
}

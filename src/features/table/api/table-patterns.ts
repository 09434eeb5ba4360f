import { queryOptions } from '@tanstack/react-query';
import type { Pattern } from '../../../../shared/analysis/pattern';
import { api } from '../../../lib/api/client';

/** The list a table's analysis judges by (the starter list unless the host picked another). */
export function tablePatternsQuery(tableId: string, invite?: string) {
  return queryOptions({
    queryKey: ['tables', tableId, 'patterns'],
    queryFn: async () =>
      (await api<{ list: { id: string; name: string; patterns: Pattern[] } }>(`/tables/${encodeURIComponent(tableId)}/patterns${invite ? `?invite=${encodeURIComponent(invite)}` : ''}`)).list,
    staleTime: 5 * 60_000,
  });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProgressDto } from '../../../../shared/progress';
import { api } from '../../../lib/api/client';

/** A player's progress: "me" for the signed-in player, or a user id (a teacher's student). */
export function progressQuery(who: 'me' | number) {
  return queryOptions({
    queryKey: ['progress', who],
    queryFn: async () => (await api<{ progress: ProgressDto }>(`/progress/${who}`)).progress,
  });
}

export const useProgress = (who: 'me' | number) => useQuery(progressQuery(who));

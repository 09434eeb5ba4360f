import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DrillDto } from '../../../shared/drills';
import { api } from './client';

/** The drills a teacher may use: listed by the drill pages and picked from when a lesson is scheduled. */
export const drillsQuery = queryOptions({
  queryKey: ['drills'],
  queryFn: async () => (await api<{ drills: DrillDto[] }>('/drills')).drills,
});

export function useDrills(enabled = true) {
  return useQuery({ ...drillsQuery, enabled });
}

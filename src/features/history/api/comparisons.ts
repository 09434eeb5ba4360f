import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ComparisonDto } from '../../../../shared/comparisons';
import { api } from '../../../lib/api/client';

/** What a comparison is of: a lesson's tables, a drill's, the deal of one exchange, or a seed. */
export type ComparisonOf = { lesson: string } | { drill: string } | { exchange: string } | { seed: string };

export function comparisonPath(of: ComparisonOf): string {
  if ('lesson' in of) return `/comparisons/lessons/${encodeURIComponent(of.lesson)}`;
  if ('drill' in of) return `/comparisons/drills/${encodeURIComponent(of.drill)}`;
  if ('exchange' in of) return `/comparisons/exchanges/${encodeURIComponent(of.exchange)}`;
  return `/comparisons?seed=${encodeURIComponent(of.seed)}`;
}

export function comparisonQuery(of: ComparisonOf) {
  return queryOptions({
    queryKey: ['comparisons', of],
    queryFn: async () => (await api<{ comparison: ComparisonDto }>(comparisonPath(of))).comparison,
  });
}

export const useComparison = (of: ComparisonOf, enabled = true) => useQuery({ ...comparisonQuery(of), enabled });

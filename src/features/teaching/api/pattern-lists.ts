import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PatternListDto, PatternListInput, PatternListSummaryDto } from '../../../../shared/pattern-lists';
import { api } from '../../../lib/api/client';
import { uploadFile } from '../../../lib/api/upload';

export const patternListsQuery = queryOptions({
  queryKey: ['pattern-lists'],
  queryFn: async () => (await api<{ lists: PatternListSummaryDto[] }>('/pattern-lists')).lists,
});

export function patternListQuery(id: string) {
  return queryOptions({
    queryKey: ['pattern-lists', id],
    queryFn: async () => (await api<{ list: PatternListDto }>(`/pattern-lists/${encodeURIComponent(id)}`)).list,
  });
}

export function usePatternLists(enabled = true) {
  return useQuery({ ...patternListsQuery, enabled });
}

export function usePatternList(id: string | undefined) {
  return useQuery({ ...patternListQuery(id ?? ''), enabled: Boolean(id) });
}

export function patternListExportUrl(id: string, format: 'json' | 'csv') {
  return `/api/pattern-lists/${encodeURIComponent(id)}/export?format=${format}`;
}

function useInvalidateLists() {
  const queryClient = useQueryClient();
  return (list?: PatternListDto) => {
    if (list) queryClient.setQueryData(patternListQuery(list.id).queryKey, list);
    return queryClient.invalidateQueries({ queryKey: patternListsQuery.queryKey, exact: true });
  };
}

/** Creates a list (no id) or replaces one of mine. */
export function useSavePatternList(id?: string) {
  const done = useInvalidateLists();
  return useMutation({
    mutationFn: async (input: PatternListInput) =>
      (await api<{ list: PatternListDto }>(id ? `/pattern-lists/${encodeURIComponent(id)}` : '/pattern-lists', { method: id ? 'PUT' : 'POST', body: input })).list,
    onSuccess: (list) => done(list),
  });
}

export function useCopyPatternList() {
  const done = useInvalidateLists();
  return useMutation({
    mutationFn: async ({ id, name }: { id: string; name?: string }) =>
      (await api<{ list: PatternListDto }>(`/pattern-lists/${encodeURIComponent(id)}/copy`, { method: 'POST', body: name ? { name } : {} })).list,
    onSuccess: (list) => done(list),
  });
}

export function useDeletePatternList() {
  const done = useInvalidateLists();
  return useMutation({
    mutationFn: (id: string) => api<null>(`/pattern-lists/${encodeURIComponent(id)}`, { method: 'DELETE' }),
    onSuccess: () => done(),
  });
}

export function useImportPatternList() {
  const done = useInvalidateLists();
  return useMutation({
    mutationFn: async (file: File) => (await uploadFile<{ list: PatternListDto }>('/pattern-lists/import', file)).list,
    onSuccess: (list) => done(list),
  });
}

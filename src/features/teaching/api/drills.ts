import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { DrillDto, DrillInput } from '../../../../shared/drills';
import { api } from '../../../lib/api/client';
import { drillsQuery } from '../../../lib/api/drill-list';
import { uploadFile } from '../../../lib/api/upload';

export function drillQuery(id: string) {
  return queryOptions({
    queryKey: ['drills', id],
    queryFn: async () => (await api<{ drill: DrillDto }>(`/drills/${encodeURIComponent(id)}`)).drill,
  });
}

export function useDrill(id: string | undefined) {
  return useQuery({ ...drillQuery(id ?? ''), enabled: Boolean(id) });
}

export function drillExportUrl(id: string) {
  return `/api/drills/${encodeURIComponent(id)}/export`;
}

function useInvalidateDrills() {
  const queryClient = useQueryClient();
  return (drill?: DrillDto) => {
    if (drill) queryClient.setQueryData(drillQuery(drill.id).queryKey, drill);
    return queryClient.invalidateQueries({ queryKey: drillsQuery.queryKey, exact: true });
  };
}

/** Creates a drill (no id) or replaces one of mine. */
export function useSaveDrill(id?: string) {
  const done = useInvalidateDrills();
  return useMutation({
    mutationFn: async (input: DrillInput) =>
      (await api<{ drill: DrillDto }>(id ? `/drills/${encodeURIComponent(id)}` : '/drills', { method: id ? 'PUT' : 'POST', body: input })).drill,
    onSuccess: (drill) => done(drill),
  });
}

export function useDeleteDrill() {
  const done = useInvalidateDrills();
  return useMutation({
    mutationFn: (id: string) => api<null>(`/drills/${encodeURIComponent(id)}`, { method: 'DELETE' }),
    onSuccess: () => done(),
  });
}

export function useImportDrill() {
  const done = useInvalidateDrills();
  return useMutation({
    mutationFn: (file: File) => uploadFile<{ drill: DrillDto; notes: string[] }>('/drills/import', file),
    onSuccess: ({ drill }) => done(drill),
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateTableInput, TableDto } from '../../../shared/protocol';
import { api } from './client';

export const tablesQuery = queryOptions({
  queryKey: ['tables'],
  queryFn: () => api<{ mine: TableDto[]; open: TableDto[] }>('/tables'),
});

export function useTables() {
  return useQuery(tablesQuery);
}

/**
 * Field errors keyed as the form names them: "name", "options.seed", … The schema (and zod with
 * it) loads only when a form is sent, so the home page stays small.
 */
export async function createTableErrors(input: CreateTableInput): Promise<Record<string, string>> {
  const { createTableSchema } = await import('../../../shared/protocol');
  const parsed = createTableSchema.safeParse(input);
  if (parsed.success) return {};
  const fields: Record<string, string> = {};
  for (const issue of parsed.error.issues) fields[issue.path.join('.') || '_'] ??= issue.message;
  return fields;
}

export function useCreateTable() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: CreateTableInput) => (await api<{ table: TableDto }>('/tables', { method: 'POST', body: input })).table,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: tablesQuery.queryKey, exact: true }),
  });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailDto } from '../../../../shared/lessons';
import { api } from '../../../lib/api/client';

export const outboxQuery = queryOptions({ queryKey: ['mail'], queryFn: async () => (await api<{ mails: MailDto[] }>('/mail')).mails });
export function mailQuery(id: number) {
  return queryOptions({ queryKey: ['mail', id], queryFn: async () => (await api<{ mail: MailDto }>(`/mail/${id}`)).mail });
}

export const useOutbox = (enabled: boolean) => useQuery({ ...outboxQuery, enabled });
export const useMail = (id: number | null) => useQuery({ ...mailQuery(id ?? 0), enabled: id !== null });

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { InvitationPreviewDto, LessonDetailDto, LessonDto, LessonInput, RoomTableDto } from '../../../../shared/lessons';
import { api } from '../../../lib/api/client';

export const lessonsQuery = queryOptions({
  queryKey: ['lessons'],
  queryFn: () => api<{ teaching: LessonDto[]; attending: LessonDto[] }>('/lessons'),
});

export function lessonQuery(id: string) {
  return queryOptions({ queryKey: ['lessons', id], queryFn: async () => (await api<{ lesson: LessonDetailDto }>(`/lessons/${id}`)).lesson });
}

export function roomQuery(id: string) {
  return queryOptions({ queryKey: ['lessons', id, 'room'], queryFn: async () => (await api<{ tables: RoomTableDto[] }>(`/lessons/${id}/room`)).tables });
}

export function invitationQuery(token: string) {
  return queryOptions({
    queryKey: ['invitations', token],
    queryFn: async () => (await api<{ invitation: InvitationPreviewDto }>(`/invitations/${encodeURIComponent(token)}`)).invitation,
  });
}

export const useLessons = (enabled = true) => useQuery({ ...lessonsQuery, enabled });
/** Nothing pushes enrolments or payments either, so an open lesson page asks again now and then: the teacher sees seats fill. */
const LESSON_POLL_MS = 10_000;
export const useLesson = (id: string) => useQuery({ ...lessonQuery(id), refetchInterval: LESSON_POLL_MS });
/** Nothing pushes room changes, so the room asks again every few seconds until every table has finished: a waiting student sees their table appear. */
const ROOM_POLL_MS = 4000;
export const useRoom = (id: string, enabled: boolean) =>
  useQuery({
    ...roomQuery(id),
    enabled,
    refetchInterval: (query) => {
      const tables = query.state.data;
      return !tables?.length || tables.some((t) => t.status !== 'done') ? ROOM_POLL_MS : false;
    },
  });
export const useInvitation = (token: string) => useQuery(invitationQuery(token));

export function useScheduleLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: LessonInput) => (await api<{ lesson: LessonDetailDto }>('/lessons', { method: 'POST', body: input })).lesson,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: lessonsQuery.queryKey, exact: true }),
  });
}

export type InviteResult = { email: string; status: 'sent' | 'already-enrolled' | 'failed'; message: string };

export function useInvite(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (emails: string[]) => api<{ results: InviteResult[]; lesson: LessonDetailDto }>(`/lessons/${id}/invitations`, { method: 'POST', body: { emails } }),
    onSuccess: ({ lesson }) => queryClient.setQueryData(lessonQuery(id).queryKey, lesson),
  });
}

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<{ lesson: LessonDto; next: 'pay' | 'ready' }>(`/invitations/${encodeURIComponent(token)}/accept`, { method: 'POST' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: lessonsQuery.queryKey }),
  });
}

export function useSplitRoom(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: { tables?: number; bot?: string; holdEveryPass?: boolean }) =>
      (await api<{ tables: RoomTableDto[] }>(`/lessons/${id}/room`, { method: 'POST', body: input })).tables,
    onSuccess: (tables) => queryClient.setQueryData(roomQuery(id).queryKey, tables),
  });
}

export function useStartRoom(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<{ started: number; tables: RoomTableDto[] }>(`/lessons/${id}/room/start`, { method: 'POST' }),
    onSuccess: ({ tables }) => queryClient.setQueryData(roomQuery(id).queryKey, tables),
  });
}

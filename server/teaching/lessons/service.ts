/** Reading lessons for a viewer: who may see what, and the DTOs. */
import type { Request } from 'express';
import { Op } from 'sequelize';
import type { EnrollmentDto, InvitationDto, LessonDetailDto, LessonDto } from '../../../shared/lessons';
import { Enrollment, Invitation, Lesson, User } from '../../db/models';
import { HttpError } from '../../errors';
import { seatCounts } from './seats';

export type LessonRole = 'teacher' | 'student';

export function lessonEnd(lesson: Lesson): Date {
  return new Date(lesson.startsAt.getTime() + lesson.durationMinutes * 60_000);
}

function parseId(raw: unknown, what = 'lesson'): number {
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0) throw new HttpError(404, 'NOT_FOUND', `There is no ${what} with that id.`);
  return id;
}

/** The lesson and the viewer's part in it; 404 when there is none, 403 when the viewer has no part. */
export async function lessonFor(req: Request, rawId: unknown): Promise<{ lesson: Lesson; role: LessonRole; enrollment: Enrollment | null }> {
  const lesson = await Lesson.findByPk(parseId(rawId));
  if (!lesson) throw new HttpError(404, 'NOT_FOUND', 'There is no lesson with that id.');
  const user = req.user!;
  if (lesson.teacherId === user.id || user.role === 'admin') return { lesson, role: 'teacher', enrollment: null };
  const enrollment = await Enrollment.findOne({ where: { lessonId: lesson.id, userId: user.id } });
  if (!enrollment) throw new HttpError(403, 'NOT_IN_LESSON', 'This lesson is only for its teacher and the students invited to it.');
  return { lesson, role: 'student', enrollment };
}

export function requireLessonTeacher(role: LessonRole) {
  if (role !== 'teacher') throw new HttpError(403, 'NOT_LESSON_TEACHER', 'Only the teacher of this lesson can do that.');
}

export async function lessonDto(lesson: Lesson, viewerId: number, status: Enrollment['status'] | null, teacherName?: string): Promise<LessonDto> {
  const name = teacherName ?? (await User.findByPk(lesson.teacherId))?.displayName ?? 'Unknown teacher';
  const seats = await seatCounts(lesson);
  return {
    id: lesson.id,
    title: lesson.title,
    description: lesson.description,
    teacherId: lesson.teacherId,
    teacherName: name,
    startsAt: lesson.startsAt.toISOString(),
    timeZone: lesson.timeZone,
    durationMinutes: lesson.durationMinutes,
    seats: lesson.seats,
    seatsTaken: seats.taken,
    seatsHeld: seats.held,
    holdEndsAt: seats.holdEndsAt?.toISOString() ?? null,
    priceCents: lesson.priceCents,
    currency: lesson.currency,
    drillIds: lesson.drillIds,
    // A seed names the whole deal: only the teacher sees it.
    seed: lesson.teacherId === viewerId ? lesson.seed : null,
    myStatus: status,
    isTeacher: lesson.teacherId === viewerId,
  };
}

export async function lessonDetail(lesson: Lesson, viewerId: number, role: LessonRole, enrollment: Enrollment | null): Promise<LessonDetailDto> {
  const base = await lessonDto(lesson, viewerId, enrollment?.status ?? null);
  if (role !== 'teacher') return base;
  const enrollments = await Enrollment.findAll({ where: { lessonId: lesson.id }, order: [['id', 'ASC']] });
  const users = await User.findAll({ where: { id: { [Op.in]: enrollments.map((e) => e.userId) } } });
  const byId = new Map(users.map((u) => [u.id, u]));
  const invitations = await Invitation.findAll({ where: { lessonId: lesson.id }, order: [['id', 'DESC']], limit: 200 });
  return {
    ...base,
    seed: lesson.seed,
    enrollments: enrollments.map(
      (e): EnrollmentDto => ({ userId: e.userId, displayName: byId.get(e.userId)?.displayName ?? '?', email: byId.get(e.userId)?.email ?? '', status: e.status }),
    ),
    invitations: invitations.map(
      (i): InvitationDto => ({ id: i.id, email: i.email, expiresAt: i.expiresAt.toISOString(), usedAt: i.usedAt ? i.usedAt.toISOString() : null }),
    ),
  };
}

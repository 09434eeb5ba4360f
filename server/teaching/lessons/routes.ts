import { Router } from 'express';
import { Op, type Sequelize } from 'sequelize';
import { invitationsInputSchema, lessonInputSchema, roomInputSchema } from '../../../shared/lessons';
import { requireTeacher, requireUser } from '../../auth/guards';
import type { Config } from '../../config';
import { DrillRow, Enrollment, Lesson, User } from '../../db/models';
import { badInput, HttpError } from '../../errors';
import type { TableRegistry } from '../../realtime/registry';
import type { TableMaster } from '../../realtime/table-master';
import { httpRateLimit } from '../../security/rate-limits';
import { publicBase } from '../../services/links';
import type { Mailer } from '../../services/mail/mailer';
import { invitationMail } from '../../services/mail/messages';
import { enrollInvited, inviteOnce } from '../invitations/service';
import { lessonDetail, lessonDto, lessonEnd, lessonFor, requireLessonTeacher } from './service';
import { createRoom, roomTables, startRoom } from './room';
import { isTimeZone, zonedToUtc } from './time';

export interface LessonDeps {
  config: Config;
  sequelize: Sequelize;
  mailer: Mailer;
  registry: TableRegistry;
  tableChanged: (master: TableMaster) => void;
}

const SHOWN_MAX = 40;

/** An address as typed, trimmed, short enough to quote in a message. */
function quoted(raw: unknown): string | null {
  if (typeof raw !== 'string' || !raw.trim()) return null;
  const text = raw.trim();
  return text.length > SHOWN_MAX ? `${text.slice(0, SHOWN_MAX)}…` : text;
}

/** "ruth@harborlane is not an e-mail address…": each wrong address's message names it, as typed. */
function namingAddresses(error: HttpError, emails: unknown): HttpError {
  if (!error.fields || !Array.isArray(emails)) return error;
  const fields: Record<string, string> = {};
  for (const [key, message] of Object.entries(error.fields)) {
    const index = /^emails\.(\d+)$/.exec(key);
    const address = index ? quoted(emails[Number(index[1])]) : null;
    if (!address) fields[key] = message;
    else if (/does not look like an e-mail address/.test(message)) fields[key] = `${address} is not an e-mail address (name@example.test): correct it or take it out.`;
    else fields[key] = `${address}: ${message}`;
  }
  return new HttpError(error.status, error.code, error.message, fields);
}

export function lessonsRouter({ config, sequelize, mailer, registry, tableChanged }: LessonDeps) {
  const router = Router();
  router.use(requireUser);

  const inviteLimiter = httpRateLimit(config, {
    name: 'invitations',
    limit: config.rateLimits.invitations,
    key: (req) => `invite|${req.user?.id ?? 0}`,
    message: 'That is a lot of invitations in a short time. Please wait a while and try again.',
  });

  router.get('/', async (req, res) => {
    const user = req.user!;
    const teaching = await Lesson.findAll({ where: user.role === 'admin' ? {} : { teacherId: user.id }, order: [['startsAt', 'ASC']], limit: 300 });
    const mine = await Enrollment.findAll({ where: { userId: user.id } });
    const attending = mine.length ? await Lesson.findAll({ where: { id: { [Op.in]: mine.map((e) => e.lessonId) } }, order: [['startsAt', 'ASC']] }) : [];
    const status = new Map(mine.map((e) => [e.lessonId, e.status]));
    res.json({
      teaching: await Promise.all(teaching.map((l) => lessonDto(l, user.id, null))),
      attending: await Promise.all(attending.map((l) => lessonDto(l, user.id, status.get(l.id) ?? null))),
    });
  });

  router.post('/', requireTeacher, async (req, res) => {
    const parsed = lessonInputSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    const input = parsed.data;
    const fields: Record<string, string> = {};
    let startsAt: Date | null = null;
    if (!isTimeZone(input.timeZone)) fields.timeZone = 'Pick a time zone from the list, such as America/New_York.';
    else {
      startsAt = zonedToUtc(input.startsAtLocal, input.timeZone);
      if (!startsAt) fields.startsAtLocal = 'That time does not exist in that time zone (the clocks skip it). Pick another time.';
      else if (startsAt.getTime() < Date.now()) fields.startsAtLocal = 'Pick a start time in the future.';
    }
    if (input.drillIds.length) {
      const drills = await DrillRow.findAll({ where: { id: { [Op.in]: input.drillIds } } });
      const usable = new Set(drills.filter((d) => d.ownerId === req.user!.id || req.user!.role === 'admin').map((d) => d.id));
      const missing = input.drillIds.filter((id) => !usable.has(id));
      if (missing.length) fields.drillIds = 'Pick drills from your own list; one of these is not yours or no longer exists.';
    }
    if (Object.keys(fields).length) throw new HttpError(400, 'BAD_INPUT', 'Some fields need another look.', fields);
    const lesson = await Lesson.create({
      teacherId: req.user!.id,
      title: input.title,
      description: input.description,
      startsAt: startsAt!,
      timeZone: input.timeZone,
      durationMinutes: input.durationMinutes,
      seats: input.seats,
      priceCents: input.priceCents,
      currency: input.currency,
      drillIds: input.drillIds,
      seed: input.seed ?? null,
    });
    res.status(201).json({ lesson: await lessonDetail(lesson, req.user!.id, 'teacher', null) });
  });

  router.get('/:id', async (req, res) => {
    const { lesson, role, enrollment } = await lessonFor(req, req.params.id);
    res.json({ lesson: await lessonDetail(lesson, req.user!.id, role, enrollment) });
  });

  router.post('/:id/invitations', inviteLimiter, async (req, res) => {
    const { lesson, role } = await lessonFor(req, req.params.id);
    requireLessonTeacher(role);
    const parsed = invitationsInputSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw namingAddresses(badInput(parsed.error), (req.body as { emails?: unknown } | undefined)?.emails);
    const ends = lessonEnd(lesson);
    if (ends.getTime() <= Date.now()) throw new HttpError(409, 'LESSON_OVER', 'This lesson has already ended, so nobody can be invited to it.');
    const teacher = (await User.findByPk(lesson.teacherId))!;
    const base = publicBase(config, req);
    const results: { email: string; status: 'sent' | 'already-enrolled' | 'failed'; message: string }[] = [];
    for (const email of [...new Set(parsed.data.emails)]) {
      const existing = await User.findOne({ where: { email } });
      const enrollment = existing ? await Enrollment.findOne({ where: { lessonId: lesson.id, userId: existing.id } }) : null;
      if (enrollment && enrollment.status !== 'invited') {
        results.push({ email, status: 'already-enrolled', message: `${existing!.displayName} has already accepted.` });
        continue;
      }
      const expiresAt = new Date(Math.min(Date.now() + config.invitationTtlMs, ends.getTime()));
      const outcome = await inviteOnce({
        lessonId: lesson.id,
        email,
        expiresAt,
        secret: config.linkSecret,
        mail: (token) =>
          mailer.send({ to: email, ...invitationMail(lesson, teacher.displayName, `${base}/invitations/${token}`, expiresAt), kind: 'invitation', senderId: req.user!.id }),
      });
      if (outcome.status === 'already-sending') {
        results.push({ email, status: 'sent', message: `An invitation to ${email} is already on its way; it was not sent twice.` });
        continue;
      }
      if (outcome.status === 'failed') {
        results.push({ email, status: 'failed', message: outcome.error instanceof HttpError ? outcome.error.message : 'The invitation could not be sent.' });
        continue;
      }
      if (existing && !enrollment) await enrollInvited(lesson.id, existing.id);
      results.push({ email, status: 'sent', message: `Invitation sent to ${email}.` });
    }
    const status = results.every((r) => r.status === 'failed') ? 502 : 201;
    res.status(status).json({ results, lesson: await lessonDetail(lesson, req.user!.id, 'teacher', null) });
  });

  router.get('/:id/room', async (req, res) => {
    const { lesson, role, enrollment } = await lessonFor(req, req.params.id);
    if (role === 'student' && !enrollment) throw new HttpError(403, 'NOT_IN_LESSON', 'This lesson is only for its teacher and its students.');
    res.json({ tables: await roomTables(lesson, role === 'teacher' ? null : req.user!.id) });
  });

  router.post('/:id/room', async (req, res) => {
    const { lesson, role } = await lessonFor(req, req.params.id);
    requireLessonTeacher(role);
    const parsed = roomInputSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    const teacher = (await User.findByPk(lesson.teacherId))!;
    await createRoom(sequelize, lesson, teacher, parsed.data);
    res.status(201).json({ tables: await roomTables(lesson, null) });
  });

  router.post('/:id/room/start', async (req, res) => {
    const { lesson, role } = await lessonFor(req, req.params.id);
    requireLessonTeacher(role);
    const teacher = (await User.findByPk(lesson.teacherId))!;
    const started = await startRoom(lesson, teacher, registry, tableChanged);
    res.json({ started, tables: await roomTables(lesson, null) });
  });

  return router;
}

import request from 'supertest';
import { expect } from 'vitest';
import { Enrollment, Invitation, Mail } from '../../server/db/models';
import { zonedToUtc } from '../../server/teaching/lessons/time';
import { createUser, signedIn } from './helpers';
import { createLesson, inviteToken, lessonBody, lessonTest, mailsTo } from './lesson-helpers';

const test = lessonTest([['ines@harborlane.test', 'teacher'], ['theo@harborlane.test'], ['mina@harborlane.test'], ['pat@harborlane.test', 'admin']]);

test('wall-clock times in a zone become the right instant, DST gaps are refused', () => {
  // US clocks (from memory, tz database rules): forward on 8 March 2026 at 02:00, back on 1 November 2026 at 02:00.
  expect(zonedToUtc('2026-07-01T19:00', 'America/New_York')?.toISOString()).toBe('2026-07-01T23:00:00.000Z');
  expect(zonedToUtc('2026-12-01T19:00', 'America/New_York')?.toISOString()).toBe('2026-12-02T00:00:00.000Z');
  expect(zonedToUtc('2026-03-08T02:30', 'America/New_York')).toBeNull();
  expect(zonedToUtc('2026-11-01T01:30', 'America/New_York')?.toISOString()).toBe('2026-11-01T05:30:00.000Z');
  expect(zonedToUtc('2026-06-10T09:15', 'Asia/Kolkata')?.toISOString()).toBe('2026-06-10T03:45:00.000Z');
  expect(zonedToUtc('2026-02-30T10:00', 'UTC')).toBeNull();
});

test('the schedule form: every field is checked, with a message beside it', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const empty = await ines.post('/api/lessons').send({});
  expect(empty.status).toBe(400);
  expect(Object.keys(empty.body.error.fields).sort()).toEqual(['durationMinutes', 'priceCents', 'seats', 'startsAtLocal', 'timeZone', 'title']);

  const cases: [object, string, RegExp][] = [
    [{ title: ' ' }, 'title', /title/],
    [{ title: 'x'.repeat(101) }, 'title', /at most 100/],
    [{ startsAtLocal: 'next tuesday' }, 'startsAtLocal', /day and time/],
    [{ startsAtLocal: '2020-01-01T10:00' }, 'startsAtLocal', /future/],
    [{ startsAtLocal: '2030-03-10T02:30' }, 'startsAtLocal', /does not exist/],
    [{ timeZone: 'Harbor/Lane' }, 'timeZone', /time zone/],
    [{ durationMinutes: 5 }, 'durationMinutes', /at least 15/],
    [{ durationMinutes: 60.5 }, 'durationMinutes', /whole minutes/],
    [{ seats: 0 }, 'seats', /at least one seat/],
    [{ seats: 33 }, 'seats', /at most 32/],
    [{ priceCents: 50 }, 'priceCents', /between 1 and 1000/],
    [{ currency: 'doubloons' }, 'currency', /currency/],
    [{ seed: '' }, 'seed', /Pick a drill, or name a seed/],
    [{ drillIds: ['no-such-drill'] }, 'drillIds', /your own list/],
    [{ surprise: true }, '_', /surprise/],
  ];
  for (const [change, field, message] of cases) {
    const res = await ines.post('/api/lessons').send(lessonBody(change));
    expect(res.status, JSON.stringify(change)).toBe(400);
    const fields = res.body.error.fields as Record<string, string>;
    expect(fields[field] ?? Object.values(fields).join(' '), JSON.stringify(change)).toMatch(message);
  }

  const ok = await ines.post('/api/lessons').send(lessonBody({ priceCents: 1500, currency: 'usd', seats: 4 }));
  expect(ok.status).toBe(201);
  // 14 May 2030, 19:00 in New York is daylight time, UTC-4 (from memory, tz database rules).
  expect(ok.body.lesson).toMatchObject({ title: 'Harbor Lane week 1: passing right', startsAt: '2030-05-14T23:00:00.000Z', timeZone: 'America/New_York', seats: 4, seatsTaken: 0, priceCents: 1500, seed: 'harbor-lane-week-01' });
});

test('who may do what: signed out 401, wrong role 403, another lesson 403', async ({ t }) => {
  const anon = request(t.app);
  for (const [method, path] of [
    ['get', '/api/lessons'],
    ['post', '/api/lessons'],
    ['get', '/api/lessons/1'],
    ['post', '/api/lessons/1/invitations'],
    ['get', '/api/lessons/1/room'],
    ['post', '/api/lessons/1/room'],
    ['post', '/api/invitations/x.y.z.w/accept'],
    ['get', '/api/mail'],
    ['post', '/api/payments/checkout'],
    ['get', '/api/payments/1'],
  ] as const) {
    const res = await anon[method](path).send({});
    expect(res.status, `${method} ${path}`).toBe(401);
  }
  const theo = await signedIn(t.app, 'theo@harborlane.test');
  expect((await theo.post('/api/lessons').send(lessonBody())).status).toBe(403);
  expect((await theo.get('/api/mail')).status).toBe(403);

  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  expect((await theo.get(`/api/lessons/${lesson.id}`)).body.error.code).toBe('NOT_IN_LESSON');
  expect((await theo.get(`/api/lessons/${lesson.id}/room`)).status).toBe(403);
  expect((await theo.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: ['theo@harborlane.test'] })).status).toBe(403);

  // A student of the lesson still may not invite or split the room.
  const { token } = await inviteToken(ines, lesson.id, 'theo@harborlane.test');
  expect((await theo.post(`/api/invitations/${token}/accept`)).status).toBe(200);
  expect((await theo.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: ['mina@harborlane.test'] })).body.error.code).toBe('NOT_LESSON_TEACHER');
  expect((await theo.post(`/api/lessons/${lesson.id}/room`).send({})).status).toBe(403);

  // Another teacher sees nothing of Ines's lesson; the admin sees it all.
  await createUser('ruth@harborlane.test', 'teacher');
  const ruth = await signedIn(t.app, 'ruth@harborlane.test');
  expect((await ruth.get(`/api/lessons/${lesson.id}`)).status).toBe(403);
  const pat = await signedIn(t.app, 'pat@harborlane.test');
  expect((await pat.get(`/api/lessons/${lesson.id}`)).body.lesson.enrollments).toHaveLength(1);
  expect((await theo.get(`/api/lessons/${lesson.id}`)).body.lesson.enrollments).toBeUndefined();
  expect((await theo.get(`/api/lessons/${lesson.id}`)).body.lesson.seed).toBeNull();
});

test('an invitation goes out by mail, its link enrols the invitee once', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines, { seats: 4 });
  const sent = await ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: ['Theo@HarborLane.test', 'newcomer@harborlane.test'] });
  expect(sent.status).toBe(201);
  expect(sent.body.results.map((r: { status: string }) => r.status)).toEqual(['sent', 'sent']);

  // The SMTP fake got the message, parsed it, and kept it.
  const [mail] = await mailsTo('theo@harborlane.test', 'invitation');
  expect(mail.subject).toBe('theo invites you to "Harbor Lane week 1: passing right"'.replace('theo', 'ines'));
  expect(mail.from).toContain('lessons@rackside.test');
  expect(mail.text).toContain('It starts Tuesday, May 14, 2030 at 7:00 PM (America/New York)');
  const link = mail.text.match(/http:\/\/[^\s]+\/invitations\/[^\s]+/)![0];
  expect(mail.html).toContain(link);
  const token = new URL(link).pathname.split('/').pop()!;

  // Following the link: the preview, then accepting as the invitee.
  const preview = await request(t.app).get(`/api/invitations/${token}`);
  expect(preview.status).toBe(200);
  expect(preview.body.invitation).toMatchObject({ emailHint: 't***@harborlane.test', lesson: { title: lesson.title, teacherName: 'ines' } });

  const mina = await signedIn(t.app, 'mina@harborlane.test');
  const wrong = await mina.post(`/api/invitations/${token}/accept`);
  expect(wrong.status).toBe(403);
  expect(wrong.body.error.message).toMatch(/sent to t\*\*\*@harborlane.test/);

  const theo = await signedIn(t.app, 'theo@harborlane.test');
  expect((await theo.get('/api/lessons')).body.attending[0].myStatus).toBe('invited');
  const accepted = await theo.post(`/api/invitations/${token}/accept`);
  expect(accepted.status).toBe(200);
  expect(accepted.body).toMatchObject({ next: 'ready', lesson: { myStatus: 'enrolled', seatsTaken: 1 } });

  const again = await theo.post(`/api/invitations/${token}/accept`);
  expect(again.status).toBe(410);
  expect(again.body.error).toMatchObject({ code: 'INVITATION_USED' });
  expect(again.body.error.message).toMatch(/already used on .* ask ines for a new invitation/);
  expect((await request(t.app).get(`/api/invitations/${token}`)).body.error.code).toBe('INVITATION_USED');
  expect(await Enrollment.count()).toBe(1);
});

test('expired, altered and superseded links are refused with a clear message', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  const first = await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  const second = await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  const mina = await signedIn(t.app, 'mina@harborlane.test');
  // Inviting again ends the older link, and says it was replaced.
  expect((await mina.post(`/api/invitations/${first.token}/accept`)).body.error.code).toBe('INVITATION_REPLACED');

  const [id, exp, nonce, sig] = second.token.split('.');
  const altered = [id, String(Number(exp) + 86400), nonce, sig].join('.');
  const refused = await mina.post(`/api/invitations/${altered}/accept`);
  expect(refused.status).toBe(404);
  expect(refused.body.error.message).toMatch(/not one we sent/);
  expect((await mina.post(`/api/invitations/${[String(Number(id) - 1), exp, nonce, sig].join('.')}/accept`)).status).toBe(404);

  await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email: 'mina@harborlane.test' } });
  const expired = await mina.post(`/api/invitations/${second.token}/accept`);
  expect(expired.status).toBe(410);
  expect(expired.body.error.code).toBe('INVITATION_EXPIRED');
  expect(expired.body.error.message).toMatch(/expired on .* Ask ines to send you a new one/);
  expect(await Enrollment.count({ where: { status: 'enrolled' } })).toBe(0);
});

test('the invite form: addresses are checked, an accepted student is not invited twice', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  expect((await ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: [] })).body.error.fields.emails).toMatch(/at least one/);
  expect((await ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: ['not an address'] })).body.error.fields['emails.0']).toMatch(/e-mail address/);
  expect((await ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: Array(41).fill('a@harborlane.test') })).body.error.fields.emails).toMatch(/at most 40/);
  const { token } = await inviteToken(ines, lesson.id, 'theo@harborlane.test');
  await (await signedIn(t.app, 'theo@harborlane.test')).post(`/api/invitations/${token}/accept`);
  const again = await ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: ['theo@harborlane.test'] });
  expect(again.body.results[0].status).toBe('already-enrolled');
  expect(await Mail.count({ where: { kind: 'invitation' } })).toBe(1);
});

test('a free lesson fills: the last seat goes to one of two students who accept at once', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines, { seats: 1 });
  const theo = await inviteToken(ines, lesson.id, 'theo@harborlane.test');
  const mina = await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  const [a, b] = await Promise.all([
    (await signedIn(t.app, 'theo@harborlane.test')).post(`/api/invitations/${theo.token}/accept`),
    (await signedIn(t.app, 'mina@harborlane.test')).post(`/api/invitations/${mina.token}/accept`),
  ]);
  expect([a.status, b.status].sort()).toEqual([200, 409]);
  const loser = a.status === 409 ? a : b;
  expect(loser.body.error.message).toMatch(/All 1 seats of "Harbor Lane week 1: passing right" are taken/);
  expect(await Enrollment.count({ where: { lessonId: lesson.id, status: 'enrolled' } })).toBe(1);
});

test('the outbox: teachers read what they sent, admins everything, players nothing', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  await inviteToken(ines, lesson.id, 'theo@harborlane.test');
  await createUser('ruth@harborlane.test', 'teacher');
  const ruth = await signedIn(t.app, 'ruth@harborlane.test');
  const own = await ines.get('/api/mail');
  expect(own.body.mails).toHaveLength(1);
  expect(own.body.mails[0]).toMatchObject({ to: 'theo@harborlane.test', kind: 'invitation' });
  expect(own.body.mails[0].text).toBeUndefined();
  const full = await ines.get(`/api/mail/${own.body.mails[0].id}`);
  expect(full.body.mail.text).toContain('/invitations/');
  expect((await ruth.get('/api/mail')).body.mails).toHaveLength(0);
  expect((await ruth.get(`/api/mail/${own.body.mails[0].id}`)).status).toBe(404);
  const pat = await signedIn(t.app, 'pat@harborlane.test');
  expect((await pat.get('/api/mail?to=theo')).body.mails).toHaveLength(1);
});

/** The same request twice at once (a double click): one takes effect, the other gets a clear answer, never a 500. */
import request from 'supertest';
import { expect } from 'vitest';
import { Enrollment, Invitation, User } from '../../server/db/models';
import { inviteOnce } from '../../server/teaching/invitations/service';
import { signedIn } from './helpers';
import { createLesson, inviteToken, lessonTest, linkIn, mailsTo } from './lesson-helpers';

const test = lessonTest([['ines@harborlane.test', 'teacher'], ['theo@harborlane.test']]);

test('two registrations of one e-mail at once: one 201, one 409 EMAIL_TAKEN, and the account exists once', async ({ t }) => {
  const body = { email: 'mina@harborlane.test', password: 'tiles-and-tea', displayName: 'Mina' };
  const answers = await Promise.all([request(t.app).post('/api/auth/register').send(body), request(t.app).post('/api/auth/register').send(body)]);
  expect(answers.map((r) => r.status).sort()).toEqual([201, 409]);
  const refused = answers.find((r) => r.status === 409)!;
  expect(refused.body.error).toMatchObject({ code: 'EMAIL_TAKEN', fields: { email: expect.any(String) } });
  expect(await User.count({ where: { email: 'mina@harborlane.test' } })).toBe(1);
});

for (const [who, email] of [
  ['someone with an account', 'theo@harborlane.test'],
  ['an address with no account yet', 'newcomer@harborlane.test'],
] as const) {
  test(`the same invitation sent twice at once to ${who}: both answer 201, one mail goes out, one link works`, async ({ t }) => {
    const ines = await signedIn(t.app, 'ines@harborlane.test');
    const lesson = await createLesson(ines);
    const send = () => ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: [email] });
    const answers = await Promise.all([send(), send()]);
    expect(answers.map((r) => r.status)).toEqual([201, 201]);
    expect(answers.flatMap((r) => r.body.results.map((x: { status: string }) => x.status))).toEqual(['sent', 'sent']);
    const mails = await mailsTo(email, 'invitation');
    expect(mails).toHaveLength(1);
    expect(await Invitation.count({ where: { email } })).toBe(1);
    const token = new URL(linkIn(mails[0], '/invitations')).pathname.split('/').pop()!;
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(200);
    if (email === 'theo@harborlane.test') expect(await Enrollment.count()).toBe(1);
  });
}

test('inviting the same address again later still sends a new link and ends the old one', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  const first = await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  const second = await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  const third = await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  expect(await mailsTo('mina@harborlane.test', 'invitation')).toHaveLength(3);
  expect((await request(t.app).get(`/api/invitations/${first.token}`)).body.error.code).toBe('INVITATION_REPLACED');
  expect((await request(t.app).get(`/api/invitations/${second.token}`)).body.error.code).toBe('INVITATION_REPLACED');
  expect((await request(t.app).get(`/api/invitations/${third.token}`)).status).toBe(200);
});

test('a send left half-way by a process that stopped does not block the address for good', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  // A send whose mail never finishes, as if its process had died mid-send.
  void inviteOnce({ lessonId: lesson.id, email: 'mina@harborlane.test', expiresAt: new Date(Date.now() + 3600_000), secret: t.config.linkSecret, mail: () => new Promise(() => {}) });
  await expect.poll(() => Invitation.count({ where: { email: 'mina@harborlane.test' } })).toBe(1);
  const busy = await ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: ['mina@harborlane.test'] });
  expect(busy.body.results[0].message).toMatch(/already on its way/);
  expect(await mailsTo('mina@harborlane.test', 'invitation')).toHaveLength(0);

  await t.sequelize.query("UPDATE Invitations SET createdAt = :old WHERE email = 'mina@harborlane.test'", { replacements: { old: new Date(Date.now() - 10 * 60 * 1000) } });
  await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  expect(await mailsTo('mina@harborlane.test', 'invitation')).toHaveLength(1);
});

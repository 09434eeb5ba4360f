/** Sending invitations is rate limited per teacher (INVITE_RATE_MAX within INVITE_RATE_WINDOW_MS). */
import { expect } from 'vitest';
import { testConfig } from '../../server/config';
import { Invitation } from '../../server/db/models';
import { signedIn } from './helpers';
import { createLesson, lessonTest } from './lesson-helpers';

const test = lessonTest(
  [
    ['ines@harborlane.test', 'teacher'],
    ['ruth@harborlane.test', 'teacher'],
  ],
  { rateLimits: { ...testConfig().rateLimits, invitations: { max: 2, windowMs: 60 * 60 * 1000 } } },
);

test('a teacher past the invitation limit is refused with 429 and a message saying to wait; nothing more is sent', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  for (const email of ['theo@harborlane.test', 'mina@harborlane.test']) {
    expect((await ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: [email] })).status).toBe(201);
  }
  const refused = await ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: ['sol@harborlane.test'] });
  expect(refused.status).toBe(429);
  expect(refused.body).toEqual({ error: { code: 'RATE_LIMITED', message: expect.stringMatching(/wait a while and try again/) } });
  expect((await Invitation.findAll()).map((i) => i.email).sort()).toEqual(['mina@harborlane.test', 'theo@harborlane.test']);
});

test('the limit is counted per teacher: another teacher may still invite', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const ruth = await signedIn(t.app, 'ruth@harborlane.test');
  const hers = await createLesson(ines);
  const theirs = await createLesson(ruth);
  for (let i = 0; i < 2; i++) await ines.post(`/api/lessons/${hers.id}/invitations`).send({ emails: [`p${i}@harborlane.test`] }).expect(201);
  expect((await ines.post(`/api/lessons/${hers.id}/invitations`).send({ emails: ['p9@harborlane.test'] })).status).toBe(429);
  expect((await ruth.post(`/api/lessons/${theirs.id}/invitations`).send({ emails: ['sol@harborlane.test'] })).status).toBe(201);
});

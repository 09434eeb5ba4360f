/** Why an invitation link no longer works: replaced, expired and used each get their own code and words. */
import request from 'supertest';
import { expect } from 'vitest';
import { Invitation } from '../../server/db/models';
import { signedIn } from './helpers';
import { createLesson, inviteToken, lessonTest } from './lesson-helpers';

const test = lessonTest([['ines@harborlane.test', 'teacher'], ['mina@harborlane.test']]);

test('a link replaced by a newer invitation says so, on opening and on accepting, and points to the latest mail', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  const first = await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  const second = await inviteToken(ines, lesson.id, 'mina@harborlane.test');

  const opened = await request(t.app).get(`/api/invitations/${first.token}`);
  expect(opened.status).toBe(410);
  expect(opened.body.error.code).toBe('INVITATION_REPLACED');
  expect(opened.body.error.message).toMatch(/replaced by a newer one/);
  expect(opened.body.error.message).toMatch(/latest e-mail/);
  expect(opened.body.error.message).toMatch(/m\*\*\*@harborlane\.test/);

  const mina = await signedIn(t.app, 'mina@harborlane.test');
  const accepted = await mina.post(`/api/invitations/${first.token}/accept`);
  expect(accepted.status).toBe(410);
  expect(accepted.body.error.code).toBe('INVITATION_REPLACED');

  // The newer link works.
  expect((await request(t.app).get(`/api/invitations/${second.token}`)).status).toBe(200);
});

test('a link that ran out of time with no newer one says it expired; a used one says it was used', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  const only = await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email: 'mina@harborlane.test' } });
  const expired = await request(t.app).get(`/api/invitations/${only.token}`);
  expect(expired.status).toBe(410);
  expect(expired.body.error.code).toBe('INVITATION_EXPIRED');
  expect(expired.body.error.message).toMatch(/expired on/);

  const fresh = await inviteToken(ines, lesson.id, 'mina@harborlane.test');
  const mina = await signedIn(t.app, 'mina@harborlane.test');
  expect((await mina.post(`/api/invitations/${fresh.token}/accept`)).status).toBe(200);
  const used = await request(t.app).get(`/api/invitations/${fresh.token}`);
  expect(used.status).toBe(410);
  expect(used.body.error.code).toBe('INVITATION_USED');
  // The older link, ended by the newer one, still says it was replaced.
  expect((await request(t.app).get(`/api/invitations/${only.token}`)).body.error.code).toBe('INVITATION_REPLACED');
});

test('the invite form names each address that is not one, as it was typed', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines);
  const res = await ines.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: ['mina@harborlane.test', ' Ruth@HarborLane ', 'x'.repeat(300)] });
  expect(res.status).toBe(400);
  const fields = res.body.error.fields as Record<string, string>;
  expect(fields['emails.1']).toMatch(/^Ruth@HarborLane is not an e-mail address/);
  expect(fields['emails.2']).toMatch(/^x{40}…/);
  expect(fields['emails.2'].length).toBeLessThan(160);
  expect(fields['emails.0']).toBeUndefined();
});

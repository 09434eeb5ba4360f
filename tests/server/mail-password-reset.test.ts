import request from 'supertest';
import { expect } from 'vitest';
import { Mail, PasswordReset } from '../../server/db/models';
import { createMailer } from '../../server/services/mail/mailer';
import { readToken } from '../../server/services/tokens';
import { signedIn } from './helpers';
import { lessonApp, lessonTest, linkIn, mailsTo } from './lesson-helpers';

const test = lessonTest([['ruth@harborlane.test', 'player', 'old-password-1']]);

const tokenOf = (link: string) => new URL(link).pathname.split('/').pop()!;

test('the SMTP fake keeps what nodemailer sends: addresses, subject, both parts, our headers', async ({ t }) => {
  const mailer = createMailer(t.config);
  await mailer.send({ to: 'Sol Varga <sol@harborlane.test>', subject: 'Tiles on Thursday', text: 'Plain words.', html: '<p>Plain <b>words</b>.</p>', kind: 'invitation', senderId: 7 });
  mailer.close();
  const [mail] = await Mail.findAll();
  expect(mail).toMatchObject({ to: '"Sol Varga" <sol@harborlane.test>', subject: 'Tiles on Thursday', kind: 'invitation', senderId: 7 });
  expect(mail.from).toBe('"Rackside" <lessons@rackside.test>');
  expect(mail.text.trim()).toBe('Plain words.');
  expect(mail.html).toContain('<b>words</b>');
});

test('a password reset goes by mail; its link sets a new password once', async ({ t }) => {
  const anon = request(t.app);
  const asked = await anon.post('/api/auth/password-reset').send({ email: 'Ruth@HarborLane.test' });
  expect(asked.status).toBe(200);
  expect(asked.body.message).toMatch(/If an account uses that address/);
  const [mail] = await mailsTo('ruth@harborlane.test', 'password-reset');
  expect(mail.subject).toBe('Choose a new Rackside password');
  const token = tokenOf(linkIn(mail, '/reset-password'));
  expect((await anon.get(`/api/auth/password-reset/${token}`)).status).toBe(200);

  const short = await anon.post('/api/auth/password-reset/confirm').send({ token, password: 'short' });
  expect(short.status).toBe(400);
  expect(short.body.error.fields.password).toMatch(/at least 8/);
  const done = await anon.post('/api/auth/password-reset/confirm').send({ token, password: 'new-password-2' });
  expect(done.status).toBe(200);
  expect(done.body.message).toMatch(/Sign in with the new one/);

  await signedIn(t.app, 'ruth@harborlane.test', 'new-password-2');
  expect((await anon.post('/api/auth/login').send({ email: 'ruth@harborlane.test', password: 'old-password-1' })).status).toBe(401);
  const reused = await anon.post('/api/auth/password-reset/confirm').send({ token, password: 'another-password-3' });
  expect(reused.status).toBe(410);
  expect(reused.body.error).toMatchObject({ code: 'RESET_USED' });
});

test('reset links: unknown addresses get the same answer and no mail; expired and altered links are refused', async ({ t }) => {
  const anon = request(t.app);
  const unknown = await anon.post('/api/auth/password-reset').send({ email: 'nobody@harborlane.test' });
  const known = await anon.post('/api/auth/password-reset').send({ email: 'ruth@harborlane.test' });
  expect(unknown.body).toEqual(known.body);
  expect(await Mail.count({ where: { kind: 'password-reset' } })).toBe(1);
  expect((await anon.post('/api/auth/password-reset').send({ email: 'ruth' })).body.error.fields.email).toMatch(/e-mail address/);
  expect((await anon.post('/api/auth/password-reset/confirm').send({})).body.error.fields).toHaveProperty('token');

  const token = tokenOf(linkIn((await mailsTo('ruth@harborlane.test', 'password-reset'))[0], '/reset-password'));
  const altered = token.slice(0, -2) + (token.endsWith('AA') ? 'BB' : 'AA');
  expect((await anon.post('/api/auth/password-reset/confirm').send({ token: altered, password: 'new-password-2' })).body.error.code).toBe('RESET_INVALID');
  // A reset's signature is not an invitation's: the purpose is part of what is signed.
  expect(readToken(t.config.linkSecret, 'password-reset', token)).not.toBeNull();
  expect(readToken(t.config.linkSecret, 'invitation', token)).toBeNull();
  await PasswordReset.update({ expiresAt: new Date(Date.now() - 1000) }, { where: {} });
  const expired = await anon.post('/api/auth/password-reset/confirm').send({ token, password: 'new-password-2' });
  expect(expired.status).toBe(410);
  expect(expired.body.error.message).toMatch(/expired. Ask for a new one/);
});

test('reset requests are limited per address', async ({ t, apps }) => {
  const limited = apps.adopt(await lessonApp({ rateLimits: { ...t.config.rateLimits, passwordReset: { max: 2, windowMs: 60_000 } } }));
  const anon = request(limited.app);
  for (let i = 0; i < 2; i++) expect((await anon.post('/api/auth/password-reset').send({ email: 'sol@harborlane.test' })).status).toBe(200);
  const third = await anon.post('/api/auth/password-reset').send({ email: 'sol@harborlane.test' });
  expect(third.status).toBe(429);
  expect(third.body.error.message).toMatch(/Too many reset requests/);
});

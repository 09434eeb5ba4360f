/** A user's sessions and sockets follow their account: a password reset signs out everywhere else, a role change reaches open sockets. */
import { io as connect, type Socket } from 'socket.io-client';
import request from 'supertest';
import { expect } from 'vitest';
import type { Ack } from '../../shared/protocol';
import { User } from '../../server/db/models';
import { createUser, sessionCookie } from './helpers';
import { linkIn, mailsTo } from './lesson-helpers';
import { liveTest } from './live';

/** `signIn` returns a session cookie; `open` connects a socket on it, closed after the test; `me` asks who a cookie is. */
const test = liveTest
  .extend('signIn', async ({ server }) => async (email: string, password = 'correct horse') => {
    const res = await request(server.url).post('/api/auth/login').send({ email, password });
    expect(res.status).toBe(200);
    return sessionCookie(res)!.split(';')[0];
  })
  .extend('open', async ({ live, server }) => (cookie: string, reconnection = false) => {
    const socket = connect(server.url, { transports: ['websocket'], reconnection, reconnectionDelay: 10, extraHeaders: { Cookie: cookie } });
    live.track(socket);
    return socket;
  })
  .extend('me', async ({ server }) => (cookie: string) => request(server.url).get('/api/auth/me').set('Cookie', cookie));

const connected = (socket: Socket) => new Promise<void>((resolve) => socket.once('connect', () => resolve()));
const join = (socket: Socket, tableId: string) => socket.timeout(10_000).emitWithAck('table:join', { tableId, as: 'spectator' }) as Promise<Ack>;

test("a password reset ends the user's other sessions and closes their sockets; the session that reset stays", async ({ server, signIn, open, me }) => {
  await createUser('ruth@harborlane.test', 'player', 'old-password-1');
  const laptop = await signIn('ruth@harborlane.test', 'old-password-1');
  const phone = await signIn('ruth@harborlane.test', 'old-password-1');
  const here = await signIn('ruth@harborlane.test', 'old-password-1');
  await createUser('sol@harborlane.test');
  const someoneElse = await signIn('sol@harborlane.test');
  const phoneSocket = open(phone);
  const hereSocket = open(here);
  const otherSocket = open(someoneElse);
  await Promise.all([connected(phoneSocket), connected(hereSocket), connected(otherSocket)]);
  const phoneClosed = new Promise<string>((resolve) => phoneSocket.once('disconnect', resolve));

  await request(server.url).post('/api/auth/password-reset').send({ email: 'ruth@harborlane.test' }).expect(200);
  const [mail] = await mailsTo('ruth@harborlane.test', 'password-reset');
  const token = new URL(linkIn(mail, '/reset-password')).pathname.split('/').pop()!;
  await request(server.url).post('/api/auth/password-reset/confirm').set('Cookie', here).send({ token, password: 'new-password-2' }).expect(200);

  expect((await me(laptop)).status).toBe(401);
  expect((await me(phone)).status).toBe(401);
  expect(await phoneClosed).toBe('io server disconnect');
  // The session that set the new password, and other users, are left alone.
  expect((await me(here)).status).toBe(200);
  expect((await me(someoneElse)).status).toBe(200);
  expect(hereSocket.connected).toBe(true);
  expect(otherSocket.connected).toBe(true);
});

test('a reset from a signed-out browser ends every session of the user', async ({ server, signIn, me }) => {
  await createUser('ruth@harborlane.test', 'player', 'old-password-1');
  const laptop = await signIn('ruth@harborlane.test', 'old-password-1');
  await request(server.url).post('/api/auth/password-reset').send({ email: 'ruth@harborlane.test' }).expect(200);
  const [mail] = await mailsTo('ruth@harborlane.test', 'password-reset');
  const token = new URL(linkIn(mail, '/reset-password')).pathname.split('/').pop()!;
  await request(server.url).post('/api/auth/password-reset/confirm').send({ token, password: 'new-password-2' }).expect(200);
  const refused = await me(laptop);
  expect(refused.status).toBe(401);
  expect(refused.body.error.code).toBe('UNAUTHENTICATED');
});

test('a demoted admin: the open socket reconnects under the new role and can no longer join a private table the REST route refuses', async ({ server, signIn, open, me }) => {
  await createUser('ines@harborlane.test', 'admin');
  await createUser('theo@harborlane.test', 'admin');
  await createUser('mina@harborlane.test', 'teacher');
  const boss = await signIn('ines@harborlane.test');
  const theo = await signIn('theo@harborlane.test');
  const host = await signIn('mina@harborlane.test');
  const table = (await request(server.url).post('/api/tables').set('Cookie', host).send({ name: 'Closed door', private: true }).expect(201)).body.table;

  const socket = open(theo, true);
  await connected(socket);
  expect((await join(socket, table.id)).ok).toBe(true);
  socket.emit('table:leave', {});

  const dropped = new Promise<void>((resolve) => socket.once('disconnect', () => resolve()));
  const theoId = (await User.findOne({ where: { email: 'theo@harborlane.test' } }))!.id;
  await request(server.url).patch(`/api/admin/users/${theoId}`).set('Cookie', boss).send({ role: 'teacher' }).expect(200);
  expect((await request(server.url).get(`/api/tables/${table.id}`).set('Cookie', theo)).status).toBe(403);

  await dropped;
  if (!socket.connected) await connected(socket);
  const refused = await join(socket, table.id);
  expect(refused).toMatchObject({ ok: false, code: 'INVITE_REQUIRED' });
  // Still signed in: only the role changed.
  expect((await me(theo)).body.user.role).toBe('teacher');
});

import { io as connect } from 'socket.io-client';
import request from 'supertest';
import { expect } from 'vitest';
import { createUser, sessionCookie } from './helpers';
import { liveTest } from './live';

/**
 * Every test has a server where Theo has an account (`url`); `open` connects a socket, with his
 * cookie or none, closed after the test; `signIn` signs him in and returns the cookie.
 */
const test = liveTest
  .extend('url', { auto: true }, async ({ live }) => {
    const server = await live.start({ sessionSecret: 's' });
    await createUser('theo@harborlane.test');
    return server.url;
  })
  .extend('open', async ({ live, url }) => (cookie?: string) => {
    const socket = connect(url, { transports: ['websocket'], reconnection: false, extraHeaders: cookie ? { Cookie: cookie } : {} });
    live.track(socket);
    return socket;
  })
  .extend('signIn', async ({ url }) => async () => {
    const res = await request(url).post('/api/auth/login').send({ email: 'theo@harborlane.test', password: 'correct horse' });
    return sessionCookie(res)!.split(';')[0];
  });

test('a signed-in socket connects on the same port as the API', async ({ open, signIn }) => {
  const socket = open(await signIn());
  await new Promise<void>((resolve, reject) => {
    socket.on('connect', resolve);
    socket.on('connect_error', reject);
  });
  expect(socket.connected).toBe(true);
});

test('a socket without a session is refused with UNAUTHENTICATED', async ({ open }) => {
  const socket = open();
  const err = await new Promise<Error & { data?: { code: string } }>((resolve) => socket.on('connect_error', resolve));
  expect(err.data?.code).toBe('UNAUTHENTICATED');
});

test("signing out disconnects that session's open sockets", async ({ url, open, signIn }) => {
  const cookie = await signIn();
  const socket = open(cookie);
  await new Promise<void>((resolve) => socket.on('connect', () => resolve()));
  const closed = new Promise<string>((resolve) => socket.on('disconnect', resolve));
  await request(url).post('/api/auth/logout').set('Cookie', cookie).expect(200);
  expect(await closed).toBe('io server disconnect');
});

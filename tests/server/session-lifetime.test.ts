/**
 * Session lifetimes on a clock the test moves: the idle lifetime (SESSION_IDLE_MS) and the
 * absolute one (SESSION_ABSOLUTE_MS) at their defaults, each checked a minute before and a
 * minute after its deadline, so nothing depends on how fast the machine is.
 */
import { io as connect } from 'socket.io-client';
import request from 'supertest';
import { afterEach, beforeEach, expect, vi } from 'vitest';
import { appTest, createUser, sessionCookie } from './helpers';
import { liveKit, register } from './live';

const MINUTE = 60 * 1000;

beforeEach(() => {
  // Only Date is faked: timers, sockets and the database run as usual, and the clock moves only when told.
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(new Date('2030-01-07T09:00:00Z'));
});
afterEach(() => {
  vi.useRealTimers();
});

const wait = (ms: number) => vi.setSystemTime(Date.now() + ms);

/** `app()` makes an app with Ruth signed in, and `live` starts servers; both are closed after the test. */
const test = appTest
  .extend('app', async ({ apps }) => async () => {
    const t = await apps.make();
    await createUser('ruth@harborlane.test');
    const login = await request(t.app).post('/api/auth/login').send({ email: 'ruth@harborlane.test', password: 'correct horse' });
    return { t, cookie: sessionCookie(login)!.split(';')[0] };
  })
  .extend('live', liveKit);

test('ASVS 7.3.1: a session idle past its lifetime is refused, and stays refused with the old cookie replayed', async ({ app }) => {
  const { t, cookie } = await app();
  const idle = t.config.sessionMaxAgeMs;
  const me = () => request(t.app).get('/api/auth/me').set('Cookie', cookie);
  wait(idle - MINUTE);
  expect((await me()).status).toBe(200);
  wait(idle + MINUTE);
  const late = await me();
  expect(late.status).toBe(401);
  expect(late.body.error.code).toBe('UNAUTHENTICATED');
  // Replaying the same cookie later still finds no session: it was destroyed, not just skipped.
  expect((await me()).status).toBe(401);
});

// The idle check reads the row's `expires` column, which the store's touch moves on at every request.
test('each request pushes the idle deadline on', async ({ app }) => {
  const { t, cookie } = await app();
  const idle = t.config.sessionMaxAgeMs;
  const me = () => request(t.app).get('/api/auth/me').set('Cookie', cookie);
  wait(idle - MINUTE);
  expect((await me()).status).toBe(200);
  // Past the idle lifetime counted from sign-in, but not from the last request.
  wait(idle - MINUTE);
  expect((await me()).status).toBe(200);
});

test('ASVS 7.3.2: a session ends at its absolute lifetime however active it is, on REST and on the socket', async ({ live }) => {
  // An idle lifetime longer than the absolute one, so only the absolute deadline can end the session.
  const server = await live.start({ sessionMaxAgeMs: 24 * 60 * MINUTE });
  const cookie = await register(server, 'Sol');
  const me = () => request(server.url).get('/api/auth/me').set('Cookie', cookie);
  const absolute = server.config.sessionAbsoluteMs;
  expect(absolute).toBeLessThan(server.config.sessionMaxAgeMs);
  // Busy all along: a request every hour, up to a minute before the absolute deadline.
  let elapsed = 0;
  while (elapsed + 60 * MINUTE < absolute) {
    wait(60 * MINUTE);
    elapsed += 60 * MINUTE;
    expect((await me()).status).toBe(200);
  }
  expect(elapsed).toBeGreaterThan(0);
  wait(absolute - MINUTE - elapsed);
  expect((await me()).status).toBe(200);
  const early = connect(server.url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: cookie } });
  await new Promise<void>((resolve, reject) => (early.once('connect', () => resolve()), early.once('connect_error', reject)));
  early.disconnect();

  wait(2 * MINUTE);
  expect((await me()).status).toBe(401);
  const late = connect(server.url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: cookie } });
  const err = await new Promise<Error & { data?: { code: string } }>((resolve) => late.once('connect_error', resolve));
  expect(err.data?.code).toBe('UNAUTHENTICATED');
  late.disconnect();
});

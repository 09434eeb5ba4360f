/**
 * The HTTP rate limits hold across processes: two real Rackside processes on one SQLite file and one
 * redis-server, every limit set to 3 (chat and moves on the sockets too), the requests spread over both. Counted per process, each would
 * let 3 through on its own (6 in all); counted in Redis, the fourth anywhere is refused.
 */
import type { ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { io as connect, type Socket } from 'socket.io-client';
import request, { type Response } from 'supertest';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/seed';
import { startRackside, startRedis, type Running } from './backing-servers';
import { createLesson } from './lesson-helpers';

const LIMIT = 3;
let redis: Running;
let folder: string;
const running: ChildProcess[] = [];
const sockets: Socket[] = [];
let a: string;
let b: string;

/** One Rackside process as it runs in production, with every HTTP limit at LIMIT within an hour. */
async function rackside(databaseUrl: string): Promise<string> {
  const limits = { LOGIN_RATE_MAX: LIMIT, REGISTER_RATE_MAX: LIMIT, RESET_RATE_MAX: LIMIT, INVITE_RATE_MAX: LIMIT, CHAT_RATE_PER_MINUTE: LIMIT, ACTION_RATE_MAX: LIMIT };
  const windows = { LOGIN_RATE_WINDOW_MS: 3_600_000, REGISTER_RATE_WINDOW_MS: 3_600_000, RESET_RATE_WINDOW_MS: 3_600_000, INVITE_RATE_WINDOW_MS: 3_600_000, ACTION_RATE_WINDOW_MS: 3_600_000 };
  const proc = await startRackside({
    ...Object.fromEntries(Object.entries({ ...limits, ...windows }).map(([k, v]) => [k, String(v)])),
    DATABASE_URL: databaseUrl,
    REDIS_URL: redis.url,
    SESSION_SECRET: 'shared-by-every-process',
    LINK_SECRET: 'shared-by-every-process',
    SEED_DEMO: 'true',
  });
  running.push(proc.child);
  return proc.url;
}

beforeAll(async () => {
  redis = await startRedis();
  folder = mkdtempSync(join(tmpdir(), 'rackside-limits-'));
  const databaseUrl = `sqlite:${join(folder, 'shared.sqlite')}`;
  // The first seeds the demo accounts and runs the migrations before the second starts.
  a = await rackside(databaseUrl);
  b = await rackside(databaseUrl);
}, 90_000);

afterAll(async () => {
  sockets.splice(0).forEach((s) => s.disconnect());
  running.splice(0).forEach((p) => p.exitCode === null && p.kill('SIGKILL'));
  await redis?.stop();
  if (folder) rmSync(folder, { recursive: true, force: true });
});

/** A refusal exactly as one process alone gives it: 429, the JSON error, the standard headers. */
function expectRefused(res: Response, message: RegExp) {
  expect(res.status).toBe(429);
  expect(res.body).toEqual({ error: { code: 'RATE_LIMITED', message: expect.stringMatching(message) } });
  expect(res.headers['ratelimit-policy']).toBe(`${LIMIT};w=3600`);
  expect(res.headers.ratelimit).toMatch(new RegExp(`^limit=${LIMIT}, remaining=0, reset=\\d+$`));
  expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
}

/** The count a response reports as left, read from its RateLimit header. */
const remaining = (res: Response) => Number(/remaining=(\d+)/.exec(String(res.headers.ratelimit))?.[1]);

test('registration: two accounts from one address on one process and one on the other use up the limit of 3', async () => {
  const register = (url: string, n: number) =>
    request(url).post('/api/auth/register').send({ email: `limit-${n}@harborlane.test`, password: 'tiles-and-tea', displayName: `Limit ${n}` });
  expect((await register(a, 1)).status).toBe(201);
  expect((await register(a, 2)).status).toBe(201);
  const third = await register(b, 3);
  expect(third.status).toBe(201);
  expect(remaining(third)).toBe(0);
  expectRefused(await register(b, 4), /Too many new accounts/);
  expectRefused(await register(a, 5), /Too many new accounts/);
});

test('sign-in: failed attempts on either process count together; successful ones count on neither', async () => {
  const signIn = (url: string, email: string, password: string) => request(url).post('/api/auth/login').send({ email, password });
  // Four good sign-ins spread over both processes are each taken back, so three failures still fit.
  for (const url of [a, b, a, b]) expect((await signIn(url, 'ruth@harborlane.test', DEMO_PASSWORD)).status).toBe(200);
  expect((await signIn(a, 'ruth@harborlane.test', 'not-her-password')).status).toBe(401);
  expect((await signIn(a, 'ruth@harborlane.test', 'not-her-password')).status).toBe(401);
  const third = await signIn(b, 'ruth@harborlane.test', 'not-her-password');
  expect(third.status).toBe(401);
  expect(remaining(third)).toBe(0);
  expectRefused(await signIn(b, 'ruth@harborlane.test', DEMO_PASSWORD), /Too many sign-in attempts/);
  expectRefused(await signIn(a, 'ruth@harborlane.test', 'not-her-password'), /Too many sign-in attempts/);
  // The count is per address and e-mail: another account signs in from the same address.
  expect((await signIn(b, 'sol@harborlane.test', DEMO_PASSWORD)).status).toBe(200);
});

test('password reset: requests for one address on both processes count together', async () => {
  const ask = (url: string) => request(url).post('/api/auth/password-reset').send({ email: 'mina@harborlane.test' });
  expect((await ask(a)).status).toBe(200);
  expect((await ask(b)).status).toBe(200);
  const third = await ask(a);
  expect(third.status).toBe(200);
  expect(remaining(third)).toBe(0);
  expectRefused(await ask(b), /Too many reset requests/);
  expectRefused(await ask(a), /Too many reset requests/);
});

test('invitations: one teacher signed in on both processes shares one limit of 3', async () => {
  const onA = request.agent(a);
  const onB = request.agent(b);
  for (const agent of [onA, onB]) await agent.post('/api/auth/login').send({ email: 'ines@harborlane.test', password: DEMO_PASSWORD }).expect(200);
  const lesson = await createLesson(onA);
  const invite = (agent: typeof onA, n: number) => agent.post(`/api/lessons/${lesson.id}/invitations`).send({ emails: [`guest-${n}@harborlane.test`] });
  expect((await invite(onA, 1)).status).toBe(201);
  expect((await invite(onB, 2)).status).toBe(201);
  const third = await invite(onB, 3);
  expect(third.status).toBe(201);
  expect(remaining(third)).toBe(0);
  expectRefused(await invite(onA, 4), /wait a while and try again/);
  expectRefused(await invite(onB, 5), /wait a while and try again/);
});

test('chat and moves: one player with a socket on each process shares one limit of 3 for each', async () => {
  const cookieOn = async (url: string) => {
    const res = await request(url).post('/api/auth/login').send({ email: 'mina@harborlane.test', password: DEMO_PASSWORD }).expect(200);
    return String(res.headers['set-cookie'][0]).split(';')[0];
  };
  const [cookieA, cookieB] = [await cookieOn(a), await cookieOn(b)];
  const table = (await request(a).post('/api/tables').set('Cookie', cookieA).send({ name: 'Harbor Lane, limits', options: { seed: 'harbor-lane-limits' } }).expect(201)).body.table as { id: string };
  const [onA, onB] = [connect(a, { transports: ['websocket'], extraHeaders: { Cookie: cookieA } }), connect(b, { transports: ['websocket'], extraHeaders: { Cookie: cookieB } })];
  sockets.push(onA, onB);
  for (const s of [onA, onB]) expect((await s.emitWithAck('table:join', { tableId: table.id, as: 'player' })).ok).toBe(true);

  const chat = (s: Socket, n: number) => s.emitWithAck('chat:send', { text: `Tea at the harbour, ${n}` });
  expect((await chat(onA, 1)).ok).toBe(true);
  expect((await chat(onA, 2)).ok).toBe(true);
  expect((await chat(onB, 3)).ok).toBe(true);
  expect(await chat(onB, 4)).toMatchObject({ ok: false, code: 'RATE_LIMITED' });
  expect(await chat(onA, 5)).toMatchObject({ ok: false, code: 'RATE_LIMITED' });

  // Every move counts against the seat's limit before it is checked, so moves the lobby refuses count too.
  const move = (s: Socket) => s.emitWithAck('exchange:act', { action: { type: 'withdraw' } });
  for (const s of [onA, onA, onB]) expect((await move(s)).code).not.toBe('RATE_LIMITED');
  expect(await move(onB)).toMatchObject({ ok: false, code: 'RATE_LIMITED' });
  expect(await move(onA)).toMatchObject({ ok: false, code: 'RATE_LIMITED' });
});

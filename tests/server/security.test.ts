/**
 * Hardening checks. Requirement ids are those of OWASP ASVS 5.0.0, quoted from memory of
 * the standard's chapters (V3 web frontend, V4 API and WebSocket, V6 authentication,
 * V7 session management, V8 authorisation, V16 logging and errors).
 */
import { Writable } from 'node:stream';
import type { AddressInfo } from 'node:net';
import pino from 'pino';
import { io as connect } from 'socket.io-client';
import request from 'supertest';
import { expect } from 'vitest';
import { createApplication } from '../../server/app';
import { testConfig } from '../../server/config';
import { AuditEntry } from '../../server/db/models';
import { appTest, createUser, sessionCookie, signedIn, type TestApp } from './helpers';
import { liveKit } from './live';

/** `apps` and `live`: whatever a test starts through them is closed after it. */
const test = appTest.extend('live', liveKit);
const login = (t: TestApp, email: string) => request(t.app).post('/api/auth/login').send({ email, password: 'correct horse' });

test('ASVS 3.5.1: a state-changing request from another site is refused with 403; our own pages pass', async ({ apps }) => {
  const t = await apps.make();
  await createUser('theo@harborlane.test');
  const foreign = await request(t.app).post('/api/auth/login').set('Origin', 'https://elsewhere.test').send({ email: 'theo@harborlane.test', password: 'correct horse' });
  expect(foreign.status).toBe(403);
  expect(foreign.body.error.code).toBe('FOREIGN_ORIGIN');
  expect(sessionCookie(foreign)).toBeUndefined();
  const noOriginButCrossSite = await request(t.app).post('/api/auth/logout').set('Sec-Fetch-Site', 'cross-site');
  expect(noOriginButCrossSite.status).toBe(403);
  const own = await request(t.app).post('/api/auth/login').set('Host', 'rackside.test').set('Origin', 'http://rackside.test').send({ email: 'theo@harborlane.test', password: 'correct horse' });
  expect(own.status).toBe(200);
  const reading = await request(t.app).get('/api/health').set('Origin', 'https://elsewhere.test');
  expect(reading.status).toBe(200);
});

test('ASVS 3.5.1: every state-changing route is covered by the origin check, signed in or not', async ({ apps }) => {
  const t = await apps.make();
  await createUser('pat@harborlane.test', 'admin');
  const admin = await signedIn(t.app, 'pat@harborlane.test');
  for (const [method, path] of [
    ['post', '/api/auth/register'],
    ['post', '/api/auth/logout'],
    ['patch', '/api/admin/users/1'],
    ['post', '/api/tables'],
    ['delete', '/api/tables/x'],
    ['put', '/api/anything'],
  ] as const) {
    const res = await admin[method](path).set('Origin', 'https://elsewhere.test').send({});
    expect(res.status, `${method} ${path}`).toBe(403);
  }
});

test('ASVS 4.4.2: the Socket.IO handshake refuses an Origin that is not ours', async ({ live }) => {
  const s = await live.start();
  const c = await live.client('Theo');
  const foreign = connect(s.url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: c.cookie, Origin: 'https://elsewhere.test' } });
  const err = await new Promise<Error>((resolve) => foreign.on('connect_error', resolve));
  expect(err).toBeTruthy();
  expect(foreign.connected).toBe(false);
  foreign.disconnect();
  const port = new URL(s.url).port;
  const own = connect(s.url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: c.cookie, Origin: `http://127.0.0.1:${port}` } });
  await new Promise((resolve, reject) => {
    own.on('connect', () => resolve(undefined));
    own.on('connect_error', reject);
  });
  own.disconnect();
});

test('ASVS 3.4.3, 3.4.4, 3.4.6: security headers and a content security policy without inline script', async ({ apps }) => {
  const t = await apps.make();
  const res = await request(t.app).get('/api/health');
  const csp = res.headers['content-security-policy'];
  const scriptSrc = csp.split(';').find((d: string) => d.trim().startsWith('script-src '))!;
  expect(scriptSrc.trim()).toBe("script-src 'self'");
  expect(csp).toMatch(/object-src 'none'/);
  expect(csp).toMatch(/frame-ancestors 'self'/);
  expect(res.headers['x-content-type-options']).toBe('nosniff');
  expect(res.headers['referrer-policy']).toBe('no-referrer');
  expect(res.headers['x-powered-by']).toBeUndefined();
});

test('ASVS 3.3.1, 3.3.2, 3.3.4: the session cookie is HttpOnly and SameSite=Lax, and Secure behind TLS', async ({ apps }) => {
  const plain = await apps.make();
  await createUser('mina@harborlane.test');
  const cookie = sessionCookie(await login(plain, 'mina@harborlane.test'))!;
  expect(cookie).toMatch(/HttpOnly/);
  expect(cookie).toMatch(/SameSite=Lax/);
  expect(cookie).not.toMatch(/Secure/);
  const secure = createApplication({ config: testConfig({ trustProxy: true }), sequelize: plain.sequelize });
  apps.adopt(secure);
  const tls = await request(secure.app).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send({ email: 'mina@harborlane.test', password: 'correct horse' });
  expect(sessionCookie(tls)).toMatch(/Secure/);
});

// ASVS 7.3.1 and 7.3.2 (idle and absolute session lifetimes) are in session-lifetime.test.ts, on a clock the test moves.

test('ASVS 7.2.4 and 7.4.1: sign-in issues a new session id; sign-out ends it and closes its sockets', async ({ live }) => {
  const s = await live.start();
  const c = await live.client('Theo');
  const again = await request(s.url).post('/api/auth/login').set('Cookie', c.cookie).send({ email: 'theo@harborlane.test', password: 'tiles-and-tea' });
  const fresh = sessionCookie(again)!.split(';')[0];
  expect(fresh).not.toBe(c.cookie);
  expect((await request(s.url).get('/api/auth/me').set('Cookie', c.cookie)).status).toBe(401);
  const socket = connect(s.url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: fresh } });
  await new Promise((resolve) => socket.on('connect', () => resolve(undefined)));
  const closed = new Promise((resolve) => socket.on('disconnect', resolve));
  await request(s.url).post('/api/auth/logout').set('Cookie', fresh).expect(200);
  await closed;
  expect((await request(s.url).get('/api/auth/me').set('Cookie', fresh)).status).toBe(401);
});

test('ASVS 6.3.1 and 2.4.1: registration is rate limited per address', async ({ apps }) => {
  const t = await apps.make({ rateLimits: { ...testConfig().rateLimits, register: { max: 2, windowMs: 60_000 } } });
  for (let i = 0; i < 2; i++) {
    const ok = await request(t.app).post('/api/auth/register').send({ email: `p${i}@harborlane.test`, password: 'tiles-and-tea', displayName: `P${i}` });
    expect(ok.status).toBe(201);
  }
  const blocked = await request(t.app).post('/api/auth/register').send({ email: 'p9@harborlane.test', password: 'tiles-and-tea', displayName: 'P9' });
  expect(blocked.status).toBe(429);
  expect(blocked.body.error.code).toBe('RATE_LIMITED');
});

test('ASVS 2.4.1: chat is rate limited per person', async ({ live }) => {
  await live.start({ rateLimits: { ...testConfig().rateLimits, chatPerMinute: 3 } });
  const t = await live.fullTable();
  for (let i = 0; i < 3; i++) await t.host.ok('chat:send', { text: `hello ${i}` });
  expect(await t.host.emit('chat:send', { text: 'one too many' })).toMatchObject({ ok: false, code: 'RATE_LIMITED' });
  await t.clients[1].ok('chat:send', { text: 'others may still talk' });
});

test('ASVS 16.3.1 and 16.2.5: failed sign-ins are logged with the e-mail and address, never the password', async ({ apps }) => {
  const lines: string[] = [];
  const logger = pino({ level: 'info' }, new Writable({ write: (chunk, _e, done) => (lines.push(String(chunk)), done()) }));
  const base = await apps.make();
  const t = apps.adopt(createApplication({ config: testConfig({ loginRateLimit: { max: 2, windowMs: 60_000 } }), sequelize: base.sequelize, logger }));
  await createUser('ines@harborlane.test');
  for (let i = 0; i < 3; i++) await request(t.app).post('/api/auth/login').send({ email: 'ines@harborlane.test', password: `secret-guess-${i}` });
  const events = lines.map((l) => JSON.parse(l));
  expect(events.filter((e) => e.event === 'sign-in-failed')).toHaveLength(2);
  expect(events.some((e) => e.event === 'sign-in-locked')).toBe(true);
  expect(events.every((e) => !e.event?.startsWith('sign-in') || e.email === 'ines@harborlane.test')).toBe(true);
  expect(lines.join('\n')).not.toMatch(/secret-guess/);
});

test('ASVS 16.3.2: an admin role change is written to the audit log, which only admins can read', async ({ apps }) => {
  const t = await apps.make();
  await createUser('pat@harborlane.test', 'admin');
  const theo = await createUser('theo@harborlane.test');
  const admin = await signedIn(t.app, 'pat@harborlane.test');
  await admin.patch(`/api/admin/users/${theo.id}`).send({ role: 'teacher' }).expect(200);
  await admin.patch(`/api/admin/users/${theo.id}`).send({ role: 'teacher' }).expect(200); // no change, no entry
  const entries = await AuditEntry.findAll();
  expect(entries).toHaveLength(1);
  expect(entries[0]).toMatchObject({ action: 'role-change', targetUserId: theo.id, details: { from: 'player', to: 'teacher' } });
  const listed = await admin.get('/api/admin/audit');
  expect(listed.body.entries[0]).toMatchObject({ action: 'role-change', targetUserId: theo.id });
  const player = await signedIn(t.app, 'theo@harborlane.test');
  expect((await player.get('/api/admin/audit')).status).toBe(403);
});

test('limits: an over-large JSON body gets 413 and a clear code', async ({ apps }) => {
  const t = await apps.make();
  const res = await request(t.app).post('/api/auth/register').set('Content-Type', 'application/json').send(JSON.stringify({ email: 'a@b.test', password: 'x'.repeat(200_000), displayName: 'A' }));
  expect(res.status).toBe(413);
  expect(res.body.error.code).toBe('TOO_LARGE');
});

test('limits: a socket message over the buffer limit is dropped with its connection, and the server goes on', async ({ live }) => {
  const s = await live.start();
  const c = await live.client('Mina');
  const gone = new Promise((resolve) => c.socket.on('disconnect', resolve));
  c.socket.emit('chat:send', { text: 'x'.repeat(100_000) });
  await gone;
  expect((await request(s.url).get('/api/health')).status).toBe(200);
  const port = (s.httpServer.address() as AddressInfo).port;
  expect(port).toBeGreaterThan(0);
});

test('readiness: /api/health says ready while serving and not ready once shutdown begins', async ({ apps }) => {
  const t = await apps.make();
  expect((await request(t.app).get('/api/health')).body).toMatchObject({ ok: true, ready: true });
  t.drain();
  const res = await request(t.app).get('/api/health');
  expect(res.status).toBe(503);
  expect(res.body.ready).toBe(false);
});

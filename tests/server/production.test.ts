/**
 * The production configuration, as `npm run serve` runs it: server/index.ts in its own process
 * with NODE_ENV=production and its secrets set, behind a TLS-terminating proxy (TRUST_PROXY).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, expect, test } from 'vitest';

const dir = mkdtempSync(join(tmpdir(), 'rackside-production-'));
let proc: ChildProcess | undefined;
let url = '';
let output = '';

/** The production environment: the test runner's own variables (NODE_ENV=test, VITEST) left out, as they would switch on test behaviour. */
function productionEnv(without: string[] = []): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = {
    ...Object.fromEntries(Object.entries(process.env).filter(([k]) => k !== 'VITEST' && !k.startsWith('VITEST_') && k !== 'NODE_ENV')),
    NODE_ENV: 'production',
    PORT: '0',
    DATABASE_URL: `sqlite:${join(dir, 'production.sqlite')}`,
    SESSION_SECRET: 'production-test-session-secret-0123456789abcdef',
    LINK_SECRET: 'production-test-link-secret-0123456789abcdef',
    TRUST_PROXY: '1',
    SEED_DEMO: 'false',
    BCRYPT_ROUNDS: '4',
    CLIENT_DIR: join(dir, 'no-client'),
    LOG_LEVEL: 'info',
  };
  for (const name of without) delete env[name];
  return env;
}

beforeAll(async () => {
  proc = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { env: productionEnv(), stdio: ['ignore', 'pipe', 'pipe'] });
  url = await new Promise<string>((resolve, reject) => {
    proc!.stdout!.on('data', (d: Buffer) => {
      output += d.toString();
      const ready = output.match(/ready on (http:\/\/\S+)/);
      if (ready) resolve(ready[1].replace('localhost', '127.0.0.1'));
    });
    proc!.stderr!.on('data', (d: Buffer) => (output += d.toString()));
    proc!.once('exit', (code) => reject(new Error(`the production server exited with ${code}:\n${output}`)));
  });
}, 60_000);

afterAll(async () => {
  if (proc && proc.exitCode === null) {
    const exited = new Promise((resolve) => proc!.once('exit', resolve));
    proc.kill('SIGTERM');
    await exited;
  }
  rmSync(dir, { recursive: true, force: true });
});

test('it starts without the local mail and payment fakes and answers the health check', async () => {
  expect(output).not.toMatch(/local fake/);
  const health = await request(url).get('/api/health');
  expect(health.status).toBe(200);
  expect(health.body).toEqual({ ok: true, database: 'up', ready: true, process: expect.stringMatching(/^[0-9a-f]{8}$/) });
});

test('responses carry the secure headers', async () => {
  const res = await request(url).get('/api/health');
  // helmet 8 defaults, from its published README, with Rackside's own CSP directives (server/app.ts).
  expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
  expect(res.headers['x-content-type-options']).toBe('nosniff');
  expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
  expect(res.headers['referrer-policy']).toBe('no-referrer');
  expect(res.headers['cross-origin-opener-policy']).toBe('same-origin');
  expect(res.headers['content-security-policy']).toMatch(/script-src 'self'/);
  expect(res.headers['content-security-policy']).toMatch(/frame-ancestors 'self'/);
  expect(res.headers).not.toHaveProperty('x-powered-by');
});

test('behind the TLS proxy the session cookie is Secure, HttpOnly and SameSite=Lax', async () => {
  const res = await request(url)
    .post('/api/auth/register')
    .set('X-Forwarded-Proto', 'https')
    .send({ email: 'ines@harborlane.test', password: 'tiles-and-tea', displayName: 'Ines' });
  expect(res.status).toBe(201);
  const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('rackside.sid='));
  expect(cookie).toMatch(/; Secure/);
  expect(cookie).toMatch(/; HttpOnly/);
  expect(cookie).toMatch(/; SameSite=Lax/);
  // The session it names is good for the next request.
  const me = await request(url).get('/api/auth/me').set('X-Forwarded-Proto', 'https').set('Cookie', cookie!.split(';')[0]);
  expect(me.status).toBe(200);
  expect(me.body.user).toMatchObject({ email: 'ines@harborlane.test' });
});

test('an error leaves as { error: { code, message } } without a stack trace', async () => {
  const res = await request(url).get('/api/no-such-route');
  expect(res.status).toBe(404);
  expect(res.body).toEqual({ error: { code: expect.any(String), message: expect.any(String) } });
  expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/);
});

test('without SESSION_SECRET it refuses to start and says which secret to set', async () => {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...productionEnv(['SESSION_SECRET']), DATABASE_URL: `sqlite:${join(dir, 'refused.sqlite')}` },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let said = '';
  child.stdout!.on('data', (d: Buffer) => (said += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (said += d.toString()));
  const code = await new Promise<number | null>((resolve) => child.once('exit', resolve));
  expect(code).not.toBe(0);
  expect(said).toMatch(/SESSION_SECRET is not set, and NODE_ENV is production/);
  expect(said).not.toMatch(/ready on/);
}, 60_000);

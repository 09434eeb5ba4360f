/**
 * Secrets with a stand-in for local use (the webhook secret, the session and link secrets): in
 * production, and whenever a real payment key is set, a missing one stops the start, naming it.
 */
import { spawn } from 'node:child_process';
import Stripe from 'stripe';
import request from 'supertest';
import { expect } from 'vitest';
import { LOCAL_STRIPE_KEY, LOCAL_WEBHOOK_SECRET, loadConfig } from '../../server/config';
import { appTest as test } from './helpers';

/** Secrets long enough to be accepted in production. */
const S = 'session-secret-0123456789';
const L = 'link-secret-0123456789abc';
const I = 'invite-secret-0123456789';

const REAL_KEY = 'sk_test_51RacksideNotAKeyAtAll';
const SECRETS = { SESSION_SECRET: 'a-long-session-secret', LINK_SECRET: 'a-long-link-secret', STRIPE_WEBHOOK_SECRET: 'whsec_set_by_the_organiser' };

test('in development, with nothing set, the local stand-ins are used', () => {
  const config = loadConfig({});
  expect(config.stripeSecretKey).toBe(LOCAL_STRIPE_KEY);
  expect(config.stripeWebhookSecret).toBe(LOCAL_WEBHOOK_SECRET);
  expect(config.sessionSecret).toMatch(/^[0-9a-f]{64}$/);
  expect(config.linkSecret).toMatch(/^[0-9a-f]{64}$/);
  expect(loadConfig({ NODE_ENV: 'development', STRIPE_SECRET_KEY: LOCAL_STRIPE_KEY }).stripeWebhookSecret).toBe(LOCAL_WEBHOOK_SECRET);
});

test('a real payment key without its webhook secret stops the start, naming the variable', () => {
  expect(() => loadConfig({ STRIPE_SECRET_KEY: REAL_KEY, SESSION_SECRET: S, LINK_SECRET: L })).toThrow(/STRIPE_WEBHOOK_SECRET is not set/);
  // The public stand-in, given on purpose, is no secret either.
  expect(() => loadConfig({ STRIPE_SECRET_KEY: REAL_KEY, SESSION_SECRET: S, LINK_SECRET: L, STRIPE_WEBHOOK_SECRET: LOCAL_WEBHOOK_SECRET })).toThrow(
    /STRIPE_WEBHOOK_SECRET is the public local stand-in/,
  );
  // With a real key every secret must be set: each missing one is named, in one message.
  let message = '';
  try {
    loadConfig({ STRIPE_SECRET_KEY: REAL_KEY });
  } catch (err) {
    message = (err as Error).message;
  }
  expect(message).toMatch(/^Rackside cannot start/);
  for (const name of ['STRIPE_WEBHOOK_SECRET', 'SESSION_SECRET', 'LINK_SECRET']) expect(message).toContain(name);
  expect(message).toMatch(/payment key \(STRIPE_SECRET_KEY\) is set/);

  const config = loadConfig({ STRIPE_SECRET_KEY: REAL_KEY, ...SECRETS });
  expect(config).toMatchObject({ stripeSecretKey: REAL_KEY, stripeWebhookSecret: SECRETS.STRIPE_WEBHOOK_SECRET, sessionSecret: SECRETS.SESSION_SECRET, linkSecret: SECRETS.LINK_SECRET });
});

test('in production a missing secret stops the start, naming each one', () => {
  expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET is not set[\s\S]*LINK_SECRET is not set/);
  expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: S })).toThrow(/LINK_SECRET/);
  expect(() => loadConfig({ NODE_ENV: 'production', LINK_SECRET: L })).toThrow(/SESSION_SECRET/);
  // Payments off (no key, no local stand-in): there is no webhook to sign, so no secret for it.
  const off = loadConfig({ NODE_ENV: 'production', SESSION_SECRET: S, LINK_SECRET: L });
  expect(off).toMatchObject({ production: true, sessionSecret: S, linkSecret: L, stripeSecretKey: LOCAL_STRIPE_KEY, localFakes: false });
  // The older name of the link secret still counts.
  expect(loadConfig({ NODE_ENV: 'production', SESSION_SECRET: S, INVITE_SECRET: I }).linkSecret).toBe(I);
  // Payments by the local stand-in in production would take webhooks signed with a public secret.
  expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: S, LINK_SECRET: L, LOCAL_FAKES: 'true' })).toThrow(/STRIPE_WEBHOOK_SECRET/);
  expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: S, LINK_SECRET: L, STRIPE_SECRET_KEY: REAL_KEY })).toThrow(/STRIPE_WEBHOOK_SECRET/);
  expect(loadConfig({ NODE_ENV: 'production', STRIPE_SECRET_KEY: REAL_KEY, ...SECRETS }).stripeWebhookSecret).toBe(SECRETS.STRIPE_WEBHOOK_SECRET);
});

/** Runs `npm run serve`'s entry point with only the given settings; resolves with how it ended. */
function startWith(env: Record<string, string>): Promise<{ code: number | null; stderr: string; started: boolean }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { PATH: process.env.PATH ?? '', PORT: '0', DATABASE_URL: 'sqlite::memory:', SEED_DEMO: 'false', CLIENT_DIR: 'none', LOG_LEVEL: 'error', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  return new Promise((resolve) => {
    child.stdout.on('data', (d: Buffer) => {
      // It started after all: stop it, and let the test fail on `started`.
      if (d.toString().includes('ready on')) {
        child.kill('SIGKILL');
        resolve({ code: null, stderr, started: true });
      }
    });
    child.once('exit', (code) => resolve({ code, stderr, started: false }));
  });
}

test('the server does not start in production without its secrets, and says which are missing', async () => {
  const production = await startWith({ NODE_ENV: 'production' });
  expect(production.started).toBe(false);
  expect(production.code).not.toBe(0);
  expect(production.stderr).toContain('Rackside cannot start');
  expect(production.stderr).toContain('SESSION_SECRET');
  expect(production.stderr).toContain('LINK_SECRET');

  const realKey = await startWith({ STRIPE_SECRET_KEY: REAL_KEY, SESSION_SECRET: S, LINK_SECRET: L });
  expect(realKey.started).toBe(false);
  expect(realKey.code).not.toBe(0);
  expect(realKey.stderr).toMatch(/STRIPE_WEBHOOK_SECRET is not set/);
}, 60_000);

test('with payments off, no webhook is taken, not even one signed with the local stand-in secret', async ({ apps }) => {
  const app = await apps.make();
  const body = JSON.stringify({ id: 'evt_1', object: 'event', type: 'checkout.session.completed', created: Math.floor(Date.now() / 1000), data: { object: { id: 'cs_test_1' } } });
  // stripe-node docs: webhooks.generateTestHeaderString signs a payload for tests.
  const signature = Stripe.webhooks.generateTestHeaderString({ payload: body, secret: LOCAL_WEBHOOK_SECRET });
  const res = await request(app.app).post('/api/payments/webhook').set('Content-Type', 'application/json').set('Stripe-Signature', signature).send(body);
  expect(res.status).toBe(503);
  expect(res.body.error.code).toBe('PAYMENTS_OFF');
});

test('in production a secret too short to be safe stops the start, naming it', () => {
  const long = 'a'.repeat(32);
  expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'x', LINK_SECRET: long })).toThrow(/SESSION_SECRET is only 1 character long/);
  expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: long, LINK_SECRET: 'short' })).toThrow(/LINK_SECRET is only 5 characters long/);
  expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: long, LINK_SECRET: long, LOCAL_FAKES: 'false' })).not.toThrow();
});

test('in production a short INVITE_SECRET (the older name of the link secret) is refused like a short LINK_SECRET', () => {
  expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: S, INVITE_SECRET: 'x' })).toThrow(/INVITE_SECRET is only 1 character long/);
});

/**
 * Random bodies and queries on every REST route, signed out and signed in with each role:
 * no 500, no stack trace in any answer, and nothing stored (ASVS 5.0 16.5.1 and 2.2.1, ids from memory).
 */
import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { createUser, makeApp, signedIn, type TestApp } from './helpers';

const ROUTES: [method: 'get' | 'post' | 'put' | 'patch' | 'delete', path: string][] = [
  ['post', '/api/auth/register'], ['post', '/api/auth/login'], ['post', '/api/auth/logout'], ['get', '/api/auth/me'],
  ['post', '/api/auth/password-reset'], ['get', '/api/auth/password-reset/:x'], ['post', '/api/auth/password-reset/confirm'],
  ['get', '/api/admin/users'], ['patch', '/api/admin/users/:x'], ['get', '/api/admin/audit'],
  ['get', '/api/tables'], ['post', '/api/tables'], ['get', '/api/tables/:x'], ['get', '/api/tables/:x/patterns'],
  ['get', '/api/exchanges'], ['get', '/api/exchanges/:x/replay'],
  ['get', '/api/drills'], ['post', '/api/drills'], ['get', '/api/drills/:x'], ['put', '/api/drills/:x'], ['delete', '/api/drills/:x'], ['get', '/api/drills/:x/export'], ['post', '/api/drills/import'],
  ['get', '/api/pattern-lists'], ['post', '/api/pattern-lists'], ['get', '/api/pattern-lists/:x'], ['put', '/api/pattern-lists/:x'], ['delete', '/api/pattern-lists/:x'],
  ['post', '/api/pattern-lists/:x/copy'], ['get', '/api/pattern-lists/:x/export'], ['post', '/api/pattern-lists/import'],
  ['get', '/api/lessons'], ['post', '/api/lessons'], ['get', '/api/lessons/:x'], ['post', '/api/lessons/:x/invitations'], ['get', '/api/lessons/:x/room'], ['post', '/api/lessons/:x/room'], ['post', '/api/lessons/:x/room/start'],
  ['get', '/api/invitations/:x'], ['post', '/api/invitations/:x/accept'],
  ['post', '/api/payments/checkout'], ['get', '/api/payments/:x'], ['get', '/api/payments/session/:x'], ['post', '/api/payments/webhook'],
  ['get', '/api/mail'], ['get', '/api/mail/:x'],
  ['get', '/api/comparisons'], ['get', '/api/comparisons/drills/:x'], ['get', '/api/comparisons/lessons/:x'], ['get', '/api/comparisons/exchanges/:x'],
  ['get', '/api/progress/me'], ['get', '/api/progress/:x'],
];

let t: TestApp;
let agents: Record<string, ReturnType<typeof request.agent> | null>;

async function counts() {
  const tables = (await t.sequelize.getQueryInterface().showAllTables()).filter((n) => n !== 'Sessions' && n !== 'SequelizeMeta');
  const out: Record<string, number> = {};
  for (const name of tables) out[name] = ((await t.sequelize.query(`SELECT COUNT(*) AS n FROM "${name}"`))[0] as { n: number }[])[0].n;
  return out;
}

beforeAll(async () => {
  t = await makeApp({ loginRateLimit: { max: 100_000, windowMs: 60_000 } });
  await createUser('pat@harborlane.test', 'admin');
  await createUser('ines@harborlane.test', 'teacher');
  await createUser('theo@harborlane.test', 'player');
  agents = {
    none: null,
    player: await signedIn(t.app, 'theo@harborlane.test'),
    teacher: await signedIn(t.app, 'ines@harborlane.test'),
    admin: await signedIn(t.app, 'pat@harborlane.test'),
  };
});
afterAll(async () => {
  await t.dispose();
});

const segment = fc.oneof(fc.constant('1'), fc.constant('starter'), fc.string({ maxLength: 12 }).map(encodeURIComponent), fc.integer().map(String));
const body = fc.oneof(fc.anything(), fc.object(), fc.dictionary(fc.constantFrom('name', 'email', 'password', 'role', 'seed', 'options', 'patterns', 'title', 'seats', 'token', 'lessonId'), fc.anything()));
const query = fc.dictionary(fc.constantFrom('invite', 'format', 'seed', 'page', 'x'), fc.string({ maxLength: 20 }));

test('random input on every REST route: no 500, no stack trace, nothing stored', async () => {
  const before = await counts();
  await fc.assert(
    fc.asyncProperty(fc.constantFrom(...ROUTES), fc.constantFrom('none', 'player', 'teacher', 'admin'), segment, body, query, async ([method, path], who, id, payload, q) => {
      const url = path.replace(':x', id || 'x');
      const agent = agents[who] ?? request(t.app);
      const res = await agent[method](url).query(q).set('Content-Type', 'application/json').send(JSON.stringify(payload ?? null));
      expect(res.status, `${method} ${url} as ${who}`).toBeLessThan(500);
      const text = res.text ?? '';
      expect(text).not.toMatch(/\bat [\w.<>]+ \(|\.ts:\d+:\d+|node_modules/);
    }),
    { numRuns: 600, seed: 4242 },
  );
  expect(await counts()).toEqual(before);
}, 120_000);

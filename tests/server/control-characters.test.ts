/**
 * A control character (NUL and the rest of Unicode's Cc category) in a path parameter or in the
 * query string is refused with 400 BAD_INPUT on every API route, before any route reads it.
 * The routes are read from the Express routers themselves, so a new `:param` route is covered too.
 */
import request from 'supertest';
import { afterAll, beforeAll, expect } from 'vitest';
import { appTest as test, createUser, makeApp, signedIn, type TestApp } from './helpers';

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
interface RouteLayer {
  rawPath?: string | string[];
  slash?: boolean;
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: RouteLayer[] };
}

/** Every [method, path] the app routes, found by walking its router stack (router 2's layers keep their mount path as `rawPath`). */
function routesOf(stack: RouteLayer[], prefix = ''): [Method, string][] {
  const out: [Method, string][] = [];
  for (const layer of stack) {
    const here = layer.slash || layer.rawPath === undefined ? '' : String(layer.rawPath);
    if (layer.route) {
      for (const method of Object.keys(layer.route.methods) as Method[]) out.push([method, prefix + layer.route.path]);
    } else if (layer.handle.stack) {
      out.push(...routesOf(layer.handle.stack, prefix + here));
    }
  }
  return out;
}

let t: TestApp;
let admin: ReturnType<typeof request.agent>;
let withParams: [Method, string][];

beforeAll(async () => {
  t = await makeApp();
  await createUser('pat@harborlane.test', 'admin');
  admin = await signedIn(t.app, 'pat@harborlane.test');
  const all = routesOf((t.app as unknown as { router: { stack: RouteLayer[] } }).router.stack);
  withParams = all.filter(([, path]) => path.startsWith('/api/') && path.includes('/:'));
});
afterAll(async () => {
  await t.dispose();
});

test('the routers are read: the known parameter routes are all there', () => {
  expect(withParams.length).toBeGreaterThanOrEqual(25);
  for (const known of ['get /api/tables/:id', 'patch /api/admin/users/:id', 'get /api/invitations/:token', 'get /api/payments/session/:sessionId', 'get /api/progress/:userId']) {
    expect(withParams.map(([m, p]) => `${m} ${p}`)).toContain(known);
  }
});

test('%00 in any path parameter of any route answers 400 BAD_INPUT, signed in as an admin', async () => {
  const answers: string[] = [];
  for (const [method, path] of withParams) {
    const names = path.match(/:\w+/g)!;
    for (const name of names) {
      const url = names.reduce((p, n) => p.replace(n, n === name ? 'a%00b' : '1'), path);
      const res = await admin[method](url).send({});
      answers.push(`${method} ${url} ${res.status} ${res.body?.error?.code}`);
    }
  }
  expect(answers.filter((a) => !a.endsWith(' 400 BAD_INPUT'))).toEqual([]);
});

test('%00 in a path parameter is refused signed out as well, before any other check', async () => {
  const res = await request(t.app).get('/api/tables/%00');
  expect(res.status).toBe(400);
  expect(res.body.error.code).toBe('BAD_INPUT');
  expect(res.body.error.message).toMatch(/control character/);
});

test('other control characters are refused the same way; ordinary text, spaces and non-Latin letters pass through', async () => {
  // %C2%85 is U+0085, a C1 control; %E0%A4%A is a broken escape.
  for (const bad of ['%01', '%1F', '%7F', '%C2%85', 'x%0Ay', '%E0%A4%A']) {
    expect((await admin.get(`/api/drills/${bad}`)).status, bad).toBe(400);
  }
  for (const fine of ['nope', 'no%20such', '%E6%9D%B1']) {
    expect((await admin.get(`/api/drills/${fine}`)).status, fine).not.toBe(400);
  }
});

test('a control character in the query string (?seed=%00 and any other) answers 400 with the field named', async () => {
  const seed = await admin.get('/api/comparisons').query('seed=%00');
  expect(seed.status).toBe(400);
  expect(seed.body.error).toMatchObject({ code: 'BAD_INPUT', fields: { seed: expect.stringMatching(/control character/) } });
  expect((await admin.get('/api/tables').query('x=a%07b')).status).toBe(400);
  expect((await admin.get('/api/mail').query('to=%00@x.test')).status).toBe(400);
  expect((await admin.get('/api/comparisons').query('seed=harbor-lane-week-05')).status).not.toBe(400);
});

test('a control character in any string of a JSON body is refused with 400, naming the field, before any route reads it', async ({ apps }) => {
  const t = await apps.make();
  await createUser('ines@harborlane.test', 'teacher');
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const table = await ines.post('/api/tables').send({ name: 't', options: { patternListId: 'a\u0000b' } });
  expect(table.status).toBe(400);
  expect(table.body.error.fields).toEqual({ 'options.patternListId': expect.any(String) });
  expect((await ines.post('/api/tables').send({ name: 't', drillId: 'a\u0000b' })).status).toBe(400);
  expect((await ines.post('/api/tables').send({ name: 'nul\u0000table' })).status).toBe(400);
  // Line breaks and tabs are text people type: still welcome where a field takes them.
  expect((await ines.post('/api/tables').send({ name: 'Tuesday\ttable' })).status).not.toBe(400);
});

test('C1 control characters (such as U+009B) in a JSON body are refused too', async ({ apps }) => {
  const t = await apps.make();
  await createUser('ines@harborlane.test', 'teacher');
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  expect((await ines.post('/api/tables').send({ name: 'csi\u009btable' })).status).toBe(400);
});

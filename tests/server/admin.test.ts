import express from 'express';
import request from 'supertest';
import { expect } from 'vitest';
import { requireAdmin, requireRole, requireTeacher, requireUser } from '../../server/auth/guards';
import { User, type Role } from '../../server/db/models';
import { errorHandler } from '../../server/errors';
import { appTest, createUser, signedIn } from './helpers';

/** Every test has its own app (`t`) with Pat (an admin), Theo and Ines (a teacher); disposed after the test. */
const test = appTest.extend('t', { auto: true }, async ({ apps }) => {
  const t = await apps.make();
  await createUser('pat@harborlane.test', 'admin');
  await createUser('theo@harborlane.test', 'player');
  await createUser('ines@harborlane.test', 'teacher');
  return t;
});

test('GET /api/admin/users: signed out 401, player 403, teacher 403, admin 200', async ({ t }) => {
  expect((await request(t.app).get('/api/admin/users')).status).toBe(401);
  const player = await signedIn(t.app, 'theo@harborlane.test');
  const denied = await player.get('/api/admin/users');
  expect(denied.status).toBe(403);
  expect(denied.body.error.code).toBe('FORBIDDEN');
  expect((await (await signedIn(t.app, 'ines@harborlane.test')).get('/api/admin/users')).status).toBe(403);
  const admin = await signedIn(t.app, 'pat@harborlane.test');
  const list = await admin.get('/api/admin/users');
  expect(list.status).toBe(200);
  expect(list.body.users.map((u: { email: string }) => u.email).sort()).toEqual([
    'ines@harborlane.test',
    'pat@harborlane.test',
    'theo@harborlane.test',
  ]);
  expect(list.body.users[0].passwordHash).toBeUndefined();
});

test('PATCH /api/admin/users/:id: signed out 401, player 403 and the role stays', async ({ t }) => {
  const target = (await User.findOne({ where: { email: 'theo@harborlane.test' } }))!;
  expect((await request(t.app).patch(`/api/admin/users/${target.id}`).send({ role: 'admin' })).status).toBe(401);
  const player = await signedIn(t.app, 'theo@harborlane.test');
  expect((await player.patch(`/api/admin/users/${target.id}`).send({ role: 'admin' })).status).toBe(403);
  await target.reload();
  expect(target.role).toBe('player');
});

test('an admin promotes a player to teacher, and the player sees the new role', async ({ t }) => {
  const admin = await signedIn(t.app, 'pat@harborlane.test');
  const { body } = await admin.get('/api/admin/users');
  const theo = body.users.find((u: { email: string }) => u.email === 'theo@harborlane.test');
  const res = await admin.patch(`/api/admin/users/${theo.id}`).send({ role: 'teacher' });
  expect(res.status).toBe(200);
  expect(res.body.user.role).toBe('teacher');
  const player = await signedIn(t.app, 'theo@harborlane.test');
  expect((await player.get('/api/auth/me')).body.user.role).toBe('teacher');
});

test('a role outside player, teacher, admin is refused with a field error', async ({ t }) => {
  const admin = await signedIn(t.app, 'pat@harborlane.test');
  const res = await admin.patch('/api/admin/users/2').send({ role: 'emperor' });
  expect(res.status).toBe(400);
  expect(res.body.error.fields.role).toMatch(/player, teacher, admin/);
});

test('an unknown user id gets 404, a malformed one 400', async ({ t }) => {
  const admin = await signedIn(t.app, 'pat@harborlane.test');
  expect((await admin.patch('/api/admin/users/999').send({ role: 'teacher' })).status).toBe(404);
  expect((await admin.patch('/api/admin/users/abc').send({ role: 'teacher' })).status).toBe(400);
});

test('an admin cannot demote themselves', async ({ t }) => {
  const admin = await signedIn(t.app, 'pat@harborlane.test');
  const me = (await admin.get('/api/auth/me')).body.user;
  const res = await admin.patch(`/api/admin/users/${me.id}`).send({ role: 'player' });
  expect(res.status).toBe(409);
  expect(res.body.error.code).toBe('OWN_ROLE');
});

/** A tiny app that puts a chosen user (or none) on the request, to test each guard on its own. */
function guarded(guard: express.RequestHandler, role: Role | null) {
  const app = express();
  app.use((req, _res, next) => {
    if (role) (req as { user?: unknown }).user = { id: 1, role };
    next();
  });
  app.get('/x', guard, (_req, res) => {
    res.json({ ok: true });
  });
  app.use(errorHandler);
  return app;
}

const cases: [string, express.RequestHandler, Record<Role | 'none', number>][] = [
  ['requireUser', requireUser, { none: 401, player: 200, teacher: 200, admin: 200 }],
  ['requireTeacher', requireTeacher, { none: 401, player: 403, teacher: 200, admin: 200 }],
  ['requireAdmin', requireAdmin, { none: 401, player: 403, teacher: 403, admin: 200 }],
  ['requireRole(player)', requireRole('player'), { none: 401, player: 200, teacher: 403, admin: 200 }],
];

for (const [name, guard, expected] of cases) {
  test(`${name} lets through exactly the roles it should`, async () => {
    for (const role of ['none', 'player', 'teacher', 'admin'] as const) {
      const res = await request(guarded(guard, role === 'none' ? null : role)).get('/x');
      expect(res.status, `${name} for ${role}`).toBe(expected[role]);
    }
  });
}

import request from 'supertest';
import { expect } from 'vitest';
import { appTest, createUser, sessionCookie } from './helpers';

/** Every test has its own app (`t`) allowing three sign-in tries a minute; disposed after the test. */
const test = appTest.extend('t', { auto: true }, async ({ apps }) => apps.make({ loginRateLimit: { max: 3, windowMs: 60_000 } }));

const newUser = { email: 'Mina@HarborLane.test', password: 'tiles-and-tea', displayName: 'Mina Castellanos' };

test('register signs the new user in as a player, with an httpOnly SameSite=Lax cookie', async ({ t }) => {
  const agent = request.agent(t.app);
  const res = await agent.post('/api/auth/register').send(newUser);
  expect(res.status).toBe(201);
  expect(res.body.user).toMatchObject({ email: 'mina@harborlane.test', displayName: 'Mina Castellanos', role: 'player' });
  expect(res.body.user.passwordHash).toBeUndefined();
  const cookie = sessionCookie(res)!;
  expect(cookie).toMatch(/HttpOnly/i);
  expect(cookie).toMatch(/SameSite=Lax/i);
  expect(cookie).not.toMatch(/Secure/i);
  const me = await agent.get('/api/auth/me');
  expect(me.status).toBe(200);
  expect(me.body.user.role).toBe('player');
});

test('register, sign out, sign in again: who-am-I follows each step', async ({ t }) => {
  const agent = request.agent(t.app);
  await agent.post('/api/auth/register').send(newUser).expect(201);
  await agent.post('/api/auth/logout').expect(200);
  const gone = await agent.get('/api/auth/me');
  expect(gone.status).toBe(401);
  expect(gone.body.error.code).toBe('UNAUTHENTICATED');
  await agent.post('/api/auth/login').send({ email: newUser.email, password: newUser.password }).expect(200);
  const me = await agent.get('/api/auth/me');
  expect(me.body.user.email).toBe('mina@harborlane.test');
});

test('passwords are stored hashed with bcrypt, never as given', async ({ t }) => {
  await request(t.app).post('/api/auth/register').send(newUser).expect(201);
  const [rows] = await t.sequelize.query("SELECT passwordHash FROM Users WHERE email = 'mina@harborlane.test'");
  const hash = (rows as { passwordHash: string }[])[0].passwordHash;
  expect(hash).not.toContain(newUser.password);
  expect(hash).toMatch(/^\$2[aby]\$/); // bcrypt's modular crypt prefix
});

test('a duplicate e-mail is refused with EMAIL_TAKEN and a field error', async ({ t }) => {
  await request(t.app).post('/api/auth/register').send(newUser).expect(201);
  const res = await request(t.app).post('/api/auth/register').send({ ...newUser, email: 'mina@harborlane.test' });
  expect(res.status).toBe(409);
  expect(res.body.error.code).toBe('EMAIL_TAKEN');
  expect(res.body.error.fields.email).toBeTruthy();
});

test('missing and malformed fields come back as field errors', async ({ t }) => {
  const res = await request(t.app).post('/api/auth/register').send({ email: 'not-an-address', password: 'short' });
  expect(res.status).toBe(400);
  expect(res.body.error.code).toBe('BAD_INPUT');
  expect(Object.keys(res.body.error.fields).sort()).toEqual(['displayName', 'email', 'password']);
});

test('an over-long field is refused and nothing is stored', async ({ t }) => {
  const res = await request(t.app).post('/api/auth/register').send({ ...newUser, displayName: 'x'.repeat(61) });
  expect(res.status).toBe(400);
  expect(res.body.error.fields.displayName).toMatch(/at most 60/);
  const [rows] = await t.sequelize.query('SELECT COUNT(*) AS n FROM Users');
  expect((rows as { n: number }[])[0].n).toBe(0);
});

test('malformed JSON gets BAD_JSON, not a stack trace', async ({ t }) => {
  const res = await request(t.app).post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": ');
  expect(res.status).toBe(400);
  expect(res.body.error.code).toBe('BAD_JSON');
  expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(js|ts):\d+/);
});

test('an unknown API route gets a JSON 404', async ({ t }) => {
  const res = await request(t.app).get('/api/no-such-thing');
  expect(res.status).toBe(404);
  expect(res.body.error).toMatchObject({ code: 'NOT_FOUND' });
});

test('a wrong password gets BAD_CREDENTIALS and no session', async ({ t }) => {
  await createUser('ruth@harborlane.test');
  const res = await request(t.app).post('/api/auth/login').send({ email: 'ruth@harborlane.test', password: 'wrong one' });
  expect(res.status).toBe(401);
  expect(res.body.error.code).toBe('BAD_CREDENTIALS');
  expect(sessionCookie(res)).toBeUndefined();
});

test('an unknown e-mail gets the same answer as a wrong password', async ({ t }) => {
  const res = await request(t.app).post('/api/auth/login').send({ email: 'nobody@harborlane.test', password: 'whatever1' });
  expect(res.status).toBe(401);
  expect(res.body.error.code).toBe('BAD_CREDENTIALS');
});

test('signing in issues a new session id, and the old one stops working', async ({ t }) => {
  await createUser('theo@harborlane.test');
  const first = await request(t.app).post('/api/auth/login').send({ email: 'theo@harborlane.test', password: 'correct horse' });
  const oldCookie = sessionCookie(first)!.split(';')[0];
  const second = await request(t.app)
    .post('/api/auth/login')
    .set('Cookie', oldCookie)
    .send({ email: 'theo@harborlane.test', password: 'correct horse' });
  const newCookie = sessionCookie(second)!.split(';')[0];
  expect(newCookie).not.toBe(oldCookie);
  expect((await request(t.app).get('/api/auth/me').set('Cookie', newCookie)).status).toBe(200);
  expect((await request(t.app).get('/api/auth/me').set('Cookie', oldCookie)).status).toBe(401);
});

test('sign-out ends the session on the server, not just in the browser', async ({ t }) => {
  await createUser('sol@harborlane.test');
  const login = await request(t.app).post('/api/auth/login').send({ email: 'sol@harborlane.test', password: 'correct horse' });
  const cookie = sessionCookie(login)!.split(';')[0];
  await request(t.app).post('/api/auth/logout').set('Cookie', cookie).expect(200);
  expect((await request(t.app).get('/api/auth/me').set('Cookie', cookie)).status).toBe(401);
});

test('sign-in attempts are rate limited per address and e-mail', async ({ t }) => {
  await createUser('pat@harborlane.test');
  for (let i = 0; i < 3; i++) {
    const res = await request(t.app).post('/api/auth/login').send({ email: 'pat@harborlane.test', password: 'guess ' + i });
    expect(res.status).toBe(401);
  }
  const blocked = await request(t.app).post('/api/auth/login').send({ email: 'pat@harborlane.test', password: 'correct horse' });
  expect(blocked.status).toBe(429);
  expect(blocked.body.error.code).toBe('RATE_LIMITED');
  // Another account from the same address is not locked out by these guesses.
  await createUser('ines@harborlane.test');
  const other = await request(t.app).post('/api/auth/login').send({ email: 'ines@harborlane.test', password: 'correct horse' });
  expect(other.status).toBe(200);
});

test('behind a TLS proxy the session cookie is Secure', async ({ apps }) => {
  const proxied = await apps.make({ trustProxy: true });
  const res = await request(proxied.app).post('/api/auth/register').set('X-Forwarded-Proto', 'https').send(newUser);
  expect(res.status).toBe(201);
  expect(sessionCookie(res)).toMatch(/Secure/i);
});

test('the server keeps answering after a run of bad requests', async ({ t }) => {
  await request(t.app).post('/api/auth/register').set('Content-Type', 'application/json').send('nope');
  await request(t.app).post('/api/auth/register').send({ email: ['a'], password: { x: 1 }, displayName: 7 });
  await request(t.app).patch('/api/admin/users/abc').send({ role: 'king' });
  const health = await request(t.app).get('/api/health');
  expect(health.status).toBe(200);
  expect(health.body).toMatchObject({ ok: true });
});

import request from 'supertest';
import { expect } from 'vitest';
import { User } from '../../server/db/models';
import { createTable, liveTest as test, register } from './live';

test('creating a table checks every field and stores the options', async ({ server }) => {
  const cookie = await register(server, 'Ines');
  await User.update({ role: 'teacher' }, { where: { email: 'ines@harborlane.test' } });
  const bad = await request(server.url).post('/api/tables').set('Cookie', cookie).send({ name: '', options: { seed: 'x'.repeat(200), jokers: 'yes', colour: 'red' } });
  expect(bad.status).toBe(400);
  expect(bad.body.error.code).toBe('BAD_INPUT');
  expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['name', 'options.seed', 'options.jokers']));
  const ok = await request(server.url)
    .post('/api/tables')
    .set('Cookie', cookie)
    .send({ name: 'Tuesday drill', options: { seed: 'harbor-lane-week-01', jokers: false, secondCharleston: false, courtesy: false, huddleEveryPass: true, teaching: true, hideAdvice: true } });
  expect(ok.status).toBe(201);
  expect(ok.body.table).toMatchObject({
    name: 'Tuesday drill',
    status: 'lobby',
    private: false,
    options: { seed: 'harbor-lane-week-01', jokers: false, secondCharleston: false, courtesy: false, huddleEveryPass: true, teaching: true, hideAdvice: true },
    seats: { east: null, south: null, west: null, north: null },
  });
});

test('my tables and open tables are listed apart; an unknown table is 404', async ({ server }) => {
  const ines = await register(server, 'Ines');
  const theo = await register(server, 'Theo');
  const a = await createTable(server, ines, { name: 'Ines open' });
  const b = await createTable(server, theo, { name: 'Theo open' });
  const list = await request(server.url).get('/api/tables').set('Cookie', ines);
  expect(list.body.mine.map((t: { id: string }) => t.id)).toEqual([a.id]);
  expect(list.body.open.map((t: { id: string }) => t.id)).toEqual([b.id]);
  expect((await request(server.url).get('/api/tables/nope').set('Cookie', ines)).status).toBe(404);
  expect((await request(server.url).get('/api/tables')).status).toBe(401);
});

test('a replay opens only when the exchange is done, and only to its players, its host and admins', async ({ live, server }) => {
  const t = await live.fullTable({ options: { secondCharleston: false, courtesy: false } });
  await t.host.ok('table:start');
  const exchangeId = (await t.host.until((s) => s.exchangeId !== null)).exchangeId!;
  const early = await request(server.url).get(`/api/exchanges/${exchangeId}/replay`).set('Cookie', t.host.cookie);
  expect(early.status).toBe(409);
  expect(early.body.error.code).toBe('NOT_FINISHED');
  const outsider = await live.client('Sol');
  expect((await request(server.url).get(`/api/exchanges/${exchangeId}/replay`).set('Cookie', outsider.cookie)).status).toBe(403);
  expect((await request(server.url).get('/api/exchanges').set('Cookie', outsider.cookie)).body.exchanges).toEqual([]);
  expect((await request(server.url).get('/api/exchanges/none/replay').set('Cookie', outsider.cookie)).status).toBe(404);
});

test('finished tables leave the open list; a host closes a table, which leaves every list and refuses joins', async ({ live, server }) => {
  const t = await live.fullTable({ options: { secondCharleston: false, courtesy: false } });
  const sol = await live.client('Sol');
  const open = async () => (await request(server.url).get('/api/tables').set('Cookie', sol.cookie)).body.open.map((x: { id: string }) => x.id);
  expect(await open()).toContain(t.table.id);
  await t.host.ok('table:start');
  for (;;) {
    const states = await Promise.all(t.clients.map((c) => c.until((s) => s.phase === 'done' || (s.view !== null && !s.view.seats[s.mySeat!].committed))));
    if (states.every((s) => s.phase === 'done')) break;
    await Promise.all(
      t.clients.map(async (c) => {
        const s = c.state;
        if (s.phase === 'done' || s.view!.seats[s.mySeat!].committed) return;
        const tiles = s.myRack.filter((x) => x.kind !== 'joker').slice(0, 3).map((x) => x.id);
        await c.emit('exchange:act', { action: { type: 'pass', tiles } });
      }),
    );
  }
  expect(await open()).not.toContain(t.table.id);
  const theo = t.clients[1];
  expect(await theo.emit('table:close')).toMatchObject({ ok: false, code: 'NOT_HOST' });
  await t.host.ok('table:close');
  const mine = (await request(server.url).get('/api/tables').set('Cookie', t.host.cookie)).body.mine.map((x: { id: string }) => x.id);
  expect(mine).not.toContain(t.table.id);
  expect(await sol.emit('table:join', { tableId: t.table.id, as: 'spectator' })).toMatchObject({ ok: false, code: 'TABLE_CLOSED' });
  expect(await t.host.emit('table:start')).toMatchObject({ ok: false, code: 'TABLE_CLOSED' });
});

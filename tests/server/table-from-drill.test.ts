import { noEventWriter } from '../../server/db/event-writer';
import request from 'supertest';
import { expect } from 'vitest';
import { TableRow, User } from '../../server/db/models';
import { TableMaster } from '../../server/realtime/table-master';
import { rackOf } from '../../shared/exchange';
import type { TileKind } from '../../shared/tiles';
import { liveTest, register } from './live';
import { smallList } from './teaching-helpers';

/** `teacher` signs up a teacher and returns the cookie; `post` sends a body as a cookie's owner. */
const test = liveTest
  .extend('teacher', async ({ server }) => async (name: string) => {
    const cookie = await register(server, name);
    await User.update({ role: 'teacher' }, { where: { email: `${name.toLowerCase()}@harborlane.test` } });
    return cookie;
  })
  .extend('post', async ({ server }) => (path: string, cookie: string, body: object) => request(server.url).post(path).set('Cookie', cookie).send(body));

const sorted = (kinds: readonly TileKind[]) => [...kinds].sort();

// Thirteen tiles for west (a full rack) and six for east; the engine deals the rest from what remains.
const westRack: TileKind[] = ['crack1', 'crack1', 'crack1', 'crack5', 'crack5', 'crack9', 'wind-w', 'wind-w', 'dragon-red', 'dragon-red', 'flower', 'flower', 'dot7'];
const eastPreset: TileKind[] = ['bam2', 'bam2', 'dot8', 'dot8', 'flower', 'joker'];

test('a table opened from a drill deals its preset racks, keeps them off the wire, and its bots use its pattern list', async ({ live, server, teacher, post }) => {
  const ines = await teacher('Ines');
  const list = (await post('/api/pattern-lists', ines, smallList)).body.list;
  const drill = (await post('/api/drills', ines, { name: 'Harbor Lane week 1', seed: 'harbor-lane-week-01', secondCharleston: false, courtesy: false, racks: { east: eastPreset, west: westRack }, patternListId: list.id })).body.drill;

  const opened = await post('/api/tables', ines, { name: 'Tuesday lesson', drillId: drill.id, options: { seed: 'ignored', huddleEveryPass: true } });
  expect(opened.status).toBe(201);
  const table = opened.body.table;
  expect(table.options).toEqual({
    seed: 'harbor-lane-week-01', jokers: true, secondCharleston: false, courtesy: false, huddleEveryPass: true, teaching: false, hideAdvice: false, botsPlaySecond: false,
    patternListId: list.id, drillId: drill.id, drillName: 'Harbor Lane week 1',
  });

  const host = await live.client('Ines', ines);
  const mina = await live.client('Mina');
  await host.ok('table:join', { tableId: table.id, as: 'player' });
  await mina.ok('table:join', { tableId: table.id, as: 'player' });
  await host.ok('table:sit', { seat: 'east' });
  await mina.ok('table:sit', { seat: 'west' });
  await host.ok('table:bot', { seat: 'south', strategy: 'advised' });
  await host.ok('table:bot', { seat: 'north', strategy: 'multiples' });
  expect(JSON.stringify(host.state)).not.toContain('crack9');
  await host.ok('table:start');

  const hostState = await host.until((s) => s.phase === 'first-right' && s.myRack.length > 0);
  const minaState = await mina.until((s) => s.phase === 'first-right' && s.myRack.length > 0);
  expect(sorted(minaState.myRack.map((t) => t.kind))).toEqual(sorted(westRack));
  expect(hostState.myRack).toHaveLength(14);
  const hostKinds = hostState.myRack.map((t) => t.kind);
  for (const kind of new Set(eastPreset)) {
    expect(hostKinds.filter((k) => k === kind).length).toBeGreaterThanOrEqual(eastPreset.filter((k) => k === kind).length);
  }
  // Nobody hears of the presets through the options.
  expect(hostState.options).not.toHaveProperty('racks');
  expect(JSON.stringify((await request(server.url).get(`/api/tables/${table.id}`).set('Cookie', mina.cookie)).body)).not.toContain('racks');

  const master = (await server.registry.peek(table.id))!;
  expect(master.patterns.map((p) => p.id)).toEqual(['harbor-01', 'harbor-02']);
  const patterns = await request(server.url).get(`/api/tables/${table.id}/patterns`).set('Cookie', mina.cookie);
  expect(patterns.body.list).toMatchObject({ id: list.id, name: smallList.name, patterns: [{ id: 'harbor-01' }, { id: 'harbor-02' }] });

  // After a restart the table is rebuilt from its log with the same presets and the same list.
  const rebuilt = await TableMaster.load((await TableRow.findByPk(table.id))!, { changed: () => undefined, botDelayMs: 0, events: noEventWriter });
  expect(rebuilt.patterns.map((p) => p.id)).toEqual(['harbor-01', 'harbor-02']);
  expect(sorted(rackOf(rebuilt.exchange!.state, 'west').map((t) => t.kind))).toEqual(sorted(rackOf(master.exchange!.state, 'west').map((t) => t.kind)));
});

test('the same drill deals the same racks at two tables', async ({ live, teacher, post }) => {
  const ines = await teacher('Ines');
  const drill = (await post('/api/drills', ines, { name: 'Same deal', seed: 'harbor-lane-week-02', racks: { east: eastPreset } })).body.drill;
  const racks: string[][] = [];
  for (const name of ['Table one', 'Table two']) {
    const table = (await post('/api/tables', ines, { name, drillId: drill.id })).body.table;
    const host = await live.client('Ines', ines);
    await host.ok('table:join', { tableId: table.id, as: 'player' });
    await host.ok('table:sit', { seat: 'east' });
    for (const seat of ['south', 'west', 'north']) await host.ok('table:bot', { seat, strategy: 'random' });
    await host.ok('table:start');
    racks.push(sorted((await host.until((s) => s.myRack.length > 0)).myRack.map((t) => t.kind)));
  }
  expect(racks[0]).toEqual(racks[1]);
});

test('only the teacher who owns a drill opens a table from it; a table picks only its host’s own lists', async ({ server, teacher, post }) => {
  const ines = await teacher('Ines');
  const pat = await teacher('Pat');
  const theo = await register(server, 'Theo');
  const drill = (await post('/api/drills', ines, { name: 'Mine', seed: 'harbor-lane-week-03' })).body.drill;
  expect((await post('/api/tables', theo, { name: 'Sneaky', drillId: drill.id })).status).toBe(403);
  expect((await post('/api/tables', pat, { name: 'Sneaky', drillId: drill.id })).status).toBe(404);
  expect((await request(server.url).post('/api/tables').send({ name: 'Signed out', drillId: drill.id })).status).toBe(401);

  const inesList = (await post('/api/pattern-lists', ines, smallList)).body.list;
  const foreign = await post('/api/tables', pat, { name: 'Borrowed list', options: { patternListId: inesList.id } });
  expect(foreign.status).toBe(400);
  expect(foreign.body.error.fields).toEqual({ 'options.patternListId': 'Pick the starter list or one of your own lists.' });
  expect((await post('/api/tables', theo, { name: 'Plain', options: { patternListId: 'starter' } })).status).toBe(201);
  const own = await post('/api/tables', ines, { name: 'Own list', private: true, options: { patternListId: inesList.id } });
  expect(own.body.table.options.patternListId).toBe(inesList.id);
  expect((await request(server.url).get(`/api/tables/${own.body.table.id}/patterns`).set('Cookie', theo)).status).toBe(403);
  expect((await request(server.url).get(`/api/tables/${own.body.table.id}/patterns`).set('Cookie', ines)).body.list.id).toBe(inesList.id);
});

/**
 * Nobody learns a rack they should not see: teaching mode is a teacher's, a seed name reproduces a
 * deal only at the table (or drill, or lesson) it was given to, a table never deals the same seed
 * twice, and a replay is withheld while its reader still has that deal to play.
 */
import { createHash } from 'node:crypto';
import request from 'supertest';
import { expect } from 'vitest';
import { createExchange, rackOf, replay } from '../../shared/exchange';
import type { ExchangeReplayDto, TableStateDto } from '../../shared/protocol';
import { SEATS, type Seat } from '../../shared/seats';
import { User } from '../../server/db/models';
import { createTable, liveTest, simpleAction, type Client } from './live';

/** `person` signs someone up with a role and connects them; `replayOf` asks for an exchange's replay as a cookie's owner. */
const test = liveTest
  .extend('person', async ({ live }) => async (name: string, role: 'player' | 'teacher' | 'admin' = 'player') => {
    const c = await live.client(name);
    if (role !== 'player') {
      await User.update({ role }, { where: { email: `${name.toLowerCase()}@harborlane.test` } });
      c.socket.disconnect();
      // A fresh socket reads the new role from the session.
      return live.client(name, c.cookie);
    }
    return c;
  })
  .extend('replayOf', async ({ server }) => (cookie: string, exchangeId: string) => request(server.url).get(`/api/exchanges/${exchangeId}/replay`).set('Cookie', cookie));

const kinds = (rack: { kind: string }[]) => rack.map((t) => t.kind).sort().join(',');

/** The host sits east with three bots, deals, and plays plainly until the exchange is done. */
async function playWithBots(host: Client, tableId: string, seat: Seat | null = 'east') {
  await host.ok('table:join', { tableId, as: 'player' });
  if (seat) await host.ok('table:sit', { seat });
  for (const s of SEATS) if (s !== seat) await host.ok('table:bot', { seat: s, strategy: 'random' });
  await host.ok('table:start');
  const dealt = await host.until((s) => s.exchangeId !== null && s.phase !== 'lobby');
  if (seat) {
    for (;;) {
      const s = await host.until((st) => st.phase === 'done' || (st.view !== null && !st.view.seats[seat].committed && simpleAction(st, { stop: true, ask: 0 }) !== null), 10_000);
      if (s.phase === 'done') break;
      const action = simpleAction(s, { stop: true, ask: 0 });
      if (action) await host.emit('exchange:act', { action });
    }
  } else {
    await host.until((s) => s.phase === 'done', 10_000);
  }
  return dealt;
}

test('a player cannot open a table in teaching mode; a teacher can, and every seat is told the host sees every rack', async ({ server, person }) => {
  const theo = await person('Theo');
  const refused = await request(server.url).post('/api/tables').set('Cookie', theo.cookie).send({ name: 'Peek', options: { teaching: true } });
  expect(refused.status).toBe(403);
  expect(refused.body.error.code).toBe('FORBIDDEN');
  expect(refused.body.error.fields['options.teaching']).toMatch(/teacher/i);

  const ines = await person('Ines', 'teacher');
  const table = await createTable(server, ines.cookie, { options: { teaching: true } });
  await theo.ok('table:join', { tableId: table.id, as: 'player' });
  const lobby = await theo.until((s: TableStateDto) => s.tableId === table.id);
  // Before the deal, in the lobby: the table's options say so, for the screen to tell every seat.
  expect(lobby.phase).toBe('lobby');
  expect(lobby.options.teaching).toBe(true);
  const listed = await request(server.url).get('/api/tables').set('Cookie', theo.cookie);
  expect(listed.body.open.find((t: { id: string }) => t.id === table.id).options.teaching).toBe(true);
});

test('dealing again at a table with a fixed seed deals a new deal, so the finished replay tells nothing of it', async ({ server, person, replayOf }) => {
  const theo = await person('Theo');
  const table = await createTable(server, theo.cookie, { options: { seed: 'harbor-lane-week-01', secondCharleston: false, courtesy: false } });
  const first = await playWithBots(theo, table.id);
  const firstReplay = await replayOf(theo.cookie, first.exchangeId!);
  expect(firstReplay.status).toBe(200);

  await theo.ok('table:start');
  const second = await theo.until((s) => s.exchangeId !== null && s.exchangeId !== first.exchangeId && s.phase === 'first-right');
  const old = firstReplay.body.replay as ExchangeReplayDto;
  // Whatever the replay hands out (its options, seed included, and its log) rebuilds the old deal, not the new one.
  expect(kinds(rackOf(createExchange(old.options), 'east'))).toBe(kinds(rackOf(replay(old.options, []), 'east')));
  expect(kinds(rackOf(createExchange(old.options), 'east'))).not.toBe(kinds(second.myRack));
  expect(second.options.seed).toBe('harbor-lane-week-01');
  // Nor can a seat work the new deal out from what it has seen (the seed name, the table id, the count
  // of deals): the derivation is keyed with a server secret.
  const guess = `deal-${createHash('sha256').update(JSON.stringify(['rackside-deal', `table:${table.id}`, 'harbor-lane-week-01', 1])).digest('base64url').slice(0, 32)}`;
  expect(kinds(rackOf(createExchange({ ...old.options, seed: guess }), 'east'))).not.toBe(kinds(second.myRack));
});

test('a seed name is no key to another table’s deal: the same name elsewhere deals other racks, and a seed comparison never confirms a seed', async ({ server, person, replayOf }) => {
  const theo = await person('Theo');
  const mina = await person('Mina');
  const live = await createTable(server, theo.cookie, { options: { seed: 'harbor-lane-week-01', secondCharleston: false, courtesy: false } });
  await theo.ok('table:join', { tableId: live.id, as: 'player' });
  await theo.ok('table:sit', { seat: 'east' });
  for (const s of ['south', 'west', 'north'] as const) await theo.ok('table:bot', { seat: s, strategy: 'random' });
  await theo.ok('table:start');
  const theoRack = kinds((await theo.until((s) => s.phase === 'first-right')).myRack);

  // Another user names the same seed on a table of four bots and reads the finished deal.
  const copy = await createTable(server, mina.cookie, { options: { seed: 'harbor-lane-week-01', secondCharleston: false, courtesy: false } });
  const done = await playWithBots(mina, copy.id, null);
  const peek = await replayOf(mina.cookie, done.exchangeId!);
  expect(peek.status).toBe(200);
  expect(kinds(rackOf(replay((peek.body.replay as ExchangeReplayDto).options, []), 'east'))).not.toBe(theoRack);
  // Nor does the engine's own deal of the bare name give Theo's rack away.
  expect(kinds(rackOf(createExchange({ seed: 'harbor-lane-week-01', secondCharleston: false, courtesy: false }), 'east'))).not.toBe(theoRack);

  // The host's own second table on that seed does not share the deal either.
  const second = await createTable(server, theo.cookie, { options: { seed: 'harbor-lane-week-01', secondCharleston: false, courtesy: false } });
  const other = await person('Ruth');
  await other.ok('table:join', { tableId: second.id, as: 'player' });
  const own = await playWithBots(theo, second.id, null);
  const ownPeek = await replayOf(theo.cookie, own.exchangeId!);
  expect(kinds(rackOf(replay((ownPeek.body.replay as ExchangeReplayDto).options, []), 'east'))).not.toBe(theoRack);

  // Asking about a seed somebody else dealt, and about one nobody dealt, get the same answer.
  const played = await request(server.url).get('/api/comparisons?seed=harbor-lane-week-01').set('Cookie', other.cookie);
  const unknown = await request(server.url).get('/api/comparisons?seed=harbor-lane-week-77').set('Cookie', other.cookie);
  expect(played.status).toBe(unknown.status);
  expect(played.body).toEqual(unknown.body);
});

test('a replay is withheld while its reader sits at a table still to deal or play the same drill deal', async ({ server, person, replayOf }) => {
  const ines = await person('Ines', 'teacher');
  const theo = await person('Theo');
  const drill = await request(server.url)
    .post('/api/drills')
    .set('Cookie', ines.cookie)
    .send({ name: 'Week one', description: '', seed: 'harbor-lane-week-01', jokers: true, secondCharleston: false, courtesy: false, racks: {}, patternListId: 'starter' });
  expect(drill.status).toBe(201);
  const drillId = drill.body.drill.id as string;
  const a = await createTable(server, ines.cookie, { name: 'Drill A', drillId });
  const b = await createTable(server, ines.cookie, { name: 'Drill B', drillId });

  // Theo plays table A with three bots.
  await ines.ok('table:join', { tableId: a.id, as: 'player' });
  await theo.ok('table:join', { tableId: a.id, as: 'player' });
  await theo.ok('table:sit', { seat: 'east' });
  for (const s of ['south', 'west', 'north'] as const) await ines.ok('table:bot', { seat: s, strategy: 'random' });
  await ines.ok('table:start');
  for (;;) {
    const s = await theo.until((st) => st.phase === 'done' || (st.view !== null && !st.view.seats.east.committed && simpleAction(st, { stop: true, ask: 0 }) !== null), 10_000);
    if (s.phase === 'done') break;
    await theo.emit('exchange:act', { action: simpleAction(s, { stop: true, ask: 0 }) });
  }
  const exchangeId = theo.state.exchangeId!;
  expect((await replayOf(theo.cookie, exchangeId)).status).toBe(200);

  // Now he sits at table B, on the same drill deal: its racks stay closed to him until B is done.
  await theo.ok('table:join', { tableId: b.id, as: 'player' });
  await theo.ok('table:sit', { seat: 'south' });
  const withheld = await replayOf(theo.cookie, exchangeId);
  expect(withheld.status).toBe(409);
  expect(withheld.body.error.code).toBe('DEAL_STILL_TO_PLAY');
  expect(withheld.body.error.message).toMatch(/still to play/);
});

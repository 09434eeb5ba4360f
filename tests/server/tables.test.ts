import { join } from 'node:path';
import request from 'supertest';
import { expect } from 'vitest';
import { replay } from '../../shared/exchange';
import type { Phase } from '../../shared/exchange/types';
import type { ExchangeReplayDto, TableStateDto } from '../../shared/protocol';
import { SEATS } from '../../shared/seats';
import { ExchangeEventRow } from '../../server/db/models';
import { createTable, liveTest as test, simpleAction, type Client } from './live';

/** Every seated client makes its plain choice for the current step; resolves when all have acked. */
async function everyoneActs(cs: Client[], opts: Parameters<typeof simpleAction>[1] = {}) {
  await Promise.all(
    cs.map(async (c) => {
      const action = simpleAction(c.state, opts);
      if (action) await c.ok('exchange:act', { action });
    }),
  );
}

const inPhase = (phase: Phase | 'lobby') => (s: TableStateDto) => s.phase === phase;

test('a whole exchange: both Charlestons with blind passes, a courtesy pass, then a replay that matches what each seat saw', async ({ live, server }) => {
  const { host, clients: cs, table: t } = await live.fullTable({ options: { seed: 'harbor-lane-week-01' } });
  await host.ok('table:start');
  const order: Phase[] = ['first-right', 'first-across', 'first-left', 'vote', 'second-left', 'second-across', 'second-right', 'courtesy-ask', 'courtesy-pass'];
  for (const phase of order) {
    await Promise.all(cs.map((c) => c.until(inPhase(phase))));
    const blind = phase === 'first-left' || phase === 'second-right' ? 1 : 0;
    await everyoneActs(cs, { blind, stop: false, ask: 2 });
  }
  await Promise.all(cs.map((c) => c.until(inPhase('done'))));
  for (const c of cs) expect(c.state.myRack).toHaveLength(c.state.mySeat === 'east' ? 14 : 13);

  const res = await request(server.url).get(`/api/exchanges/${host.state.exchangeId}/replay`).set('Cookie', host.cookie);
  expect(res.status).toBe(200);
  const dto = res.body.replay as ExchangeReplayDto;
  expect(dto.options.seedName).toBe('harbor-lane-week-01');
  const rebuilt = replay(dto.options, dto.log);
  expect(rebuilt.phase).toBe('done');
  expect(rebuilt.history.map((h) => h.phase)).toEqual(['first-right', 'first-across', 'first-left', 'second-left', 'second-across', 'second-right', 'courtesy-pass']);
  for (const c of cs) {
    const seat = c.state.mySeat!;
    expect(rebuilt.racks[seat].map((x) => x.id).sort()).toEqual(c.state.myRack.map((x) => x.id).sort());
  }
  // Each step every client saw matches the replay of the log up to that point.
  const mine = await request(server.url).get('/api/exchanges').set('Cookie', cs[2].cookie);
  expect(mine.body.exchanges).toEqual([expect.objectContaining({ id: dto.id, tableId: t.id, seat: 'west', status: 'done' })]);
});

test('a huddle holds a pass, reveals a seat, takes a revised pass and a note, then releases', async ({ live }) => {
  const { host, clients: cs } = await live.fullTable({ options: { seed: 'harbor-lane-week-02' } });
  const [, theo, mina] = cs;
  await host.ok('table:start');
  await Promise.all(cs.map((c) => c.until(inPhase('first-right'))));
  await host.ok('huddle:call');
  await everyoneActs(cs);
  await Promise.all(cs.map((c) => c.until((s) => s.huddle.open && SEATS.every((seat) => s.seats[seat].committed))));
  expect(host.state.phase).toBe('first-right');

  await host.ok('huddle:reveal', { seat: 'south' });
  const seen = await mina.until((s) => s.huddle.revealed.south !== undefined);
  expect(seen.huddle.revealed.south!.rack.map((t) => t.id).sort()).toEqual(theo.state.myRack.map((t) => t.id).sort());
  expect(seen.huddle.revealed.south!.pass!.tiles).toHaveLength(3);

  await host.ok('huddle:note', { text: 'Theo, keep the pair of 5 dots.', seat: 'south' });
  await theo.ok('exchange:act', { action: { type: 'withdraw' } });
  await theo.until((s) => !s.seats.south.committed);
  const revised = theo.state.myRack.filter((t) => t.kind !== 'joker').slice(-3).map((t) => t.id);
  await theo.ok('exchange:act', { action: { type: 'pass', tiles: revised } });
  await host.until((s) => s.seats.south.committed);
  expect(host.state.phase).toBe('first-right');

  await host.ok('huddle:release');
  const after = await theo.until(inPhase('first-across'));
  expect(after.huddle.open).toBe(false);
  expect(after.myRack.some((t) => revised.includes(t.id))).toBe(false);
  expect(after.huddle.notes).toEqual([expect.objectContaining({ text: 'Theo, keep the pair of 5 dots.', seat: 'south', passIndex: 0, phase: 'first-right' })]);
});

test('a huddle on every pass opens by itself when the fourth pass is committed', async ({ live }) => {
  const { host, clients: cs } = await live.fullTable({ options: { huddleEveryPass: true } });
  await host.ok('table:start');
  await Promise.all(cs.map((c) => c.until(inPhase('first-right'))));
  await everyoneActs(cs);
  const held = await host.until((s) => s.huddle.open);
  expect(held.phase).toBe('first-right');
  await host.ok('huddle:release');
  await Promise.all(cs.map((c) => c.until(inPhase('first-across'))));
  await everyoneActs(cs);
  await host.until((s) => s.huddle.open && s.phase === 'first-across');
});

test('no client ever receives a tile id its seat was never dealt or passed, until the exchange is done', async ({ live }) => {
  const { host, clients: cs } = await live.fullTable({ options: { seed: 'harbor-lane-week-03' } });
  await host.ok('table:start');
  for (const phase of ['first-right', 'first-across', 'first-left', 'vote', 'second-left', 'second-across', 'second-right', 'courtesy-ask', 'courtesy-pass'] as Phase[]) {
    await Promise.all(cs.map((c) => c.until(inPhase(phase))));
    await everyoneActs(cs, { blind: phase.endsWith('left') || phase === 'second-right' ? 2 : 0, ask: 3 });
  }
  await Promise.all(cs.map((c) => c.until(inPhase('done'))));
  for (const c of cs.slice(1)) {
    // The seed with the public engine would give every rack away: only the host is told it.
    expect(c.states.filter((s) => s.phase !== 'done' && JSON.stringify(s).includes('harbor-lane-week-03'))).toEqual([]);
  }
  expect(host.state.options.seed).toBe('harbor-lane-week-03');
  for (const c of cs) {
    const own = new Set(c.states.flatMap((s) => s.myRack.map((t) => t.id)));
    const during = c.states.filter((x) => x.phase !== 'done');
    expect(during.length).toBeGreaterThan(0);
    for (const s of during) {
      const ids = JSON.stringify(s).match(/"t\d+"/g) ?? [];
      for (const id of ids) expect(own.has(JSON.parse(id)), `${c.name} saw ${id} in ${s.phase}`).toBe(true);
    }
  }
});

test('four commits sent at the same instant resolve exactly once', async ({ live }) => {
  const { host, clients: cs } = await live.fullTable();
  await host.ok('table:start');
  await Promise.all(cs.map((c) => c.until(inPhase('first-right'))));
  const actions = cs.map((c) => simpleAction(c.state)!);
  const acks = await Promise.all(cs.map((c, i) => c.emit('exchange:act', { action: actions[i] })));
  expect(acks.every((a) => a.ok)).toBe(true);
  await Promise.all(cs.map((c) => c.until(inPhase('first-across'))));
  const events = await ExchangeEventRow.findAll({ where: { exchangeId: host.state.exchangeId! } });
  expect(events.filter((e) => e.type === 'resolve')).toHaveLength(1);
  expect(events.map((e) => e.seq).sort((a, b) => a - b)).toEqual([0, 1, 2, 3, 4]);
  // Versions only ever rise, for every client.
  for (const c of cs) {
    const versions = c.states.map((s) => s.version);
    expect(versions).toEqual([...versions].sort((a, b) => a - b));
  }
});

test('a restart mid-exchange rebuilds the table from its log; the players reconnect and finish', async ({ live }) => {
  const dir = live.tempDir('rackside-restart-');
  const databaseUrl = `sqlite:${join(dir, 'restart.sqlite')}`;
  const server = await live.start({ databaseUrl, sessionSecret: 'same-secret' });
  const { host, clients: cs, table: t } = await live.fullTable({ options: { seed: 'harbor-lane-week-04' } });
  await host.ok('table:start');
  await Promise.all(cs.map((c) => c.until(inPhase('first-right'))));
  await everyoneActs(cs);
  await Promise.all(cs.map((c) => c.until(inPhase('first-across'))));
  await everyoneActs(cs.slice(0, 2)); // two of four have committed the across pass
  await cs[3].until((s) => s.seats.south.committed);
  const before = cs.map((c) => ({ rack: c.state.myRack, committed: SEATS.map((s) => c.state.seats[s].committed) }));
  cs.forEach((c) => c.socket.disconnect());
  await server.close();

  await live.start({ databaseUrl, sessionSecret: 'same-secret' });
  const again: Client[] = [];
  for (const c of cs) {
    const next = await live.reconnect(c);
    again.push(next);
    await next.ok('table:join', { tableId: t.id, as: 'player' });
  }
  for (const [i, c] of again.entries()) {
    const s = await c.until(inPhase('first-across'));
    expect(s.myRack).toEqual(before[i].rack);
    expect(SEATS.map((x) => s.seats[x].committed)).toEqual(before[i].committed);
  }
  await everyoneActs(again.slice(2));
  await Promise.all(again.map((c) => c.until(inPhase('first-left'))));
  await everyoneActs(again);
  await Promise.all(again.map((c) => c.until(inPhase('vote'))));
  await again[1].ok('exchange:act', { action: { type: 'vote', stop: true } }); // one stop is enough
  await Promise.all(again.map((c) => c.until(inPhase('courtesy-ask'))));
  await everyoneActs(again, { ask: 0 });
  await Promise.all(again.map((c) => c.until(inPhase('done'))));
});

test('one person and three bots finish an exchange; the bots play by themselves', async ({ live, server }) => {
  const ines = await live.client('Ines');
  const t = await createTable(server, ines.cookie);
  await ines.ok('table:join', { tableId: t.id, as: 'player' });
  await ines.ok('table:sit', { seat: 'east' });
  await ines.ok('table:bot', { seat: 'south', strategy: 'advised' });
  await ines.ok('table:bot', { seat: 'west', strategy: 'multiples' });
  await ines.ok('table:bot', { seat: 'north', strategy: 'random' });
  expect(ines.state.seats.south.occupant).toMatchObject({ kind: 'bot', strategy: 'advised' });
  await ines.ok('table:start');
  for (;;) {
    const s = await ines.until((x) => x.phase === 'done' || simpleAction(x) !== null, 10_000);
    if (s.phase === 'done') break;
    // Bots wait for the person's vote, so every move she is asked for is hers to make.
    await ines.ok('exchange:act', { action: simpleAction(s, { stop: false, ask: 1 }) });
  }
  expect(ines.state.phase).toBe('done');
  expect(ines.state.myRack).toHaveLength(14);
});

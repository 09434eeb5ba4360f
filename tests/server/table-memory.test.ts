/** Tables nobody is at leave memory and come back from the database, unchanged, when next asked for. */
import { expect } from 'vitest';
import { SEATS } from '../../shared/seats';
import { liveTest as test, simpleAction, type Client, type Server } from './live';

async function everyoneActs(cs: Client[]) {
  await Promise.all(
    cs.map(async (c) => {
      const action = simpleAction(c.state, { stop: true, ask: 0 });
      if (action) await c.ok('exchange:act', { action });
    }),
  );
}

/** Plays plainly, move by move, as each state asks, until the exchange is done. */
async function playToEnd(c: Client) {
  for (;;) {
    const s = await c.until((st) => st.phase === 'done' || (st.view !== null && !st.view.seats[st.mySeat!].committed && simpleAction(st, { stop: true, ask: 0 }) !== null), 10_000);
    if (s.phase === 'done') return;
    await c.emit('exchange:act', { action: simpleAction(s, { stop: true, ask: 0 }) });
  }
}

/** Waits (on the table's own state, not the clock) until nothing is under way and nobody is counted. */
async function quiet(server: Server, tableId: string) {
  const master = (await server.registry.peek(tableId))!;
  await master.idle();
  while (!master.quiet) await new Promise((resolve) => setImmediate(resolve));
}

test('a table left mid-exchange leaves memory, and its players come back to it exactly as it was and finish', async ({ live }) => {
  const server = await live.start();
  const t = await live.fullTable({ options: { secondCharleston: false, courtesy: false } });
  await t.host.ok('table:start');
  await Promise.all(t.clients.map((c) => c.until((s) => s.phase === 'first-right')));
  await everyoneActs(t.clients);
  await Promise.all(t.clients.map((c) => c.until((s) => s.phase === 'first-across')));
  await everyoneActs(t.clients.slice(0, 2));
  await t.clients[3].until((s) => s.seats.south.committed);
  const before = t.clients.map((c) => ({ rack: c.state.myRack, committed: SEATS.map((s) => c.state.seats[s].committed) }));

  // A second table where someone stays keeps its place in memory.
  const other = await live.fullTable({}, ['Sol', 'Pat', 'Nadia', 'Omar']);

  t.clients.forEach((c) => c.socket.disconnect());
  await quiet(server, t.table.id);
  expect(await server.registry.sweep(0)).toBe(1);
  expect(await server.registry.peek(t.table.id)).toBeNull();
  expect(await server.registry.peek(other.table.id)).not.toBeNull();

  const again: Client[] = [];
  for (const c of t.clients) {
    const next = await live.reconnect(c);
    again.push(next);
    await next.ok('table:join', { tableId: t.table.id, as: 'player' });
  }
  for (const [i, c] of again.entries()) {
    const s = await c.until((st) => st.phase === 'first-across');
    expect(s.myRack).toEqual(before[i].rack);
    expect(SEATS.map((x) => s.seats[x].committed)).toEqual(before[i].committed);
  }
  await everyoneActs(again.slice(2));
  await Promise.all(again.map((c) => c.until((s) => s.phase === 'first-left')));
});

test('a finished table leaves memory once its players go; many tables played one after another leave the registry empty', async ({ live }) => {
  const server = await live.start();
  for (let round = 0; round < 3; round++) {
    const t = await live.fullTable({ options: { secondCharleston: false, courtesy: false } }, [`Ines${round}`, `Theo${round}`, `Mina${round}`, `Ruth${round}`]);
    await t.host.ok('table:start');
    await Promise.all(t.clients.map((c) => playToEnd(c)));
    t.clients.forEach((c) => c.socket.disconnect());
    await quiet(server, t.table.id);
  }
  expect(server.registry.size).toBe(3);
  expect(await server.registry.sweep(0)).toBe(3);
  expect(server.registry.size).toBe(0);
});

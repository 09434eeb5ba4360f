/**
 * A socket can neither grow a table's log without bound nor go unanswered: moves are limited per
 * seat per second and per exchange, refused moves store nothing, and every message name that is
 * not Rackside's (even one every object has) is answered.
 */
import { afterEach, expect, test } from 'vitest';
import { testConfig } from '../../server/config';
import { ExchangeEventRow } from '../../server/db/models';
import { Client, fullTable, liveServer, type Server } from './live';

let server: Server | undefined;
const clients: Client[] = [];
afterEach(async () => {
  clients.splice(0).forEach((c) => c.socket.disconnect());
  await server?.close();
  server = undefined;
});

async function dealt(overrides: Parameters<typeof liveServer>[0] = {}) {
  server = await liveServer(overrides);
  const t = await fullTable(server, { options: { secondCharleston: false, courtesy: false } });
  clients.push(...t.clients);
  await t.host.ok('table:start');
  await t.host.until((s) => s.phase === 'first-right');
  return t;
}

/** Pass, take back, pass, take back…: `count` toggles sent at once. */
function toggles(c: Client, count: number) {
  const tiles = c.state.myRack.filter((t) => t.kind !== 'joker').slice(0, 3).map((t) => t.id);
  return Promise.all(Array.from({ length: count }, (_, i) => c.emit('exchange:act', { action: i % 2 === 0 ? { type: 'pass', tiles } : { type: 'withdraw' } })));
}

test('a seat sending more moves than anyone plays is refused with a clear error, and nothing refused is stored', async () => {
  // Five moves a minute: however slowly a busy machine answers, the forty arrive within the window.
  const { host } = await dealt({ rateLimits: { ...testConfig().rateLimits, actions: { max: 5, windowMs: 60_000 } } });
  const acks = await toggles(host, 40);
  const refused = acks.filter((a) => !a.ok);
  expect(refused.length).toBeGreaterThan(0);
  expect(refused.every((a) => a.code === 'RATE_LIMITED')).toBe(true);
  expect(refused[0].message).toMatch(/nothing of that move was kept/);
  const stored = await ExchangeEventRow.count({ where: { exchangeId: host.state.exchangeId!, type: 'act' } });
  expect(stored).toBe(acks.filter((a) => a.ok).length);
  expect(stored).toBe(5);
});

test('a seat has a budget of moves per exchange; past it, moves are refused and the log stops growing', async () => {
  const { host, clients: cs } = await dealt({ rateLimits: { ...testConfig().rateLimits, actions: { max: 1000, windowMs: 60_000 }, actionsPerExchange: 12 } });
  const acks = await toggles(host, 30);
  expect(acks.filter((a) => a.ok)).toHaveLength(12);
  const over = acks.filter((a) => !a.ok);
  expect(over.length).toBe(18);
  expect(over.every((a) => a.code === 'TOO_MANY_MOVES')).toBe(true);
  expect(await ExchangeEventRow.count({ where: { exchangeId: host.state.exchangeId!, type: 'act' } })).toBe(12);
  // The other seats still play: the budget is each seat's own.
  const south = cs[1];
  const tiles = south.state.myRack.filter((t) => t.kind !== 'joker').slice(0, 3).map((t) => t.id);
  expect((await south.emit('exchange:act', { action: { type: 'pass', tiles } })).ok).toBe(true);
});

test('message names every object has, and unknown ones, are answered UNKNOWN_EVENT', async () => {
  server = await liveServer();
  const { host } = await fullTable(server);
  clients.push(host);
  for (const name of ['__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf', 'table:explode']) {
    const ack = await host.emit(name, { tableId: 'x' });
    expect(ack, name).toMatchObject({ ok: false, code: 'UNKNOWN_EVENT' });
  }
  // The socket still works afterwards.
  expect((await host.emit('table:stand')).ok).toBe(true);
});

/**
 * A socket can neither grow a table's log without bound nor go unanswered: moves are limited per
 * seat per second and per exchange, refused moves store nothing, and every message name that is
 * not Rackside's (even one every object has) is answered.
 */
import { expect } from 'vitest';
import { testConfig } from '../../server/config';
import { ExchangeEventRow } from '../../server/db/models';
import { liveTest as test, type Client, type LiveKit } from './live';

async function dealt(live: LiveKit, overrides: Parameters<LiveKit['start']>[0] = {}) {
  await live.start(overrides);
  const t = await live.fullTable({ options: { secondCharleston: false, courtesy: false } });
  await t.host.ok('table:start');
  await t.host.until((s) => s.phase === 'first-right');
  return t;
}

/** Pass, take back, pass, take back…: `count` toggles sent at once. */
function toggles(c: Client, count: number) {
  const tiles = c.state.myRack.filter((t) => t.kind !== 'joker').slice(0, 3).map((t) => t.id);
  return Promise.all(Array.from({ length: count }, (_, i) => c.emit('exchange:act', { action: i % 2 === 0 ? { type: 'pass', tiles } : { type: 'withdraw' } })));
}

test('a seat sending more moves than anyone plays is refused with a clear error, and nothing refused is stored', async ({ live }) => {
  // Five moves a minute: however slowly a busy machine answers, the forty arrive within the window.
  const { host } = await dealt(live, { rateLimits: { ...testConfig().rateLimits, actions: { max: 5, windowMs: 60_000 } } });
  const acks = await toggles(host, 40);
  const refused = acks.filter((a) => !a.ok);
  expect(refused.length).toBeGreaterThan(0);
  expect(refused.every((a) => a.code === 'RATE_LIMITED')).toBe(true);
  expect(refused[0].message).toMatch(/nothing of that move was kept/);
  const stored = await ExchangeEventRow.count({ where: { exchangeId: host.state.exchangeId!, type: 'act' } });
  expect(stored).toBe(acks.filter((a) => a.ok).length);
  expect(stored).toBe(5);
});

test('a seat has a budget of moves per exchange; past it, moves are refused and the log stops growing', async ({ live }) => {
  const { host, clients: cs } = await dealt(live, { rateLimits: { ...testConfig().rateLimits, actions: { max: 1000, windowMs: 60_000 }, actionsPerExchange: 12 } });
  const acks = await toggles(host, 30);
  // Twelve moves, then the budget is spent: the next pass still commits (a seat is never locked out of
  // choosing), and every take-back after it is refused, so the log stops growing.
  expect(acks.filter((a) => a.ok)).toHaveLength(13);
  expect(acks.slice(0, 13).every((a) => a.ok)).toBe(true);
  const over = acks.slice(13);
  expect(over.filter((a) => a.code === 'TOO_MANY_MOVES').length).toBeGreaterThan(0);
  expect(over.every((a) => a.code === 'TOO_MANY_MOVES' || a.code === 'ALREADY_COMMITTED')).toBe(true);
  expect(await ExchangeEventRow.count({ where: { exchangeId: host.state.exchangeId!, type: 'act' } })).toBe(13);
  expect((await host.until((s) => s.view!.seats.east.committed)).view!.seats.east.committed).toBe(true);
  expect(await host.emit('exchange:act', { action: { type: 'withdraw' } })).toMatchObject({ ok: false, code: 'TOO_MANY_MOVES' });
  // The other seats still play: the budget is each seat's own.
  const south = cs[1];
  const tiles = south.state.myRack.filter((t) => t.kind !== 'joker').slice(0, 3).map((t) => t.id);
  expect((await south.emit('exchange:act', { action: { type: 'pass', tiles } })).ok).toBe(true);
});

test('a control character in a socket payload is refused as bad input, naming the field', async ({ live }) => {
  await live.start();
  const { host } = await live.fullTable();
  expect(await host.emit('table:join', { tableId: '\u0000', as: 'player' })).toMatchObject({ ok: false, code: 'BAD_INPUT' });
  const chat = await host.emit('chat:send', { text: 'hello\u0000there' });
  expect(chat).toMatchObject({ ok: false, code: 'BAD_INPUT' });
  expect(chat.message).toMatch(/"text" holds a control character/);
});

test('a socket message of the wrong shape is answered in Rackside words, not the validator’s', async ({ live }) => {
  await live.start();
  const { host } = await live.fullTable();
  const ack = await host.emit('table:sit', { seat: 7 });
  expect(ack).toMatchObject({ ok: false, code: 'BAD_INPUT' });
  expect(ack.message).not.toMatch(/Invalid input|expected .*received/);
  const wrong = await host.emit('chat:send', { text: 42 });
  expect(wrong.message).toMatch(/^That chat:send message is not one Rackside understands: /);
  expect(wrong.message).not.toMatch(/Invalid input|expected .*received/);
});

test('message names every object has, and unknown ones, are answered UNKNOWN_EVENT', async ({ live }) => {
  await live.start();
  const { host } = await live.fullTable();
  for (const name of ['__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf', 'table:explode']) {
    const ack = await host.emit(name, { tableId: 'x' });
    expect(ack, name).toMatchObject({ ok: false, code: 'UNKNOWN_EVENT' });
  }
  // The socket still works afterwards.
  expect((await host.emit('table:stand')).ok).toBe(true);
});

/** A seat whose player left mid-exchange does not stall the table: after a grace time a bot keeps it warm, and the player takes it back on return. */
import { expect } from 'vitest';
import { liveTest as test, type Client } from './live';

const away = (c: Client, seat: 'east' | 'south' | 'west' | 'north') => c.until((s) => s.seats[seat].occupant?.kind === 'user' && !(s.seats[seat].occupant as { connected: boolean }).connected);

test('the host may hand an away seat to a bot only after the grace time, and the player takes it back, rack and all', async ({ live }) => {
  const server = await live.start({ seatGraceMs: 60 * 60 * 1000 });
  const t = await live.fullTable();
  const [host, theo] = t.clients;
  await host.ok('table:start');
  await theo.until((s) => s.phase === 'first-right');
  theo.socket.disconnect();
  const seen = await away(host, 'south');
  expect((seen.seats.south.occupant as { awaySince: string | null }).awaySince).toEqual(expect.any(String));
  // Within the grace time: refused, saying how long is left.
  const early = await host.emit('table:bot', { seat: 'south', strategy: 'multiples' });
  expect(early).toMatchObject({ ok: false, code: 'GRACE_TIME' });
  expect(early.message).toMatch(/Theo may be back soon: a bot can take the south seat in \d+ s/);

  // The grace time over (a server where it is nothing), the bot stands in and play goes on.
  await server.close();
  await live.start({ seatGraceMs: 0 });
  const t2 = await live.fullTable();
  const [host2, theo2] = t2.clients;
  await host2.ok('table:start');
  const before = (await theo2.until((s) => s.phase === 'first-right')).myRack;
  theo2.socket.disconnect();
  await away(host2, 'south');
  await host2.ok('table:bot', { seat: 'south', strategy: 'multiples' });
  const warm = await host2.until((s) => s.seats.south.occupant?.kind === 'bot');
  expect(warm.seats.south.occupant).toMatchObject({ kind: 'bot', standsInFor: { displayName: 'Theo' } });

  // Theo comes back and takes his seat again, with whatever rack the seat holds now.
  const back = await live.reconnect(theo2);
  await back.ok('table:join', { tableId: t2.table.id, as: 'player' });
  await back.ok('table:sit', { seat: 'south' });
  const mine = await back.until((s) => s.mySeat === 'south' && s.myRack.length > 0);
  expect(mine.seats.south.occupant).toMatchObject({ kind: 'user', displayName: 'Theo', connected: true });
  expect(mine.myRack.length).toBe(before.length);
});

test('when the host is the one gone, the table hands the host’s seat to a bot by itself after the grace time', async ({ live }) => {
  await live.start({ seatGraceMs: 50 });
  const t = await live.fullTable();
  const [host, theo] = t.clients;
  await host.ok('table:start');
  await theo.until((s) => s.phase === 'first-right');
  host.socket.disconnect();
  const handed = await theo.until((s) => s.seats.east.occupant?.kind === 'bot', 10_000);
  expect(handed.seats.east.occupant).toMatchObject({ kind: 'bot', standsInFor: { displayName: 'Ines' } });
  // Another player may not take the host's seat: only the host can take it back.
  expect(await theo.emit('table:sit', { seat: 'east' })).toMatchObject({ ok: false });
  const back = await live.reconnect(host);
  await back.ok('table:join', { tableId: t.table.id, as: 'player' });
  await back.ok('table:sit', { seat: 'east' });
  await back.until((s) => s.mySeat === 'east' && s.seats.east.occupant?.kind === 'user');
});

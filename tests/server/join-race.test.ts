/** A socket that goes away while its join is still being answered never counts as present. */
import { expect } from 'vitest';
import { liveTest as test } from './live';

test('a socket that disconnects while table:join awaits is not added to the room or the count, so a bot may take the seat', async ({ live }) => {
  const server = await live.start();
  const t = await live.fullTable();
  const [host, theo] = t.clients;
  await host.ok('table:start');
  await host.until((s) => s.phase === 'first-right');
  theo.socket.disconnect();
  await host.until((s) => (s.seats.south.occupant as { connected?: boolean }).connected === false);

  // Theo comes back, but his new socket closes while the table is still being looked up.
  const registry = server.registry;
  const lookUp = registry.get.bind(registry);
  let serverSideGone!: () => void;
  const gone = new Promise<void>((resolve) => (serverSideGone = resolve));
  let entered!: () => void;
  const inJoin = new Promise<void>((resolve) => (entered = resolve));
  server.io.on('connection', (s) => s.on('disconnect', () => serverSideGone()));
  registry.get = async (id: string) => {
    entered();
    await gone;
    return lookUp(id);
  };
  const again = await live.socket(theo.cookie);
  again.emit('table:join', { tableId: t.table.id, as: 'player' });
  // The server holds the join (it is waiting on the look-up); now the socket goes.
  await inJoin;
  again.disconnect();
  await gone;
  registry.get = lookUp;
  // Let the held join run to its end.
  await (await registry.peek(t.table.id))!.idle();
  await new Promise((resolve) => setImmediate(resolve));

  // The table never counts the ghost: the host still sees south away and may seat a bot there.
  const bot = await host.emit('table:bot', { seat: 'south', strategy: 'random' });
  expect(bot).toMatchObject({ ok: true });
  const master = await registry.peek(t.table.id);
  expect(master!.connected.size).toBe(3);
  expect([...server.io.of('/').adapter.rooms.get(`table:${t.table.id}`) ?? []].every((id) => server.io.of('/').sockets.get(id)?.connected)).toBe(true);
});

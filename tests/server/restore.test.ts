/** One table whose stored log no longer applies does not keep the server, or any other table, from starting. */
import { join } from 'node:path';
import { expect } from 'vitest';
import { ExchangeEventRow } from '../../server/db/models';
import { liveTest as test, simpleAction } from './live';

test('a table with a broken log is logged and closed to its players with a clear error; the server starts and the other tables play on', async ({ live }) => {
  const dir = live.tempDir('rackside-restore-');
  const databaseUrl = `sqlite:${join(dir, 'restore.sqlite')}`;
  const server = await live.start({ databaseUrl, sessionSecret: 'same-secret' });
  const broken = await live.fullTable({}, ['Ines', 'Theo', 'Mina', 'Ruth']);
  const fine = await live.fullTable({}, ['Sol', 'Pat', 'Nadia', 'Omar']);
  for (const t of [broken, fine]) {
    await t.host.ok('table:start');
    await t.host.until((s) => s.phase === 'first-right');
    const action = simpleAction(t.host.state)!;
    await t.host.ok('exchange:act', { action });
  }
  const exchangeId = broken.host.state.exchangeId!;
  [...broken.clients, ...fine.clients].forEach((c) => c.socket.disconnect());
  await server.close();

  // The stored pass now names a tile the seat never held.
  const reopened = await live.start({ databaseUrl, sessionSecret: 'same-secret', port: 0 });
  await ExchangeEventRow.update({ payload: { type: 'pass', tiles: ['no-such-tile', 'x', 'y'] } }, { where: { exchangeId, seq: 0 } });
  await reopened.close();

  await live.start({ databaseUrl, sessionSecret: 'same-secret' });
  const ines = await live.reconnect({ name: 'Ines', cookie: broken.host.cookie });
  const sol = await live.reconnect({ name: 'Sol', cookie: fine.host.cookie });
  const refused = await ines.emit('table:join', { tableId: broken.table.id, as: 'player' });
  expect(refused).toMatchObject({ ok: false, code: 'TABLE_BROKEN' });
  expect(refused.message).toMatch(/could not be restored/);
  await sol.ok('table:join', { tableId: fine.table.id, as: 'player' });
  expect((await sol.until((s) => s.phase === 'first-right')).seats.east.committed).toBe(true);
});

/** One table whose stored log no longer applies does not keep the server, or any other table, from starting. */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, expect, test } from 'vitest';
import { ExchangeEventRow } from '../../server/db/models';
import { Client, fullTable, liveServer, openSocket, simpleAction, type Server } from './live';

let server: Server | undefined;
const clients: Client[] = [];
const dirs: string[] = [];
afterEach(async () => {
  clients.splice(0).forEach((c) => c.socket.disconnect());
  await server?.close();
  server = undefined;
  dirs.splice(0).forEach((d) => rmSync(d, { recursive: true, force: true }));
});

test('a table with a broken log is logged and closed to its players with a clear error; the server starts and the other tables play on', async () => {
  const dir = mkdtempSync(join(tmpdir(), 'rackside-restore-'));
  dirs.push(dir);
  const databaseUrl = `sqlite:${join(dir, 'restore.sqlite')}`;
  server = await liveServer({ databaseUrl, sessionSecret: 'same-secret' });
  const broken = await fullTable(server, {}, ['Ines', 'Theo', 'Mina', 'Ruth']);
  const fine = await fullTable(server, {}, ['Sol', 'Pat', 'Nadia', 'Omar']);
  clients.push(...broken.clients, ...fine.clients);
  for (const t of [broken, fine]) {
    await t.host.ok('table:start');
    await t.host.until((s) => s.phase === 'first-right');
    const action = simpleAction(t.host.state)!;
    await t.host.ok('exchange:act', { action });
  }
  const exchangeId = broken.host.state.exchangeId!;
  clients.splice(0).forEach((c) => c.socket.disconnect());
  await server.close();
  server = undefined;

  // The stored pass now names a tile the seat never held.
  const reopened = await liveServer({ databaseUrl, sessionSecret: 'same-secret', port: 0 });
  await ExchangeEventRow.update({ payload: { type: 'pass', tiles: ['no-such-tile', 'x', 'y'] } }, { where: { exchangeId, seq: 0 } });
  await reopened.close();

  server = await liveServer({ databaseUrl, sessionSecret: 'same-secret' });
  const ines = new Client('Ines', broken.host.cookie, await openSocket(server, broken.host.cookie));
  const sol = new Client('Sol', fine.host.cookie, await openSocket(server, fine.host.cookie));
  clients.push(ines, sol);
  const refused = await ines.emit('table:join', { tableId: broken.table.id, as: 'player' });
  expect(refused).toMatchObject({ ok: false, code: 'TABLE_BROKEN' });
  expect(refused.message).toMatch(/could not be restored/);
  await sol.ok('table:join', { tableId: fine.table.id, as: 'player' });
  expect((await sol.until((s) => s.phase === 'first-right')).seats.east.committed).toBe(true);
});

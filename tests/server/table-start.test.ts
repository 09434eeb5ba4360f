/** Starting a deal stores the exchange and the table's move to it together, or neither. */
import { expect } from 'vitest';
import { ExchangeRow, TableRow } from '../../server/db/models';
import { liveTest as test } from './live';

test('a start whose table save loses to another process leaves no exchange behind; the retry deals exactly one', async ({ live }) => {
  await live.start();
  const t = await live.fullTable();
  // Another process changes the table row first: this process's copy is now one revision behind.
  await TableRow.sequelize!.query('UPDATE "Tables" SET "revision" = "revision" + 1 WHERE "id" = ?', { replacements: [t.table.id] });
  await t.host.ok('table:start');
  await t.host.until((s) => s.phase === 'first-right');
  const exchanges = await ExchangeRow.findAll({ where: { tableId: t.table.id } });
  const row = await TableRow.findByPk(t.table.id);
  expect(exchanges.map((e) => e.id)).toEqual([row!.currentExchangeId]);
  expect(exchanges[0].status).toBe('playing');
});

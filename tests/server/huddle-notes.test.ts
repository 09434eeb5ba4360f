/** Who reads a huddle note: a note for the table reaches everyone; a note on one seat is that seat's and the host's until the exchange is done. */
import { expect } from 'vitest';
import type { TableStateDto } from '../../shared/protocol';
import { liveTest as test } from './live';

const texts = (s: TableStateDto) => s.huddle.notes.map((n) => n.text).sort();

test('a note for the table reaches every seat and spectator; a note on west reaches only west and the host', async ({ live }) => {
  await live.start();
  const t = await live.fullTable({ options: { secondCharleston: false, courtesy: false } });
  const [ines, theo, mina, ruth] = t.clients; // east (host), south, west, north
  const watcher = await live.client('Sol');
  await t.host.ok('table:start');
  await watcher.ok('table:join', { tableId: t.table.id, as: 'spectator' });
  await ines.until((s) => s.phase === 'first-right');
  await ines.ok('huddle:call');
  await ines.ok('huddle:note', { text: 'Everyone: keep your pairs.' });
  await ines.ok('huddle:note', { text: 'Mina, your dots are building.', seat: 'west' });

  const both = ['Everyone: keep your pairs.', 'Mina, your dots are building.'];
  await ines.until((s) => s.huddle.notes.length === 2);
  await mina.until((s) => s.huddle.notes.length === 2);
  expect(texts(ines.state)).toEqual(both);
  expect(texts(mina.state)).toEqual(both);
  for (const other of [theo, ruth, watcher]) {
    const s = await other.until((st) => st.huddle.notes.length >= 1);
    // The table note arrived; the note on west did not, in any state this seat was sent.
    expect(texts(s)).toEqual(['Everyone: keep your pairs.']);
    expect(other.states.some((st) => st.huddle.notes.some((n) => n.seat === 'west'))).toBe(false);
  }
});

import { join } from 'node:path';
import { expect } from 'vitest';
import { ExchangeEventRow } from '../../server/db/models';
import type { TableStateDto } from '../../shared/protocol';
import { SEATS } from '../../shared/seats';
import { liveTest, simpleAction } from './live';

/** Every test here has a live server on a database file of its own, removed after the test. */
const test = liveTest.extend('fileServer', { auto: true }, async ({ live }) => live.start({ databaseUrl: `sqlite:${join(live.tempDir('rackside-table-log-'), 'rackside.sqlite')}` }));

const inPhase = (phase: string) => (s: TableStateDto) => s.phase === phase;

test('on a file database, four players finish an exchange; every acked move is in the log, in order, with no gaps', async ({ live }) => {
  const { clients: four, host } = await live.fullTable();
  await host.ok('table:start');
  for (let turn = 0; turn < 12; turn++) {
    const states = await Promise.all(four.map((c) => c.until((s) => s.phase === 'done' || (s.view !== null && simpleAction(s, { ask: 1 }) !== null))));
    if (states[0].phase === 'done') break;
    // All four at once, as fast as they can: the table takes them in one stored group.
    const acks = await Promise.all(four.map((c, i) => c.emit('exchange:act', { action: simpleAction(states[i], { ask: 1 }) })));
    expect(acks.every((a) => a.ok)).toBe(true);
    // An ack comes after the state that shows the move: the acting seat already holds it.
    four.forEach((c, i) => {
      const seat = SEATS[i];
      const latest = c.state;
      expect(latest.version).toBeGreaterThanOrEqual(Number(acks[i].version));
      expect(latest.view!.history.length > states[i].view!.history.length || latest.view!.seats[seat].committed || latest.phase !== states[i].phase).toBe(true);
    });
  }
  await Promise.all(four.map((c) => c.until(inPhase('done'))));
  const events = await ExchangeEventRow.findAll({ where: { exchangeId: host.state.exchangeId! }, order: [['seq', 'ASC']] });
  expect(events.map((e) => e.seq)).toEqual(events.map((_, i) => i));
  expect(events.at(-1)!.type).toBe('resolve');
});

test('when another writer took the next place in the log, the table reads its log again and the move is tried once more', async ({ live }) => {
  const { clients: four, host } = await live.fullTable();
  await host.ok('table:start');
  const [east, south] = four;
  const southState = await south.until(inPhase('first-right'));
  const exchangeId = host.state.exchangeId!;
  // Another process stores south's pass at the next place of the log behind this one's back.
  const next = await ExchangeEventRow.count({ where: { exchangeId } });
  await ExchangeEventRow.create({ exchangeId, seq: next, type: 'act', seat: 'south', payload: simpleAction(southState), userId: null });
  // East's move finds its place taken, the table rebuilds from the log (south's pass included) and takes east's move after it.
  const eastState = await east.until(inPhase('first-right'));
  const ack = await east.emit('exchange:act', { action: simpleAction(eastState) });
  expect(ack).toMatchObject({ ok: true });
  const after = await east.until((s) => s.view!.seats.east.committed && s.view!.seats.south.committed);
  expect(after.phase).toBe('first-right');
  const events = await ExchangeEventRow.findAll({ where: { exchangeId }, order: [['seq', 'ASC']] });
  expect(events.map((e) => [e.seq, e.seat])).toEqual([
    [next, 'south'],
    [next + 1, 'east'],
  ]);
  // South's own resend is now refused: the log already holds its pass.
  const again = await south.emit('exchange:act', { action: simpleAction(southState) });
  expect(again).toMatchObject({ ok: false, code: 'ALREADY_COMMITTED' });
});

test('when the log cannot take a move, it is refused, nobody is shown it, versions never go back, and the table goes on', async ({ live }) => {
  const { clients: four, host } = await live.fullTable();
  await host.ok('table:start');
  const states = await Promise.all(four.map((c) => c.until(inPhase('first-right'))));
  const sequelize = ExchangeEventRow.sequelize!;
  // The database refuses south's next move (as a failing disk would), and nothing else.
  await sequelize.query(`CREATE TRIGGER refuse_south BEFORE INSERT ON "ExchangeEvents" WHEN NEW.seat = 'south' BEGIN SELECT RAISE(ABORT, 'the disk is failing'); END;`);
  const refused = await four[1].emit('exchange:act', { action: simpleAction(states[1]) });
  expect(refused).toMatchObject({ ok: false, code: 'NOT_STORED' });
  await sequelize.query('DROP TRIGGER refuse_south;');
  // Nobody was ever shown south committed; east's move still goes through on the reloaded table.
  const ack = await four[0].emit('exchange:act', { action: simpleAction(states[0]) });
  expect(ack).toMatchObject({ ok: true });
  const after = await four[2].until((s) => s.view!.seats.east.committed);
  expect(after.view!.seats.south.committed).toBe(false);
  for (const c of four) {
    expect(c.states.some((s) => s.view?.seats.south.committed)).toBe(false);
    const versions = c.states.map((s) => s.version);
    expect(versions).toEqual([...versions].sort((x, y) => x - y));
  }
  // South sends again and the pass resolves.
  const again = await four[1].emit('exchange:act', { action: simpleAction(states[1]) });
  expect(again).toMatchObject({ ok: true });
  await Promise.all([2, 3].map((i) => four[i].emit('exchange:act', { action: simpleAction(states[i]) })));
  await Promise.all(four.map((c) => c.until(inPhase('first-across'))));
  const events = await ExchangeEventRow.findAll({ where: { exchangeId: host.state.exchangeId! }, order: [['seq', 'ASC']] });
  expect(events.map((e) => e.seq)).toEqual(events.map((_, i) => i));
});

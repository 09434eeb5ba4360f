/**
 * The table master through its one `dispatch`, on a store in memory: no sockets, no database.
 * Two masters on one memory store behave like two processes on one database.
 */
import pino from 'pino';
import { afterEach, expect, test } from 'vitest';
import { isCommitted, legalPassSize, passableTiles } from '../../shared/exchange';
import { SEATS, type Seat } from '../../shared/seats';
import { defaultTableOptions, restoreExchange } from '../../shared/table';
import { TableMaster, type Member, type TableCommand } from '../../server/realtime/table-master';
import { MemoryTableStore, type TableRecord } from '../../server/realtime/table-store';

const logger = pino({ level: 'silent' });
const masters: TableMaster[] = [];
afterEach(() => masters.splice(0).forEach((m) => m.close()));

const people: Record<Seat, Member> = {
  east: { userId: 1, displayName: 'Ines', as: 'player', isAdmin: false },
  south: { userId: 2, displayName: 'Theo', as: 'player', isAdmin: false },
  west: { userId: 3, displayName: 'Ada', as: 'player', isAdmin: false },
  north: { userId: 4, displayName: 'Rui', as: 'player', isAdmin: false },
};
const host = people.east;
const watcher: Member = { userId: 9, displayName: 'Mo', as: 'spectator', isAdmin: false };

function tableRow(changes: Partial<TableRecord> = {}): TableRecord {
  const seats = { east: null, south: null, west: null, north: null };
  return { id: 't1', name: 'Harbor', hostId: host.userId, hostName: host.displayName, private: false, inviteCode: null, options: { ...defaultTableOptions({ seed: 'memory' }) }, status: 'lobby', seats, currentExchangeId: null, revision: 0, createdAt: new Date(0), ...changes };
}

function open(store: MemoryTableStore, row = tableRow(), told: (m: TableMaster) => void = () => undefined) {
  const master = new TableMaster(row, { store, logger, botDelayMs: 0, changed: (m) => told(m) });
  masters.push(master);
  return master;
}

async function refusal(work: Promise<unknown>) {
  return work.then(
    () => 'accepted',
    (err: { code?: string }) => err.code ?? String(err),
  );
}

const pass = (master: TableMaster, seat: Seat): TableCommand => {
  const state = master.exchange!.state;
  return { type: 'exchange:act', action: { type: 'pass', tiles: passableTiles(state, seat).slice(0, legalPassSize(state, seat)).map((t) => t.id) } };
};

async function seatedAndDealt(master: TableMaster) {
  for (const seat of SEATS) await master.dispatch({ type: 'table:sit', seat }, people[seat]);
  await master.dispatch({ type: 'table:start' }, host);
}

test('four players sit, the host deals, a whole pass is chosen and resolved; the store folds back to the live table', async () => {
  const store = new MemoryTableStore([tableRow()]);
  let told = 0;
  const master = open(store, tableRow(), () => (told += 1));
  await seatedAndDealt(master);
  expect(master.row.status).toBe('playing');
  const dealtAt = master.version;
  for (const seat of SEATS) await master.dispatch(pass(master, seat), people[seat]);
  await master.idle();
  expect(master.exchange!.state.phase).toBe('first-across');
  // Four choices and the resolve, each in its own place.
  expect(master.version).toBe(dealtAt + 5);
  expect(master.shownVersion).toBe(master.version);
  expect(told).toBeGreaterThan(0);
  const stored = (await store.exchange(master.exchange!.id))!;
  expect(stored.records.map((r) => r.type)).toEqual(['act', 'act', 'act', 'act', 'resolve']);
  expect(restoreExchange(stored.id, stored.options, stored.records, stored.notes)).toEqual(master.exchange);
  const state = master.stateFor(people.south);
  expect(state).toMatchObject({ mySeat: 'south', phase: 'first-across', version: master.version });
  expect(state.myRack.map((t) => t.id).sort()).toEqual(master.exchange!.state.racks.south.map((t) => t.id).sort());
});

test('checks come in a fixed order: known command, who is asking, role, phase, stale version, then the rules', async () => {
  const master = open(new MemoryTableStore([tableRow()]));
  expect(await refusal(master.dispatch({ type: 'table:shuffle' } as unknown as TableCommand, host))).toBe('UNKNOWN_COMMAND');
  // Role before phase: a spectator calling a huddle in the lobby is told it is the host's, not that nothing is dealt.
  expect(await refusal(master.dispatch({ type: 'huddle:call' }, watcher))).toBe('NOT_HOST');
  expect(await refusal(master.dispatch({ type: 'huddle:call' }, host))).toBe('NOT_STARTED');
  expect(await refusal(master.dispatch({ type: 'table:sit', seat: 'east' }, watcher))).toBe('SPECTATOR');
  expect(await refusal(master.dispatch({ type: 'exchange:act', action: { type: 'withdraw' } }, host))).toBe('NOT_SEATED');
  expect(await refusal(master.dispatch({ type: 'table:start' }, host))).toBe('SEATS_EMPTY');
  await seatedAndDealt(master);
  const before = master.version;
  for (const seat of SEATS) await master.dispatch(pass(master, seat), people[seat]);
  // A choice made on the step before is stale; a withdraw with nothing committed breaks the rules.
  expect(await refusal(master.dispatch({ type: 'exchange:act', action: { type: 'withdraw' }, version: before }, people.west))).toBe('STALE');
  expect(await refusal(master.dispatch({ type: 'exchange:act', action: { type: 'withdraw' }, version: master.version }, people.west))).toBe('NOT_COMMITTED');
});

test('the huddle through dispatch: call, reveal, a note for one seat, release; notes are stored beside the log', async () => {
  const store = new MemoryTableStore([tableRow()]);
  const master = open(store);
  await seatedAndDealt(master);
  await master.dispatch({ type: 'huddle:call' }, host);
  await master.dispatch({ type: 'huddle:reveal', seat: 'west' }, host);
  await master.dispatch({ type: 'huddle:reveal', seat: 'west' }, host);
  await master.dispatch({ type: 'huddle:note', text: 'Keep the winds.', seat: 'west' }, host);
  expect(master.stateFor(people.west).huddle).toMatchObject({ open: true, notes: [{ text: 'Keep the winds.', seat: 'west' }] });
  expect(master.stateFor(people.south).huddle.notes).toEqual([]);
  expect(Object.keys(master.stateFor(people.south).huddle.revealed)).toEqual(['west']);
  await master.dispatch({ type: 'huddle:release' }, host);
  await master.idle();
  const stored = (await store.exchange(master.exchange!.id))!;
  expect(stored.records.map((r) => r.type)).toEqual(['huddle-call', 'huddle-reveal', 'huddle-release']);
  expect(stored.notes).toHaveLength(1);
  // Read back from the store, the table is the same, notes and all.
  const again = await TableMaster.load((await store.table('t1'))!, { store, logger, botDelayMs: 0, changed: () => undefined });
  masters.push(again);
  expect(again.exchange).toEqual(master.exchange);
  expect(again.version).toBe(master.version);
});

test('two masters on one store: the same seat choosing on both at once, exactly one choice is stored, and the other catches up', async () => {
  const store = new MemoryTableStore([tableRow()]);
  const first = open(store);
  await seatedAndDealt(first);
  const second = await TableMaster.load((await store.table('t1'))!, { store, logger, botDelayMs: 0, changed: () => undefined });
  masters.push(second);
  const tiles = passableTiles(first.exchange!.state, 'north').map((t) => t.id);
  const answers = await Promise.all([
    refusal(first.dispatch({ type: 'exchange:act', action: { type: 'pass', tiles: tiles.slice(0, 3) } }, people.north)),
    refusal(second.dispatch({ type: 'exchange:act', action: { type: 'pass', tiles: tiles.slice(3, 6) } }, people.north)),
  ]);
  expect(answers.sort()).toEqual(['ALREADY_COMMITTED', 'accepted']);
  const stored = (await store.exchange(first.exchange!.id))!;
  expect(stored.records).toHaveLength(1);
  await first.catchUp(second.position);
  await second.catchUp(first.position);
  expect(first.exchange!.state).toEqual(second.exchange!.state);
  expect(first.version).toBe(second.version);
});

test('a seat taken on another master first is refused here after one retry against the stored row', async () => {
  const store = new MemoryTableStore([tableRow()]);
  const first = open(store);
  const second = open(store, tableRow());
  await first.dispatch({ type: 'table:sit', seat: 'east' }, people.east);
  expect(await refusal(second.dispatch({ type: 'table:sit', seat: 'east' }, people.south))).toBe('SEAT_TAKEN');
  expect(second.row.seats.east).toMatchObject({ userId: people.east.userId });
  expect(second.row.revision).toBe(first.row.revision);
});

test('a write the store refuses is never shown: the move is refused, the table reads its log again and plays on', async () => {
  const store = new MemoryTableStore([tableRow()]);
  const master = open(store);
  await seatedAndDealt(master);
  const before = master.shownVersion;
  store.failNextAppend = true;
  expect(await refusal(master.dispatch(pass(master, 'east'), people.east))).toBe('NOT_STORED');
  expect(master.shownVersion).toBe(before);
  expect(master.exchange!.state.pending.east).toBeUndefined();
  await master.dispatch(pass(master, 'east'), people.east);
  expect(master.exchange!.state.pending.east).toBeDefined();
  expect(master.shownVersion).toBe(before + 1);
});

test('three bots and one player finish an exchange, the bots woken after each stored change', async () => {
  const bot = (seat: Seat) => ({ kind: 'bot' as const, strategy: 'random', displayName: `Wild card (bot, ${seat})` });
  const row = tableRow({ seats: { east: { kind: 'user', userId: host.userId, displayName: host.displayName }, south: bot('south'), west: bot('west'), north: bot('north') } });
  const master = open(new MemoryTableStore([row]), row, (m) => m.wakeBots());
  await master.dispatch({ type: 'table:start' }, host);
  master.wakeBots();
  while (master.exchange!.state.phase !== 'done') {
    const state = master.exchange!.state;
    if (!isCommitted(state, 'east')) {
      const mine: TableCommand =
        state.phase === 'vote' ? { type: 'exchange:act', action: { type: 'vote', stop: true } } : state.phase === 'courtesy-ask' ? { type: 'exchange:act', action: { type: 'courtesy-ask', count: 0 } } : pass(master, 'east');
      await master.dispatch(mine, host);
    }
    await master.idle();
    await new Promise((resolve) => setImmediate(resolve));
  }
  await master.idle();
  expect(master.row.status).toBe('done');
});

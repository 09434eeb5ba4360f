/** The table reducer, event by event: seats, bots, dealing, the exchange's events and the huddle. */
import { expect, test } from 'vitest';
import { passableTiles } from '../../../shared/exchange';
import { seatOfUser, SEATS } from '../../../shared/seats';
import { dueEvent, reduceTable, type Table, type TableEvent } from '../../../shared/table';
import { deepFreeze } from '../exchange/helpers';

const lobby = (): Table => ({ status: 'lobby', seats: { east: null, south: null, west: null, north: null }, exchange: null });

function must(table: Table, ...events: TableEvent[]): Table {
  return events.reduce((t, event) => {
    const result = reduceTable(deepFreeze(t), event);
    if (!result.ok) throw new Error(`${result.code}: ${result.message}`);
    return result.table;
  }, table);
}

function refused(table: Table, event: TableEvent) {
  const result = reduceTable(deepFreeze(table), event);
  return result.ok ? 'accepted' : result.code;
}

const ines = { userId: 1, displayName: 'Ines' };
const theo = { userId: 2, displayName: 'Theo' };
const sitInes = { type: 'sit', seat: 'east', ...ines } as const;

/** Ines in east, three Coach bots, dealt. */
function dealt(): Table {
  return must(lobby(), sitInes, { type: 'bot', seat: 'south', strategy: 'advised' }, { type: 'bot', seat: 'west', strategy: 'advised' }, { type: 'bot', seat: 'north', strategy: 'advised' }, { type: 'deal', exchangeId: 'x1', options: { seed: 'table-tests' } });
}

test('a player sits in an empty seat, moves to another, and stands', () => {
  const sat = must(lobby(), sitInes);
  expect(sat.seats.east).toEqual({ kind: 'user', ...ines });
  const moved = must(sat, { type: 'sit', seat: 'west', ...ines });
  expect(moved.seats.east).toBeNull();
  expect(seatOfUser(moved.seats, ines.userId)).toBe('west');
  expect(must(moved, { type: 'stand', userId: ines.userId }).seats.west).toBeNull();
});

test('sitting where one already sits changes nothing; a taken seat or standing unseated is refused', () => {
  const sat = must(lobby(), sitInes);
  expect((reduceTable(sat, sitInes) as { table: Table }).table).toBe(sat);
  expect(refused(sat, { type: 'sit', seat: 'east', ...theo })).toBe('SEAT_TAKEN');
  expect(refused(sat, { type: 'stand', userId: theo.userId })).toBe('NOT_SEATED');
});

test('a bot takes an empty seat under its strategy name, or a bot’s seat; in the lobby never a player’s', () => {
  const table = must(lobby(), sitInes, { type: 'bot', seat: 'south', strategy: 'random' });
  expect(table.seats.south).toEqual({ kind: 'bot', strategy: 'random', displayName: 'Wild card (bot, south)' });
  expect(must(table, { type: 'bot', seat: 'south', strategy: 'advised' }).seats.south).toMatchObject({ strategy: 'advised', displayName: 'Coach (bot, south)' });
  expect(refused(table, { type: 'bot', seat: 'east', strategy: 'advised' })).toBe('SEAT_TAKEN');
  expect(refused(table, { type: 'bot', seat: 'west', strategy: 'no-such-bot' })).toBe('BAD_INPUT');
});

test('dealing needs every seat filled and an open table; it starts an exchange at place 0 with the huddle closed', () => {
  expect(refused(must(lobby(), sitInes), { type: 'deal', exchangeId: 'x', options: { seed: 's' } })).toBe('SEATS_EMPTY');
  const table = dealt();
  expect(table.status).toBe('playing');
  expect(table.exchange).toMatchObject({ id: 'x1', seq: 0, huddle: { open: false, revealed: [], heldAt: null }, notes: [] });
  expect(refused(table, { type: 'deal', exchangeId: 'x2', options: { seed: 's' } })).toBe('EXCHANGE_UNDER_WAY');
  expect(refused({ ...lobby(), status: 'closed' }, { type: 'deal', exchangeId: 'x2', options: { seed: 's' } })).toBe('TABLE_CLOSED');
});

test('mid-exchange seats are fixed, but a bot keeps an away player’s seat warm and hands it back, rack and all', () => {
  const table = dealt();
  expect(refused(table, { type: 'sit', seat: 'south', ...theo })).toBe('EXCHANGE_UNDER_WAY');
  expect(refused(table, { type: 'stand', userId: ines.userId })).toBe('EXCHANGE_UNDER_WAY');
  const warm = must(table, { type: 'bot', seat: 'east', strategy: 'advised' });
  expect(warm.seats.east).toEqual({ kind: 'bot', strategy: 'advised', displayName: 'Coach (bot, for Ines)', standsInFor: ines });
  expect(warm.exchange).toBe(table.exchange);
  expect(refused(warm, { type: 'sit', seat: 'east', ...theo })).toBe('EXCHANGE_UNDER_WAY');
  expect(must(warm, { type: 'sit', seat: 'east', userId: ines.userId, displayName: 'Ines again' }).seats.east).toEqual({ kind: 'user', ...ines });
});

test('a table closes only between exchanges, once; finishing marks it done', () => {
  expect(refused(dealt(), { type: 'close' })).toBe('EXCHANGE_UNDER_WAY');
  const closed = must(lobby(), { type: 'close' });
  expect(closed.status).toBe('closed');
  expect((reduceTable(closed, { type: 'close' }) as { table: Table }).table).toBe(closed);
  expect(must(dealt(), { type: 'finish' }).status).toBe('done');
});

test('exchange events need a deal; each logged one takes the next place, a refused one changes nothing', () => {
  expect(refused(lobby(), { type: 'resolve' })).toBe('NOT_STARTED');
  const table = dealt();
  const tiles = passableTiles(table.exchange!.state, 'east').slice(0, 3).map((t) => t.id);
  const passed = must(table, { type: 'act', seat: 'east', action: { type: 'pass', tiles } });
  expect(passed.exchange!.seq).toBe(1);
  expect(passed.exchange!.state.pending.east).toEqual({ tiles, blind: 0 });
  expect(refused(passed, { type: 'act', seat: 'east', action: { type: 'pass', tiles } })).toBe('ALREADY_COMMITTED');
  expect(refused(passed, { type: 'resolve' })).toBe('NOT_READY');
});

test('the huddle: called in a pass, seats revealed once each, notes kept beside the log, released', () => {
  const table = dealt();
  const called = must(table, { type: 'huddle-call', auto: false });
  expect(called.exchange!.huddle).toEqual({ open: true, revealed: [], heldAt: 0 });
  expect(refused(called, { type: 'huddle-call', auto: false })).toBe('HUDDLE_OPEN');
  const shown = must(called, { type: 'huddle-reveal', seat: 'west' });
  expect(shown.exchange!.huddle.revealed).toEqual(['west']);
  expect((reduceTable(shown, { type: 'huddle-reveal', seat: 'west' }) as { table: Table }).table).toBe(shown);
  const note = { id: 1, passIndex: 0, phase: 'first-right' as const, seat: null, authorName: 'Ines', text: 'Keep the pairs.', createdAt: '2026-01-01T00:00:00.000Z' };
  const noted = must(shown, { type: 'huddle-note', note });
  expect(noted.exchange!.notes).toEqual([note]);
  expect(noted.exchange!.seq).toBe(shown.exchange!.seq);
  const released = must(noted, { type: 'huddle-release' });
  expect(released.exchange!.huddle).toEqual({ open: false, revealed: [], heldAt: 0 });
  expect(refused(released, { type: 'huddle-release' })).toBe('NO_HUDDLE');
  expect(refused(released, { type: 'huddle-reveal', seat: 'east' })).toBe('NO_HUDDLE');
});

test('a complete pass is due to resolve, or first to be held once on a table that holds every pass', () => {
  let table = dealt();
  for (const seat of SEATS) {
    const tiles = passableTiles(table.exchange!.state, seat).slice(0, 3).map((t) => t.id);
    table = must(table, { type: 'act', seat, action: { type: 'pass', tiles } });
  }
  expect(dueEvent(table.exchange!, false)).toEqual({ type: 'resolve' });
  expect(dueEvent(table.exchange!, true)).toEqual({ type: 'huddle-call', auto: true });
  const held = must(table, { type: 'huddle-call', auto: true });
  expect(dueEvent(held.exchange!, true)).toBeNull();
  const released = must(held, { type: 'huddle-release' });
  expect(dueEvent(released.exchange!, true)).toEqual({ type: 'resolve' });
  const resolved = must(released, { type: 'resolve' });
  expect(resolved.exchange!.state.phase).toBe('first-across');
  expect(dueEvent(resolved.exchange!, true)).toBeNull();
});

test('seatOfUser finds the seat a person sits in; a bot keeping a seat warm for them is not them', () => {
  const warm = must(dealt(), { type: 'bot', seat: 'east', strategy: 'advised' });
  expect(seatOfUser(dealt().seats, ines.userId)).toBe('east');
  expect(seatOfUser(warm.seats, ines.userId)).toBeNull();
  expect(seatOfUser(warm.seats, theo.userId)).toBeNull();
});

/**
 * The table reducer: the one place that says what each event does to a table. The server runs it
 * live, on restore and on catching up with another process; a replay can fold a stored log with it.
 * It is pure: a refused event answers { ok: false, code, message } and the input is never changed.
 */
import { BOT_STRATEGIES } from '../analysis/bots';
import { act, createExchange, isPassPhase, resolve } from '../exchange';
import { SEATS, seatOfUser, type Seat } from '../seats';
import type { Huddle, Table, TableEvent, TableExchange, TableResult, TableSeats } from './types';

export const closedHuddle = (): Huddle => ({ open: false, revealed: [], heldAt: null });

const refuse = (code: string, message: string): TableResult => ({ ok: false, code, message });
const same = (table: Table): TableResult => ({ ok: true, table });
const withSeats = (table: Table, seats: TableSeats): TableResult => ({ ok: true, table: { ...table, seats } });

/** Applies one event; see TableResult. */
export function reduceTable(table: Table, event: TableEvent): TableResult {
  switch (event.type) {
    case 'sit':
      return sit(table, event.seat, event.userId, event.displayName);
    case 'stand': {
      if (table.status === 'playing') return refuse('EXCHANGE_UNDER_WAY', 'Seats are fixed while an exchange is under way.');
      const current = seatOfUser(table.seats, event.userId);
      if (!current) return refuse('NOT_SEATED', 'You are not sitting at this table.');
      return withSeats(table, { ...table.seats, [current]: null });
    }
    case 'bot':
      return seatBot(table, event.seat, event.strategy);
    case 'deal': {
      if (table.status === 'playing') return refuse('EXCHANGE_UNDER_WAY', 'An exchange is already under way.');
      if (table.status === 'closed') return refuse('TABLE_CLOSED', 'This table is closed. Open a new table to deal again.');
      const empty = SEATS.filter((seat) => !table.seats[seat]);
      if (empty.length) return refuse('SEATS_EMPTY', `Fill every seat first (empty: ${empty.join(', ')}). Seat a bot in any seat nobody takes.`);
      const exchange: TableExchange = { id: event.exchangeId, state: createExchange(event.options), seq: 0, huddle: closedHuddle(), notes: [] };
      return { ok: true, table: { ...table, status: 'playing', exchange } };
    }
    case 'finish':
      return table.status === 'done' ? same(table) : { ok: true, table: { ...table, status: 'done' } };
    case 'close':
      if (table.status === 'closed') return same(table);
      if (table.status === 'playing') return refuse('EXCHANGE_UNDER_WAY', 'An exchange is under way. Close the table once it is over.');
      return { ok: true, table: { ...table, status: 'closed' } };
    default: {
      const live = table.exchange;
      if (!live) return refuse('NOT_STARTED', 'No exchange is under way at this table.');
      const next = reduceExchange(live, event);
      if (!next.ok) return next;
      return next.exchange === live ? same(table) : { ok: true, table: { ...table, exchange: next.exchange } };
    }
  }
}

/** Sitting down: a player back from being away takes the seat a bot kept warm, rack and all; otherwise only between exchanges. */
function sit(table: Table, seat: Seat, userId: number, displayName: string): TableResult {
  const occupant = table.seats[seat];
  if (table.status === 'playing' && occupant?.kind === 'bot' && occupant.standsInFor?.userId === userId) {
    return withSeats(table, { ...table.seats, [seat]: { kind: 'user', userId, displayName: occupant.standsInFor.displayName } });
  }
  if (table.status === 'playing') return refuse('EXCHANGE_UNDER_WAY', 'Seats are fixed while an exchange is under way.');
  if (occupant?.kind === 'user' && occupant.userId === userId) return same(table);
  if (occupant) return refuse('SEAT_TAKEN', `The ${seat} seat is taken. Pick an empty seat.`);
  const seats = { ...table.seats };
  const current = seatOfUser(seats, userId);
  if (current) seats[current] = null;
  seats[seat] = { kind: 'user', userId, displayName };
  return withSeats(table, seats);
}

function seatBot(table: Table, seat: Seat, strategy: string): TableResult {
  const info = BOT_STRATEGIES.find((s) => s.id === strategy);
  if (!info) return refuse('BAD_INPUT', 'Unknown bot strategy.');
  const occupant = table.seats[seat];
  if (occupant?.kind === 'user') {
    if (table.status !== 'playing') {
      return refuse('SEAT_TAKEN', `${occupant.displayName} is sitting ${seat}. A bot can only replace a player who has left during an exchange.`);
    }
    const standIn = { userId: occupant.userId, displayName: occupant.displayName };
    return withSeats(table, { ...table.seats, [seat]: { kind: 'bot', strategy, displayName: `${info.name} (bot, for ${occupant.displayName})`, standsInFor: standIn } });
  }
  return withSeats(table, { ...table.seats, [seat]: { kind: 'bot', strategy, displayName: `${info.name} (bot, ${seat})` } });
}

type ExchangeResult = { ok: true; exchange: TableExchange } | { ok: false; code: string; message: string };

/** The exchange's own events: the engine's steps and the huddle. Each logged event takes the next place (`seq`). */
function reduceExchange(live: TableExchange, event: Exclude<TableEvent, { type: 'sit' | 'stand' | 'bot' | 'deal' | 'finish' | 'close' }>): ExchangeResult {
  const { state, huddle } = live;
  const logged = (changes: Partial<TableExchange>): ExchangeResult => ({ ok: true, exchange: { ...live, ...changes, seq: live.seq + 1 } });
  switch (event.type) {
    case 'act': {
      const result = act(state, event.seat, event.action);
      return result.ok ? logged({ state: result.state }) : result;
    }
    case 'resolve': {
      const result = resolve(state);
      return result.ok ? logged({ state: result.state, huddle: { ...huddle, revealed: [] } }) : result;
    }
    case 'huddle-call':
      if (!isPassPhase(state.phase)) return { ok: false, code: 'WRONG_PHASE', message: 'A huddle holds a pass; call it while the table is choosing tiles.' };
      if (huddle.open) return { ok: false, code: 'HUDDLE_OPEN', message: 'This pass is already held.' };
      return logged({ huddle: { open: true, revealed: [], heldAt: state.history.length } });
    case 'huddle-reveal':
      if (!huddle.open) return { ok: false, code: 'NO_HUDDLE', message: 'Call a huddle first: seats are shown only while a pass is held.' };
      if (huddle.revealed.includes(event.seat)) return { ok: true, exchange: live };
      return logged({ huddle: { ...huddle, revealed: [...huddle.revealed, event.seat] } });
    case 'huddle-release':
      if (!huddle.open) return { ok: false, code: 'NO_HUDDLE', message: 'No huddle is open.' };
      return logged({ huddle: { ...huddle, open: false, revealed: [] } });
    case 'huddle-note':
      return { ok: true, exchange: { ...live, notes: [...live.notes, event.note] } };
  }
}

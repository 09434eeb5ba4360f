/** A live table as plain data: who sits where, where it stands, and its exchange with the huddle. */
import type { Action, ExchangeOptions, ExchangeState } from '../exchange/types';
import type { HuddleNoteDto, TableStatus } from '../protocol';
import type { Seat } from '../seats';

export type { TableStatus } from '../protocol';

export type UserOccupant = { kind: 'user'; userId: number; displayName: string };
/** A bot may keep a seat warm for a player who left mid-exchange (`standsInFor`); that player can take it back. */
export type BotOccupant = { kind: 'bot'; strategy: string; displayName: string; standsInFor?: { userId: number; displayName: string } };
export type Occupant = UserOccupant | BotOccupant;
export type TableSeats = Record<Seat, Occupant | null>;

export interface Huddle {
  open: boolean;
  /** Seats the host has shown to the table while the pass is held. */
  revealed: Seat[];
  /** The number of resolved passes when the last huddle opened, so each pass is held at most once automatically. */
  heldAt: number | null;
}

export interface TableExchange {
  id: string;
  state: ExchangeState;
  /** How many events of the exchange's log this state holds: the next event's place. */
  seq: number;
  huddle: Huddle;
  /** Huddle notes, oldest first. They are kept beside the log and take no place in it. */
  notes: HuddleNoteDto[];
}

export interface Table {
  status: TableStatus;
  seats: TableSeats;
  /** The exchange under way, or the last one dealt; null before the first deal. */
  exchange: TableExchange | null;
}

/** Everything that changes a table. The exchange's own events are also its stored log (see log.ts). */
export type TableEvent =
  | { type: 'sit'; seat: Seat; userId: number; displayName: string }
  | { type: 'stand'; userId: number }
  /** A bot takes a seat: an empty one, a bot's, or mid-exchange a player's, whose seat it then keeps warm. */
  | { type: 'bot'; seat: Seat; strategy: string }
  | { type: 'deal'; exchangeId: string; options: ExchangeOptions }
  | { type: 'finish' }
  | { type: 'close' }
  | { type: 'act'; seat: Seat; action: Action }
  | { type: 'resolve' }
  | { type: 'huddle-call'; auto: boolean }
  | { type: 'huddle-reveal'; seat: Seat }
  | { type: 'huddle-note'; note: HuddleNoteDto }
  | { type: 'huddle-release' };

/** The events that take a place in the exchange's stored log. */
export type LogEvent = Extract<TableEvent, { type: 'act' | 'resolve' | 'huddle-call' | 'huddle-reveal' | 'huddle-release' }>;

/** What the reducer answers: the next table (the same object when nothing changes), or why not. */
export type TableResult = { ok: true; table: Table } | { ok: false; code: string; message: string };

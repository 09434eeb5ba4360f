/** An exchange's stored log: each logged event as a record, and folding records back into the exchange. */
import type { Action, ExchangeOptions } from '../exchange/types';
import type { HuddleNoteDto } from '../protocol';
import type { Seat } from '../seats';
import { closedHuddle, reduceTable } from './reduce';
import type { LogEvent, Table, TableExchange } from './types';
import { createExchange } from '../exchange';

export type LogType = LogEvent['type'];

/** One stored event as the log keeps it (the database adds who did it and when). */
export interface LogRecord {
  type: LogType;
  seat: Seat | null;
  payload: unknown;
}

export function toRecord(event: LogEvent): LogRecord {
  switch (event.type) {
    case 'act':
      return { type: 'act', seat: event.seat, payload: event.action };
    case 'huddle-call':
      return { type: 'huddle-call', seat: null, payload: { auto: event.auto } };
    case 'huddle-reveal':
      return { type: 'huddle-reveal', seat: event.seat, payload: null };
    default:
      return { type: event.type, seat: null, payload: null };
  }
}

export function fromRecord(record: LogRecord): LogEvent {
  switch (record.type) {
    case 'act':
      return { type: 'act', seat: record.seat as Seat, action: record.payload as Action };
    case 'huddle-call':
      return { type: 'huddle-call', auto: (record.payload as { auto?: boolean } | null)?.auto === true };
    case 'huddle-reveal':
      return { type: 'huddle-reveal', seat: record.seat as Seat };
    default:
      return { type: record.type };
  }
}

/**
 * Applies stored records, in order, to an exchange (the first record at its `seq`). Throws if a
 * record no longer applies, naming its place: such a log can't be played on.
 */
export function foldLog(exchange: TableExchange, records: readonly LogRecord[]): TableExchange {
  let table: Table = { status: 'playing', seats: { east: null, south: null, west: null, north: null }, exchange };
  records.forEach((record, i) => {
    const result = reduceTable(table, fromRecord(record));
    if (!result.ok) throw new Error(`Stored event ${exchange.seq + i} of exchange ${exchange.id} no longer applies: ${result.message}`);
    // A record the state already holds (a second reveal of one seat) still takes its place.
    table = result.table.exchange!.seq === table.exchange!.seq ? { ...result.table, exchange: { ...result.table.exchange!, seq: table.exchange!.seq + 1 } } : result.table;
  });
  return table.exchange!;
}

/** An exchange rebuilt from its options, whole log and notes: the same state on any machine. */
export function restoreExchange(id: string, options: ExchangeOptions, records: readonly LogRecord[], notes: HuddleNoteDto[] = []): TableExchange {
  return foldLog({ id, state: createExchange(options), seq: 0, huddle: closedHuddle(), notes }, records);
}

/**
 * The live table as a pure reducer: seats, bots taking seats, dealing, the exchange's events and
 * the huddle. One place says what each event does; the server runs it live, on restore and when
 * catching up, and a replay can fold a stored log with `restoreExchange` / `foldLog`.
 */
export { reduceTable, closedHuddle } from './reduce';
export { foldLog, restoreExchange, toRecord, fromRecord, type LogRecord, type LogType } from './log';
export { dueEvent, botAction } from './due';
export { defaultTableOptions } from './options';
export type * from './types';

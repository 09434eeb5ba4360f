/**
 * Stores exchange events in groups. Every table appends its events here instead of writing each one
 * on its own; whatever arrived while the previous group was being written goes into the next group,
 * written in one IMMEDIATE transaction (one commit for many tables' actions instead of one each).
 *
 * Each event still succeeds or fails by itself, in order: the unique key on (exchangeId, seq) refuses
 * an event whose place in the log is already taken, and once one event of an exchange fails, the later
 * events of that exchange in the same group are not written, so a log never gets a hole. An event is
 * reported stored only after the commit that holds it returns.
 */
import { createRequire } from 'node:module';
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import sqlite3 from 'sqlite3';
import { log } from '../log';
import { databaseUrlOf, isPostgresUrl, SQLITE_FILE_PRAGMAS, sqliteStorage } from './index';

export interface EventRecord {
  exchangeId: string;
  seq: number;
  type: string;
  seat: string | null;
  /** JSON text, or null. */
  payload: string | null;
  userId: number | null;
  createdAt: string;
}

export interface AppendHooks {
  /** Asked just before writing: false drops the event unwritten (its table has thrown its guesses away). */
  wanted?: () => boolean;
  /** Called once the event's commit has returned, before any promise of that group settles. */
  stored?: () => void;
}

/** Why an event was not stored. `conflict` means its place in the log was already taken. */
export class EventNotStored extends Error {
  constructor(
    message: string,
    readonly conflict: boolean,
  ) {
    super(message);
  }
}

export interface EventWriter {
  append(record: EventRecord, hooks?: AppendHooks): Promise<void>;
  /** Resolves once every event appended so far is written or refused. */
  drain(): Promise<void>;
  close(): Promise<void>;
}

/** For a table only looked at (never played): any append is refused. */
export const noEventWriter: EventWriter = {
  append: () => Promise.reject(new EventNotStored('This table is only being read.', false)),
  drain: async () => undefined,
  close: async () => undefined,
};

const COLUMNS = '"ExchangeEvents" ("exchangeId", "seq", "type", "seat", "payload", "userId", "createdAt")';
/** The insert in each driver's own placeholders: `?` for sqlite3, `$1…` for PostgreSQL and Sequelize's bind. */
export const INSERT_QUESTION_MARKS = `INSERT INTO ${COLUMNS} VALUES (?, ?, ?, ?, ?, ?, ?)`;
export const INSERT_NUMBERED = `INSERT INTO ${COLUMNS} VALUES ($1, $2, $3, $4, $5, $6, $7)`;
/** A group larger than this is split, so one commit never holds the file for long. */
const MAX_GROUP = 2000;

interface Entry {
  record: EventRecord;
  hooks: AppendHooks;
  resolve: () => void;
  reject: (err: Error) => void;
  error?: Error;
}

type Run = (sql: string, params?: unknown[]) => Promise<void>;

/** The driver's own error, also when Sequelize wrapped it. */
const cause = (err: unknown) => ((err as { original?: unknown })?.original ?? err) as { code?: string; message?: string } | undefined;

/** SQLite's and PostgreSQL's words for a unique key refusing a row. */
const isConflict = (err: unknown) => cause(err)?.code === '23505' || /UNIQUE constraint failed|duplicate key value/i.test(String(cause(err)?.message));

/** PostgreSQL's deadlock and serialization failures, and SQLite's locked file. */
const isContention = (err: unknown) => ['40P01', '40001', 'SQLITE_BUSY'].includes(String(cause(err)?.code)) || /deadlock detected|database is locked/i.test(String(cause(err)?.message));

export interface GroupOptions {
  /** How a group's transaction starts. */
  begin: string;
  /**
   * PostgreSQL ends a whole transaction at the first failed statement, so each insert gets a
   * savepoint there, and a refused one is rolled back to it while the rest of the group goes on.
   */
  savepoints: boolean;
  /** The insert in the connection's placeholders; `?` unless given. */
  insert?: string;
  /** Where a failed stored hook is reported; the app's log unless given. */
  logger?: Logger;
}

/** Groups appends and writes them through `run`; `transactions` says whether a group is one transaction. */
export class GroupWriter implements EventWriter {
  private waiting: Entry[] = [];
  private writing: Promise<void> | null = null;
  private closed = false;
  private closing: Promise<void> | null = null;

  constructor(
    private readonly run: Run,
    private readonly transactions: boolean,
    private readonly onClose: () => Promise<void> = async () => undefined,
    private readonly options: GroupOptions = { begin: 'BEGIN IMMEDIATE', savepoints: false },
  ) {}

  append(record: EventRecord, hooks: AppendHooks = {}): Promise<void> {
    if (this.closed) return Promise.reject(new EventNotStored('The event log is closed.', false));
    return new Promise<void>((resolve, reject) => {
      this.waiting.push({ record, hooks, resolve, reject });
      if (!this.writing) this.writing = this.loop();
    });
  }

  /** Writes groups until nothing waits. The first group starts on the next turn, so that every action already received can join it. */
  private async loop() {
    await new Promise((resolve) => setImmediate(resolve));
    while (this.waiting.length) {
      const group = this.waiting.splice(0, MAX_GROUP);
      await this.write(group);
    }
    this.writing = null;
  }

  private async write(arrived: Entry[]) {
    // Every process writes a group in the same order (by exchange, then place), so two groups that
    // touch the same exchanges wait for each other in one order and never deadlock on PostgreSQL.
    const group = [...arrived].sort((a, b) => (a.record.exchangeId < b.record.exchangeId ? -1 : a.record.exchangeId > b.record.exchangeId ? 1 : a.record.seq - b.record.seq));
    const failedExchange = new Map<string, Error>();
    const written: Entry[] = [];
    try {
      if (this.transactions) await this.run(this.options.begin);
      for (const entry of group) {
        const { record } = entry;
        const earlier = failedExchange.get(record.exchangeId);
        if (earlier) {
          // Behind an event whose place was taken, this one is behind too: it shares that conflict.
          entry.error = new EventNotStored(`An earlier event of this exchange was not stored: ${earlier.message}`, earlier instanceof EventNotStored && earlier.conflict);
          continue;
        }
        if (entry.hooks.wanted && !entry.hooks.wanted()) {
          entry.error = new EventNotStored('The table discarded this event before it was written.', false);
          failedExchange.set(record.exchangeId, entry.error);
          continue;
        }
        const savepoint = this.transactions && this.options.savepoints;
        try {
          if (savepoint) await this.run('SAVEPOINT event');
          await this.run(this.options.insert ?? INSERT_QUESTION_MARKS, [record.exchangeId, record.seq, record.type, record.seat, record.payload, record.userId, record.createdAt]);
          if (savepoint) await this.run('RELEASE SAVEPOINT event');
          written.push(entry);
        } catch (err) {
          // Anything but a taken place may have ended the whole transaction (SQLite rolls back by
          // itself on a full disk or an I/O error): give up on the whole group.
          if (this.transactions && !isConflict(err)) throw err;
          if (savepoint) await this.run('ROLLBACK TO SAVEPOINT event');
          entry.error = isConflict(err)
            ? new EventNotStored(`Event ${record.seq} of exchange ${record.exchangeId} is already taken.`, true)
            : new EventNotStored(`Event ${record.seq} of exchange ${record.exchangeId} could not be written: ${(err as Error).message}`, false);
          failedExchange.set(record.exchangeId, entry.error);
        }
      }
      if (this.transactions) await this.run('COMMIT');
    } catch (err) {
      // The commit (or the begin) failed: nothing of this group is stored.
      if (this.transactions) await this.run('ROLLBACK').catch(() => undefined);
      // A group the database gave up on for another writer (a deadlock, a serialization failure,
      // a lock it waited too long for) can be tried again: its actions count as conflicts.
      const error = new EventNotStored(`The event log could not commit: ${(err as Error).message}`, isContention(err));
      for (const entry of group) entry.reject(entry.error ?? error);
      return;
    }
    for (const entry of written) {
      try {
        entry.hooks.stored?.();
      } catch (err) {
        (this.options.logger ?? log).error({ exchangeId: entry.record.exchangeId, seq: entry.record.seq, error: (err as Error).message }, 'a stored-event hook failed');
      }
    }
    for (const entry of group) {
      if (entry.error) entry.reject(entry.error);
      else entry.resolve();
    }
  }

  async drain() {
    while (this.writing) await this.writing;
  }

  /** Writes what waits, then closes the connection; a second call waits for the first. */
  close() {
    this.closed = true;
    return (this.closing ??= this.drain().then(() => this.onClose()));
  }
}

/**
 * The event writer for the database `sequelize` was opened on (same URL), on connections of its own.
 *
 * A SQLite file gets its own sqlite3 connection, so that its BEGIN IMMEDIATE … COMMIT never takes in
 * a query of the rest of the app; IMMEDIATE takes the write lock at the start, so a group never fails
 * half-way on a lock (it waits, under busy_timeout). PostgreSQL gets its own pool of one connection.
 * An in-memory SQLite database exists only on the app's one connection, which no other connection can
 * open, so there the events are written one by one through Sequelize's query.
 */
export function createEventWriter(sequelize: Sequelize, logger: Logger = log): EventWriter {
  const url = databaseUrlOf(sequelize);
  if (isPostgresUrl(url)) return postgresWriter(url, logger);
  const storage = sqliteStorage(url);
  if (storage === ':memory:') {
    const run: Run = async (sql, bind = []) => void (await sequelize.query(sql, { bind }));
    return new GroupWriter(run, false, undefined, { begin: 'BEGIN', savepoints: false, insert: INSERT_NUMBERED, logger });
  }
  return sqliteFileWriter(storage, logger);
}

const onConnection = (db: sqlite3.Database): Run => (sql, params = []) => new Promise<void>((resolve, reject) => db.run(sql, params, (err) => (err ? reject(err) : resolve())));

function sqliteFileWriter(storage: string, logger: Logger): EventWriter {
  const opened = new Promise<sqlite3.Database>((resolve, reject) => {
    const db: sqlite3.Database = new sqlite3.Database(storage, (err) => (err ? reject(err) : resolve(db)));
  });
  const ready = opened.then(async (db) => {
    for (const pragma of SQLITE_FILE_PRAGMAS) await onConnection(db)(pragma);
    return onConnection(db);
  });
  // A file that cannot be opened fails every group that tries it; nobody else waits on this promise.
  ready.catch(() => undefined);
  const close = async () => {
    const db = await opened.catch(() => null);
    await new Promise<void>((resolve) => (db ? db.close((err) => (err && logger.error({ error: err.message }, 'the event log connection did not close cleanly'), resolve())) : resolve()));
  };
  return new GroupWriter(async (sql, params) => (await ready)(sql, params), true, close, { begin: 'BEGIN IMMEDIATE', savepoints: false, insert: INSERT_QUESTION_MARKS, logger });
}

/** The parts of `pg` used here (the package ships no types). `DatabaseError` is a statement the server refused. */
type OnError = (event: 'error', listener: (err: Error) => void) => unknown;
type PgClient = { query(text: string, values?: unknown[]): Promise<unknown>; release(destroy?: Error): void; on: OnError; off: OnError };
interface PgModule {
  Pool: new (config: { connectionString: string; application_name: string; max: number; idleTimeoutMillis: number; connectionTimeoutMillis: number }) => { connect(): Promise<PgClient>; end(): Promise<void>; on: OnError };
  DatabaseError: new (...args: never[]) => Error;
}

/** The connection a group holds; `broken` once it failed (not a statement refused): it is then thrown away, not given back. */
type Held = { client: PgClient; broken?: Error; onError: (err: Error) => void };

/**
 * PostgreSQL: a pool of one connection of the writer's own (groups are written one after another). A
 * group takes the connection at its BEGIN and gives it back at its COMMIT or ROLLBACK; a connection that
 * broke is thrown away, its group fails, and the next group connects afresh.
 */
function postgresWriter(url: string, logger: Logger): EventWriter {
  const { Pool, DatabaseError } = createRequire(import.meta.url)('pg') as PgModule;
  const pool = new Pool({ connectionString: url, application_name: 'rackside event log', max: 1, idleTimeoutMillis: 10_000, connectionTimeoutMillis: 10_000 });
  pool.on('error', (err) => logger.warn({ error: err.message }, 'an idle event log connection broke; the next group opens another'));
  let held: Held | null = null;
  const letGo = () => {
    if (!held) return;
    const { client, broken, onError } = held;
    held = null;
    client.off('error', onError);
    client.release(broken);
  };
  const run: Run = async (sql, params = []) => {
    if (!held) {
      // The group's connection is already gone (it broke): there is nothing to roll back.
      if (sql === 'ROLLBACK') return;
      const client = await pool.connect();
      const taken: Held = { client, onError: (err) => (taken.broken ??= err) };
      client.on('error', taken.onError);
      held = taken;
    }
    const current = held;
    try {
      await current.client.query(sql, params);
    } catch (err) {
      if (!(err instanceof DatabaseError)) current.broken ??= err as Error;
      throw err;
    } finally {
      if (sql === 'COMMIT' || sql === 'ROLLBACK' || current.broken) letGo();
    }
  };
  const close = async () => {
    letGo();
    await pool.end();
  };
  return new GroupWriter(run, true, close, { begin: 'BEGIN', savepoints: true, insert: INSERT_NUMBERED, logger });
}

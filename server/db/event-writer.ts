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
import sqlite3 from 'sqlite3';
import type { Sequelize } from 'sequelize';

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

const INSERT = 'INSERT INTO "ExchangeEvents" ("exchangeId", "seq", "type", "seat", "payload", "userId", "createdAt") VALUES (?, ?, ?, ?, ?, ?, ?)';
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

/** SQLite's and PostgreSQL's words for a unique key refusing a row. */
const isConflict = (err: unknown) => (err as { code?: string })?.code === '23505' || /UNIQUE constraint failed|duplicate key value/i.test(String((err as Error)?.message));

/** PostgreSQL's deadlock and serialization failures, and SQLite's locked file. */
const isContention = (err: unknown) => ['40P01', '40001', 'SQLITE_BUSY'].includes(String((err as { code?: string })?.code)) || /deadlock detected|database is locked/i.test(String((err as Error)?.message));

export interface GroupOptions {
  /** How a group's transaction starts. */
  begin: string;
  /**
   * PostgreSQL ends a whole transaction at the first failed statement, so each insert gets a
   * savepoint there, and a refused one is rolled back to it while the rest of the group goes on.
   */
  savepoints: boolean;
}

/** Groups appends and writes them through `run`; `transactions` says whether a group is one transaction. */
export class GroupWriter implements EventWriter {
  private waiting: Entry[] = [];
  private writing: Promise<void> | null = null;
  private closed = false;

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
          await this.run(INSERT, [record.exchangeId, record.seq, record.type, record.seat, record.payload, record.userId, record.createdAt]);
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
        console.error('A stored-event hook failed', err);
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

  async close() {
    this.closed = true;
    await this.drain();
    await this.onClose();
  }
}

function promisedRun(db: { run(sql: string, params: unknown[], done: (err: Error | null) => void): unknown }): Run {
  return (sql, params = []) => new Promise<void>((resolve, reject) => db.run(sql, params, (err) => (err ? reject(err) : resolve())));
}

/**
 * The event writer for a database. A SQLite file gets a connection of its own, so that its
 * BEGIN IMMEDIATE … COMMIT never takes in a query of the rest of the app; IMMEDIATE takes the write
 * lock at the start, so a group never fails half-way on a lock (it waits, under busy_timeout).
 * An in-memory database has only the one connection, so its events are written one by one on it.
 */
export function createEventWriter(sequelize: Sequelize): EventWriter {
  if (sequelize.getDialect() === 'postgres') return postgresWriter(sequelize);
  const storage = ((sequelize as unknown as { options: { storage?: string } }).options).storage ?? ':memory:';
  if (storage === ':memory:' || storage === '') {
    const manager = sequelize.connectionManager as unknown as { getConnection(options: object): Promise<Parameters<typeof promisedRun>[0]> };
    const shared = manager.getConnection({}).then(promisedRun);
    return new GroupWriter(async (sql, params) => (await shared)(sql, params), false);
  }
  let db: sqlite3.Database | null = null;
  const ready = new Promise<Run>((resolve, reject) => {
    const opened: sqlite3.Database = new sqlite3.Database(storage, (err) => (err ? reject(err) : resolve(promisedRun(opened))));
    db = opened;
  }).then(async (run) => {
    for (const pragma of ['PRAGMA busy_timeout = 5000', 'PRAGMA foreign_keys = ON', 'PRAGMA journal_mode = WAL', 'PRAGMA synchronous = NORMAL']) await run(pragma);
    return run;
  });
  ready.catch(() => undefined);
  return new GroupWriter(
    async (sql, params) => (await ready)(sql, params),
    true,
    () => new Promise<void>((resolve) => (db ? db.close(() => resolve()) : resolve())),
  );
}

interface PgClient {
  query(text: string, values?: unknown[]): Promise<unknown>;
}

/** `?` placeholders as PostgreSQL writes them: $1, $2, … */
const numbered = (sql: string) => {
  let n = 0;
  return sql.replace(/\?/g, () => `$${++n}`);
};

/**
 * On PostgreSQL the writer keeps one connection of the pool for itself (a group's transaction must
 * stay on one connection). If that connection breaks, the group fails and the next group takes a
 * fresh one.
 */
function postgresWriter(sequelize: Sequelize): EventWriter {
  const manager = sequelize.connectionManager as unknown as { getConnection(options: object): Promise<PgClient>; releaseConnection(c: PgClient): Promise<void> };
  let held: Promise<PgClient> | null = null;
  const connection = () =>
    (held ??= manager.getConnection({ type: 'write' }).catch((err) => {
      held = null;
      throw err;
    }));
  const run: Run = async (sql, params = []) => {
    const client = await connection();
    try {
      await client.query(numbered(sql), params);
    } catch (err) {
      // A statement refused by the database keeps the connection; a broken connection is let go.
      if (!(err as { code?: string }).code) {
        held = null;
        manager.releaseConnection(client).catch(() => undefined);
      }
      throw err;
    }
  };
  return new GroupWriter(
    run,
    true,
    async () => {
      if (held) await manager.releaseConnection(await held).catch(() => undefined);
      held = null;
    },
    { begin: 'BEGIN', savepoints: true },
  );
}

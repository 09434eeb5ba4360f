/**
 * Where a table master keeps its table: the row (seats, status, options, guarded by its revision),
 * its exchanges, each exchange's log (whose unique place per event is the final guard between
 * processes) and huddle notes. One implementation over Sequelize and the event writer; one in
 * memory for tests of the master without a database or sockets.
 */
import type { Pattern } from '../../shared/analysis';
import type { HuddleNoteDto, TableStatus } from '../../shared/protocol';
import type { Seat } from '../../shared/seats';
import type { LogRecord } from '../../shared/table';
import type { StoredExchangeOptions, StoredSeats, StoredTableOptions } from '../db/models';
import { ExchangeEventRow, ExchangeRow, HuddleNoteRow, participantsKey, TableRow } from '../db/models';
import { EventNotStored, noEventWriter, type EventWriter } from '../db/event-writer';
import { OptimisticLockError, Op } from 'sequelize';
import { patternsForTable } from '../teaching/pattern-lists';
import { starterPatterns } from '../../shared/analysis';
import { STARTER_LIST_ID } from '../../shared/pattern-lists';

export type { StoredExchangeOptions, StoredSeats, StoredTableOptions };

/** A table row as plain data. */
export interface TableRecord {
  id: string;
  name: string;
  hostId: number;
  hostName: string;
  private: boolean;
  inviteCode: string | null;
  options: StoredTableOptions;
  status: TableStatus;
  seats: StoredSeats;
  currentExchangeId: string | null;
  /** Raised by every save; a save from an out-of-date copy is refused. */
  revision: number;
  createdAt: Date;
}

export type TableChanges = Partial<Pick<TableRecord, 'seats' | 'status' | 'currentExchangeId' | 'options'>>;
export type StoredRecord = LogRecord & { seq: number };
export type NewRecord = LogRecord & { exchangeId: string; seq: number; userId: number | null };
export interface StoredExchange {
  id: string;
  options: StoredExchangeOptions;
  records: StoredRecord[];
  notes: HuddleNoteDto[];
}
export interface NewExchange {
  id: string;
  tableId: string;
  tableName: string;
  hostId: number;
  options: StoredExchangeOptions;
  seats: StoredSeats;
  participantIds: number[];
}
export type NewNote = Omit<HuddleNoteDto, 'id' | 'createdAt' | 'authorName'> & { exchangeId: string; authorId: number; authorName: string };

export interface AppendHooks {
  /** Asked just before writing: false drops the record unwritten (its table has thrown its guesses away). */
  wanted?: () => boolean;
  /** Called once the record is stored, before any promise of its group settles. */
  stored?: () => void;
}

/** Why a write was refused. `conflict`: another process got there first (the log place or the row revision was taken). */
export class StoreRefused extends Error {
  constructor(
    message: string,
    readonly conflict: boolean,
  ) {
    super(message);
  }
}

export interface TableStore {
  table(id: string): Promise<TableRecord | null>;
  /** Tables with an exchange under way. */
  openTables(): Promise<TableRecord[]>;
  exchange(id: string): Promise<StoredExchange | null>;
  /** An exchange's records from place `seq` on, in order. */
  recordsFrom(exchangeId: string, seq: number): Promise<StoredRecord[]>;
  /** Appends one record at its place; a place already taken is refused as a conflict. Rejects with StoreRefused. */
  append(record: NewRecord, hooks: AppendHooks): Promise<void>;
  /** Saves changes made on `row`, refused as a conflict if the stored revision moved on; hands back the saved row. */
  saveTable(row: TableRecord, changes: TableChanges): Promise<TableRecord>;
  /** How many exchanges a table has dealt. */
  dealsDealt(tableId: string): Promise<number>;
  createExchange(exchange: NewExchange): Promise<void>;
  dropExchange(id: string): Promise<void>;
  finishExchange(id: string): Promise<void>;
  addNote(note: NewNote): Promise<HuddleNoteDto>;
  /** The patterns of a table's list, which its bots judge by. */
  patterns(listId: string | undefined): Promise<readonly Pattern[]>;
}

const plain = (row: TableRow) => row.get({ plain: true }) as TableRecord;
/** A live row instance as handed in by older callers, or a record already. */
const recordOf = (row: TableRecord) => (typeof (row as unknown as TableRow).get === 'function' ? plain(row as unknown as TableRow) : row);

function noteDto(row: HuddleNoteRow): HuddleNoteDto {
  return {
    id: row.id,
    passIndex: row.passIndex,
    phase: row.phase as HuddleNoteDto['phase'],
    seat: (row.seat as Seat | null) ?? null,
    authorName: row.authorName,
    text: row.text,
    createdAt: row.createdAt.toISOString(),
  };
}

const storedRecord = (e: ExchangeEventRow): StoredRecord => ({ seq: e.seq, type: e.type, seat: (e.seat as Seat | null) ?? null, payload: e.payload });

/** The store over the app's Sequelize models, with exchange events going through the grouped event writer (none: every append is refused). */
export function sequelizeTableStore(events: EventWriter = noEventWriter): TableStore {
  return {
    table: async (id) => {
      const row = await TableRow.findByPk(id);
      return row && plain(row);
    },
    openTables: async () => (await TableRow.findAll({ where: { status: 'playing' } })).map(plain),
    async exchange(id) {
      const row = await ExchangeRow.findByPk(id);
      if (!row) return null;
      const records = await ExchangeEventRow.findAll({ where: { exchangeId: id }, order: [['seq', 'ASC']] });
      const notes = await HuddleNoteRow.findAll({ where: { exchangeId: id }, order: [['id', 'ASC']] });
      return { id, options: row.options, records: records.map(storedRecord), notes: notes.map(noteDto) };
    },
    recordsFrom: async (exchangeId, seq) => (await ExchangeEventRow.findAll({ where: { exchangeId, seq: { [Op.gte]: seq } }, order: [['seq', 'ASC']] })).map(storedRecord),
    append: (record, hooks) =>
      events
        .append(
          { exchangeId: record.exchangeId, seq: record.seq, type: record.type, seat: record.seat, payload: record.payload === null ? null : JSON.stringify(record.payload), userId: record.userId, createdAt: new Date().toISOString() },
          hooks,
        )
        .catch((err: Error) => {
          throw new StoreRefused(err.message, err instanceof EventNotStored && err.conflict);
        }),
    async saveTable(row, changes) {
      const next = TableRow.build(recordOf(row), { isNewRecord: false, raw: true });
      next.set(changes);
      try {
        await next.save();
      } catch (err) {
        if (err instanceof OptimisticLockError) throw new StoreRefused(err.message, true);
        throw err;
      }
      return plain(next);
    },
    dealsDealt: (tableId) => ExchangeRow.count({ where: { tableId } }),
    async createExchange({ participantIds, ...exchange }) {
      await ExchangeRow.create({ ...exchange, participants: participantsKey(participantIds), status: 'playing', startedAt: new Date(), finishedAt: null });
    },
    async dropExchange(id) {
      await ExchangeRow.destroy({ where: { id } });
    },
    async finishExchange(id) {
      await ExchangeRow.update({ status: 'done', finishedAt: new Date() }, { where: { id } });
    },
    addNote: async (note) => noteDto(await HuddleNoteRow.create(note)),
    patterns: async (listId) => (await patternsForTable(listId)).patterns,
  };
}

/**
 * A store in memory, for tests: records are written in groups on the next turn like the event
 * writer's, a taken place is a conflict, and a row save from an old revision is refused. Two masters
 * on one memory store behave like two processes on one database. `failNextAppend` makes the next
 * group fail as a broken disk would.
 */
export class MemoryTableStore implements TableStore {
  readonly tables = new Map<string, TableRecord>();
  readonly exchanges = new Map<string, NewExchange & { status: 'playing' | 'done' }>();
  readonly logs = new Map<string, StoredRecord[]>();
  readonly notes: (HuddleNoteDto & { exchangeId: string })[] = [];
  readonly lists = new Map<string, Pattern[]>();
  failNextAppend = false;
  private waiting: { record: NewRecord; hooks: AppendHooks; done: (err?: Error) => void }[] = [];

  constructor(tables: TableRecord[] = []) {
    for (const table of tables) this.tables.set(table.id, structuredClone(table));
  }

  async table(id: string) {
    const row = this.tables.get(id);
    return row ? structuredClone(row) : null;
  }
  async openTables() {
    return [...this.tables.values()].filter((t) => t.status === 'playing').map((t) => structuredClone(t));
  }
  async exchange(id: string) {
    const row = this.exchanges.get(id);
    if (!row) return null;
    return { id, options: structuredClone(row.options), records: await this.recordsFrom(id, 0), notes: this.notes.filter((n) => n.exchangeId === id).map(({ exchangeId: _, ...n }) => n) };
  }
  async recordsFrom(exchangeId: string, seq: number) {
    return structuredClone((this.logs.get(exchangeId) ?? []).filter((r) => r.seq >= seq));
  }
  append(record: NewRecord, hooks: AppendHooks): Promise<void> {
    return new Promise<void>((resolve, reject) => {
      this.waiting.push({ record: structuredClone(record), hooks, done: (err) => (err ? reject(err) : resolve()) });
      if (this.waiting.length === 1) setImmediate(() => this.writeGroup());
    });
  }
  private writeGroup() {
    const group = this.waiting.splice(0);
    const broken = this.failNextAppend;
    this.failNextAppend = false;
    const failed = new Map<string, StoreRefused>();
    const errors = group.map(({ record, hooks }) => {
      const log = this.logs.get(record.exchangeId) ?? [];
      const error =
        (broken && new StoreRefused('The disk is failing.', false)) ||
        failed.get(record.exchangeId) ||
        (hooks.wanted && !hooks.wanted() && new StoreRefused('The table discarded this record before it was written.', false)) ||
        (log.some((r) => r.seq === record.seq) && new StoreRefused(`Place ${record.seq} of exchange ${record.exchangeId} is taken.`, true)) ||
        null;
      if (error) failed.set(record.exchangeId, error);
      else this.logs.set(record.exchangeId, [...log, { seq: record.seq, type: record.type, seat: record.seat, payload: record.payload }]);
      return error;
    });
    group.forEach((entry, i) => errors[i] === null && entry.hooks.stored?.());
    group.forEach((entry, i) => entry.done(errors[i] ?? undefined));
  }
  async saveTable(row: TableRecord, changes: TableChanges) {
    const changed = Object.entries(changes).some(([key, value]) => JSON.stringify(value) !== JSON.stringify(row[key as keyof TableRecord]));
    if (!changed) return row;
    const stored = this.tables.get(row.id);
    if (!stored || stored.revision !== row.revision) throw new StoreRefused('The row changed elsewhere.', true);
    const next = { ...structuredClone(stored), ...structuredClone(changes), revision: stored.revision + 1 };
    this.tables.set(row.id, next);
    return structuredClone(next);
  }
  async dealsDealt(tableId: string) {
    return [...this.exchanges.values()].filter((e) => e.tableId === tableId).length;
  }
  async createExchange(exchange: NewExchange) {
    this.exchanges.set(exchange.id, { ...structuredClone(exchange), status: 'playing' });
  }
  async dropExchange(id: string) {
    this.exchanges.delete(id);
  }
  async finishExchange(id: string) {
    const row = this.exchanges.get(id);
    if (row) row.status = 'done';
  }
  async addNote({ exchangeId, authorId: _, ...note }: NewNote) {
    const dto = { ...note, id: this.notes.length + 1, createdAt: new Date().toISOString() };
    this.notes.push({ ...dto, exchangeId });
    return structuredClone(dto);
  }
  async patterns(listId: string | undefined) {
    return (listId && listId !== STARTER_LIST_ID && this.lists.get(listId)) || starterPatterns;
  }
}

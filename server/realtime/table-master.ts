/**
 * The authority for one table in this process. It orders the table's work (one task at a time, a
 * p-queue of concurrency one), checks each command in a fixed order (dispatch.ts), applies it with
 * the table reducer (shared/table), stores it ahead of what anyone is shown (table-store.ts), then
 * tells the viewers (the `changed` hook; their views are table-views.ts). Storing ahead is
 * table-ahead.ts; who is away, the host's seat hand-off and bot delays are table-timers.ts.
 *
 * Longer than 300 lines because one table's work is one sequence read top to bottom: the queue,
 * the checked command, the reducer, the store (and the retry after a conflict), finishing an
 * exchange, and catching up with the store when another process moved the table.
 */
import { randomUUID } from 'node:crypto';
import PQueue from 'p-queue';
import type { Logger } from 'pino';
import { starterPatterns, type Pattern } from '../../shared/analysis';
import type { Action } from '../../shared/exchange/types';
import { SEATS, seatOfUser, type Seat } from '../../shared/seats';
import { botAction, dueEvent, foldLog, reduceTable, restoreExchange, type LogEvent, type Table, type TableEvent, type TableExchange } from '../../shared/table';
import type { EventWriter } from '../db/event-writer';
import { log } from '../log';
import { nextDealSeed } from '../services/deal-seed';
import { tableCounters } from './counters';
import { decide, TableError, type Plan, type TableCommand } from './dispatch';
import { StoredAhead } from './table-ahead';
import { sequelizeTableStore, StoreRefused, type StoredExchangeOptions, type TableChanges, type TableRecord, type TableStore } from './table-store';
import { TableTimers } from './table-timers';
import { stateFor, tableDto, type Member } from './table-views';

export { TableError, type TableCommand } from './dispatch';
export { notesFor, publicTableOptions, type Member } from './table-views';
export { defaultTableOptions } from '../../shared/table';

export interface MasterHooks {
  /**
   * Called after every change, once it is stored: the transport sends each viewer its view, and
   * tells the other processes (unless the change came from one of them: `fromPeer`).
   */
  changed(master: TableMaster, fromPeer?: boolean): void;
  botDelayMs: number;
  /** How long a seated player may be gone mid-exchange before a bot may take the seat, in ms. */
  seatGraceMs?: number;
  /** Where the table is kept; without one, the app's database, its events through `events` (without those, a table only read). */
  store?: TableStore;
  /** Where exchange events are stored, in groups (for the database store). */
  events?: EventWriter;
  logger?: Logger;
  /** How many moves one seat may make in one exchange before take-backs are refused (no limit by default). */
  movesPerExchange?: number;
}

export interface TablePosition {
  revision: number;
  exchangeId: string | null;
  seq: number;
}

/** Refusals that mean another process got there first: the table reloads, and the task is tried once more. */
const CONFLICTS = new Set(['LOG_CONFLICT', 'ROW_CONFLICT']);

/** Room for the events of one exchange inside a version number. */
const EVENTS_PER_REVISION = 100_000;

/** What a task hands back when it appended events: the promise that they are stored (the queue does not wait for it). */
type Appended = { stored: Promise<void> } | void;

export class TableMaster {
  exchange: TableExchange | null = null;
  /** User ids with at least one open socket at this table. */
  readonly connected = new Map<number, number>();
  spectators = 0;
  /**
   * Sockets at this table on other processes, as last counted (-1: not counted yet). While there
   * are none and this process has the table's sockets, it is the table's one owner: no other
   * process shows the table, so its changes need not be told to them.
   */
  remoteSockets = -1;
  /** The table's pattern list, which its bots judge by; loaded when an exchange starts or is rebuilt. */
  patterns: readonly Pattern[] = starterPatterns;
  /** The version last sent to the sockets, so one stored group gives each viewer one state. */
  sentVersion = -1;
  /** How many huddle notes the last states sent held: a note changes no version, yet must be sent. */
  sentNotes = -1;
  /** When the table was last asked for or worked on (ms since the epoch), so an idle one can leave memory. */
  lastUsed = Date.now();
  private readonly queue = new PQueue({ concurrency: 1 });
  private readonly store: TableStore;
  private readonly logger: Logger;
  private readonly ahead: StoredAhead;
  private readonly timers: TableTimers;
  /** Marking a finished exchange done, which the next task waits for. */
  private finishing: Promise<void> = Promise.resolve();
  private step = { key: '', version: 0 };

  constructor(
    public row: TableRecord,
    private hooks: MasterHooks,
  ) {
    this.store = hooks.store ?? sequelizeTableStore(hooks.events);
    this.logger = hooks.logger ?? log;
    const tell = () => hooks.changed(this);
    const ahead = { id: row.id, exchange: () => this.exchange, setExchange: (x: TableExchange) => (this.exchange = x), version: () => this.version, moved: () => this.noteStep(), announce: tell };
    this.ahead = new StoredAhead(ahead, this.store, this.logger);
    const timed = {
      id: row.id,
      row: () => this.row,
      hasExchange: () => this.exchange !== null,
      connected: this.connected,
      changed: tell,
      queue: (task: () => Promise<void>) => this.run(task),
      botMove: (seat: Seat) => this.botMove(seat),
      moveBot: (seat: Seat) => this.moveBot(seat),
      standIn: (seat: Seat) => this.saveRow({ seats: this.reduce({ type: 'bot', seat, strategy: 'advised' }).seats }),
    };
    this.timers = new TableTimers(timed, { botDelayMs: hooks.botDelayMs, seatGraceMs: hooks.seatGraceMs ?? 60_000, logger: this.logger });
  }

  /** Rebuilds the open exchange from its stored events (after a restart or leaving memory). */
  static async load(row: TableRecord, hooks: MasterHooks): Promise<TableMaster> {
    const master = new TableMaster(row, hooks);
    const stored = row.currentExchangeId ? await master.store.exchange(row.currentExchangeId) : null;
    if (stored) {
      master.exchange = restoreExchange(stored.id, stored.options, stored.records, stored.notes);
      master.ahead.showLive();
      master.patterns = await master.store.patterns(row.options.patternListId);
    }
    return master;
  }

  get id() {
    return this.row.id;
  }

  get noteCount(): number {
    return this.exchange?.notes.length ?? 0;
  }

  /**
   * Nothing about this table is under way in this process: no task queued, nothing waiting to be
   * stored or finished, no bot about to move, nobody at the table. Such a table can leave memory
   * and be read back from the database when it is next asked for.
   */
  get quiet(): boolean {
    const { ahead, queue } = this;
    return queue.size + queue.pending === 0 && ahead.pending === 0 && !ahead.broken && this.timers.bots.size === 0 && this.connected.size === 0 && this.spectators === 0;
  }

  /**
   * A table's version comes from what is stored: the row's revision and the number of events of
   * its exchange. Every process serving the table therefore gives the same state the same version,
   * and a client that moves to another process never takes a newer state there for an older one.
   */
  get version(): number {
    return (this.row.revision ?? 0) * EVENTS_PER_REVISION + (this.exchange?.seq ?? 0);
  }

  /** The version a viewer is shown: the live one once everything is stored. */
  get shownVersion(): number {
    return this.ahead.shownVersion;
  }

  /** Where this table's stored state stands, as told to the other processes. */
  get position(): TablePosition {
    return { revision: this.row.revision ?? 0, exchangeId: this.exchange?.id ?? null, seq: this.ahead.shownSeq };
  }

  seatOf(userId: number): Seat | null {
    return seatOfUser(this.row.seats, userId);
  }

  isHost(userId: number) {
    return this.row.hostId === userId;
  }

  /** When a seated player's last connection closed; a table read back after a restart counts from then. */
  awayTime(userId: number): number | null {
    return this.timers.awayTime(userId);
  }

  /** Called whenever who is connected changes (see TableTimers.presenceChanged). */
  presenceChanged(now = Date.now()) {
    this.timers.presenceChanged(now);
  }

  /** Lets every bot whose seat has something to do act, one after another, through the queue. */
  wakeBots() {
    this.timers.wakeBots();
  }

  // ───────────── commands ─────────────

  /**
   * Checks and carries out one command (see dispatch.ts for the order of checks); resolves once
   * what it changed is stored. If another process changed the table first (its event took the log
   * place, or its save raised the row's revision), the table has read the database again by the
   * time the command is tried once more, so the retry is checked against what is really stored. A
   * second conflict is refused.
   *
   * Why this is safe with several processes: an action counts only once its event row is stored,
   * and the unique key on (exchangeId, seq) lets exactly one row into each place, so two processes
   * can never both store an action at the same point of an exchange; whichever loses never acks,
   * never shows its guess, and rebuilds from the rows that did get in.
   */
  dispatch(command: TableCommand, member: Member, movesPerExchange = this.hooks.movesPerExchange ?? Infinity): Promise<void> {
    const once = () => this.run(() => this.execute(decide(command, member, this.situation(movesPerExchange)), member)).then((done) => done?.stored);
    return once().catch((err) => {
      if (!(err instanceof TableError && CONFLICTS.has(err.code))) throw err;
      tableCounters.retried += 1;
      return once();
    });
  }

  sit = (viewer: Member, seat: Seat) => this.dispatch({ type: 'table:sit', seat }, viewer);
  stand = (viewer: Member) => this.dispatch({ type: 'table:stand' }, viewer);
  seatBot = (viewer: Member, seat: Seat, strategy: string) => this.dispatch({ type: 'table:bot', seat, strategy }, viewer);
  start = (viewer: Member) => this.dispatch({ type: 'table:start' }, viewer);
  /** The host closes the table for good; it leaves every list, and its exchanges stay in history. */
  closeTable = (viewer: Member) => this.dispatch({ type: 'table:close' }, viewer);
  /** The host changes what players are shown, at any time: advice on or off. */
  setAdvice = (viewer: Member, hidden: boolean) => this.dispatch({ type: 'table:advice', hidden }, viewer);
  act = (viewer: Member, action: Action, version?: number, maxPerExchange?: number) => this.dispatch({ type: 'exchange:act', action, version }, viewer, maxPerExchange);
  callHuddle = (viewer: Member) => this.dispatch({ type: 'huddle:call' }, viewer);
  reveal = (viewer: Member, seat: Seat) => this.dispatch({ type: 'huddle:reveal', seat }, viewer);
  note = (viewer: Member, text: string, seat?: Seat) => this.dispatch({ type: 'huddle:note', text, seat }, viewer);
  release = (viewer: Member) => this.dispatch({ type: 'huddle:release' }, viewer);

  private table(): Table {
    return { status: this.row.status, seats: this.row.seats, exchange: this.exchange };
  }

  private situation(movesPerExchange: number) {
    return { table: this.table(), hostId: this.row.hostId, present: (userId: number) => this.connected.has(userId), graceLeft: (userId: number) => this.timers.graceLeft(userId), stepVersion: this.step.version, movesPerExchange };
  }

  /** The reducer, with a refusal as a TableError. */
  private reduce(event: TableEvent): Table {
    const result = reduceTable(this.table(), event);
    if (!result.ok) throw new TableError(result.code, result.message);
    return result.table;
  }

  private async execute(plan: Plan, member: Member): Promise<Appended> {
    switch (plan.kind) {
      case 'row': {
        const before = this.table();
        const next = this.reduce(plan.event);
        const changes: TableChanges = {};
        if (next.seats !== before.seats) changes.seats = next.seats;
        if (next.status !== before.status) changes.status = next.status;
        if (Object.keys(changes).length) await this.saveRow(changes);
        return;
      }
      case 'advice':
        if (this.row.options.hideAdvice !== plan.hidden) await this.saveRow({ options: { ...this.row.options, hideAdvice: plan.hidden } });
        return;
      case 'deal':
        return this.deal();
      case 'note': {
        const live = this.exchange!;
        const note = await this.store.addNote({ exchangeId: live.id, passIndex: live.state.history.length, phase: live.state.phase, seat: plan.seat, authorId: member.userId, authorName: member.displayName, text: plan.text });
        this.exchange = this.reduce({ type: 'huddle-note', note }).exchange;
        return;
      }
      case 'log':
        return this.logged(plan.event, member.userId);
    }
  }

  /** Applies one logged event and whatever it makes due; hands back the promise that all of it is stored. */
  private logged(event: LogEvent, userId: number | null): Appended {
    const next = this.reduce(event).exchange!;
    // Nothing changed (a seat shown again): answered once the last write is.
    if (next === this.exchange) return { stored: this.ahead.lastStored };
    const stored = [this.ahead.append(event, next, userId)];
    try {
      const settled = this.settle();
      if (settled) stored.push(settled);
    } catch (err) {
      // The event stands; a resolve that failed is tried again on the next action or restart.
      this.logger.error({ err, tableId: this.id }, 'the table could not settle after an event');
    }
    return this.finishIfDone(Promise.all(stored).then(() => undefined));
  }

  /** After a change: hold the pass in a huddle, or resolve it. Hands back the store of what it appended, if anything. */
  private settle(): Promise<void> | null {
    const event = this.exchange && dueEvent(this.exchange, this.row.options.huddleEveryPass);
    return event ? this.ahead.append(event, this.reduce(event).exchange!, null) : null;
  }

  private async deal() {
    const row = this.row;
    // The engine's seed comes from the seed name, where it holds, and how many deals this table dealt before.
    const { seed, seedName } = nextDealSeed(row, await this.store.dealsDealt(row.id));
    const { jokers, secondCharleston, courtesy, racks } = row.options;
    const options: StoredExchangeOptions = { seed, ...(seedName ? { seedName } : {}), jokers, secondCharleston, courtesy, ...(racks ? { racks } : {}) };
    const id = randomUUID();
    const next = this.reduce({ type: 'deal', exchangeId: id, options });
    this.patterns = await this.store.patterns(row.options.patternListId);
    const participantIds = SEATS.flatMap((seat) => {
      const o = row.seats[seat];
      return o?.kind === 'user' ? [o.userId] : [];
    });
    await this.store.createExchange({ id, tableId: row.id, tableName: row.name, hostId: row.hostId, options, seats: row.seats, participantIds });
    try {
      await this.saveRow({ status: 'playing', currentExchangeId: id });
    } catch (err) {
      // The table did not move to this exchange (another process changed it first): take the
      // exchange back, so it never shows as under way in history and the retry deals exactly one.
      // (Not one transaction: on SQLite it would hold the write lock while other writes wait.)
      await this.store.dropExchange(id).catch(() => undefined);
      throw err;
    }
    this.exchange = next.exchange;
    this.ahead.showLive();
  }

  /** The last resolve ended the exchange: once it is stored, mark the exchange and table done (before the next task). */
  private finishIfDone(stored: Promise<void>): { stored: Promise<void> } {
    const live = this.exchange;
    if (live?.state.phase !== 'done') return { stored };
    // The ack waits only for the store; the next task of this table waits for the finish too.
    this.finishing = stored
      .then(() => this.finish(live.id))
      .catch((err) => {
        if (!(err instanceof TableError)) this.logger.error({ err, tableId: this.id }, 'the table could not be marked done');
      });
    return { stored };
  }

  private async finish(exchangeId: string) {
    await this.store.finishExchange(exchangeId);
    try {
      await this.saveRow({ status: this.reduce({ type: 'finish' }).status });
      this.hooks.changed(this);
    } catch (err) {
      // Another process that serves this table marked it done first: nothing is lost.
      if (!(err instanceof TableError && err.code === 'ROW_CONFLICT')) throw err;
    }
  }

  // ───────────── ordering and storing ─────────────

  /** Runs `task` after every task queued before it: one action at a time per table. */
  private run<T>(task: () => Promise<T> | T): Promise<T> {
    this.lastUsed = Date.now();
    const next = this.queue.add(async () => {
      try {
        await this.finishing;
        if (this.ahead.broken) {
          await this.reload();
          await this.finishing;
        }
        return await task();
      } finally {
        this.lastUsed = Date.now();
        this.noteStep();
      }
    }) as Promise<T>;
    // A refusal is answered once what the table shows has caught up with what it checked against,
    // so the asker already holds the state that explains it.
    return next.catch(async (err) => {
      await this.ahead.lastWrite;
      throw err;
    });
  }

  /**
   * Saves row changes; views show them only once stored, when the saved row replaces this one. A
   * save refused because another process changed the row first (its revision moved on) is a
   * conflict; any other failure leaves the row as it was.
   */
  private async saveRow(changes: TableChanges) {
    try {
      this.row = await this.store.saveTable(this.row, changes);
    } catch (err) {
      this.ahead.broken = true;
      if (!(err instanceof StoreRefused && err.conflict)) throw err;
      throw new TableError('ROW_CONFLICT', 'The table changed elsewhere just now. Look at it again and retry.');
    }
  }

  /** Called after every task: remembers the table version at which the current step (phase and passes resolved) began. */
  private noteStep() {
    const live = this.exchange;
    const key = live ? `${live.id}:${live.state.phase}:${live.state.history.length}` : '';
    if (key !== this.step.key) this.step = { key, version: this.version };
  }

  // ───────────── reading the store again ─────────────

  /** After a failed write, or when another process moved the table on: read the row and the log again. */
  private async reload(fromPeer = false) {
    await this.ahead.lastWrite;
    tableCounters.rebuilt += 1;
    this.row = (await this.store.table(this.row.id)) ?? this.row;
    const stored = this.row.currentExchangeId ? await this.store.exchange(this.row.currentExchangeId) : null;
    if (stored) this.exchange = restoreExchange(stored.id, stored.options, stored.records, stored.notes);
    this.ahead.caughtUp();
    this.hooks.changed(this, fromPeer);
    await this.settleDue();
  }

  /**
   * Another process stored a change to this table: catch up from the store, then show it here.
   * New events of the same exchange on an unchanged row are read and folded on their own (one
   * query); anything else (a row change, another exchange, a note) reads the table again whole.
   */
  catchUp(told?: TablePosition & { whole?: boolean }): Promise<void> {
    return this.run(async () => {
      await this.ahead.lastWrite;
      const live = this.exchange;
      if (told && !told.whole && live && !this.ahead.broken && told.exchangeId === live.id && told.revision === (this.row.revision ?? 0)) {
        if (told.seq <= live.seq) return;
        const records = await this.store.recordsFrom(live.id, live.seq);
        try {
          if (records.some((r, i) => r.seq !== live.seq + i)) throw new Error('a gap in the log');
          this.exchange = foldLog(live, records);
          tableCounters.caughtUp += 1;
          this.ahead.showLive();
          this.hooks.changed(this, true);
          await this.settleDue();
          return;
        } catch {
          // Read it all again below.
        }
      }
      await this.reload(true);
    });
  }

  /** Finishes whatever the stored log left due (a resolve that a crash cut off). */
  resume() {
    return this.run(() => this.settleDue());
  }

  /** A process that stored a pass's last choice may have died before storing its resolve: settle what is due. */
  private async settleDue() {
    if (!this.exchange || this.row.status !== 'playing') return;
    try {
      // The last resolve is stored but the table was never marked done (a process died in between).
      if (this.exchange.state.phase === 'done') {
        this.finishIfDone(Promise.resolve());
        return;
      }
      const settled = this.settle();
      if (settled) await this.finishIfDone(settled).stored;
    } catch (err) {
      if (!(err instanceof TableError && CONFLICTS.has(err.code))) this.logger.error({ err, tableId: this.id }, 'the table could not settle after reading its log');
    }
  }

  // ───────────── bots, the end ─────────────

  private botMove(seat: Seat): Action | null {
    return botAction(this.table(), seat, this.patterns, this.row.options.botsPlaySecond);
  }

  private moveBot(seat: Seat): Promise<void> {
    return this.run(async (): Promise<Appended> => {
      const action = this.timers.botDue(seat) ? this.botMove(seat) : null;
      if (!action) return;
      try {
        return this.logged({ type: 'act', seat, action }, null);
      } catch (err) {
        this.logger.error({ err, tableId: this.id, seat }, 'a bot made a move the engine refused');
      }
    }).then((appended) => appended?.stored);
  }

  /** Resolves once every task queued so far has finished and its events are stored. */
  async idle(): Promise<void> {
    await this.run(() => undefined);
    await this.ahead.lastWrite;
    await this.finishing;
  }

  close() {
    this.timers.close();
  }

  // ───────────── views ─────────────

  tableDto(forUserId: number | null) {
    return tableDto(this.row, this, forUserId);
  }

  stateFor(viewer: Member) {
    return stateFor({ row: this.row, exchange: this.ahead.shownExchange(), version: this.shownVersion, presence: this }, viewer);
  }
}

/**
 * The authority for one table: it owns the table's seats, its current exchange and its huddle,
 * takes one action at a time, stores every accepted step before anyone hears of it, and hands
 * each viewer only what that viewer may see.
 *
 * Long because it still does all of that in one class (queue, storing ahead, conflict retries,
 * seats and hand-offs, huddle, bots, views). The next step splits it: what an event does into a
 * pure table reducer in shared/, storage behind a store interface, and the views apart.
 */
import { randomUUID } from 'node:crypto';
import { nextDealSeed } from '../services/deal-seed';
import { chooseBotAction, isBotStrategyId, BOT_STRATEGIES } from '../../shared/analysis/bots';
import { starterPatterns, type Pattern } from '../../shared/analysis';
import { STARTER_LIST_ID } from '../../shared/pattern-lists';
import { act, canResolve, createExchange, isPassPhase, rackOf, resolve, viewFor } from '../../shared/exchange';
import type { Action, ExchangeOptions, ExchangeState, Viewer } from '../../shared/exchange/types';
import type { HuddleNoteDto, SeatOccupant, SeatStateDto, TableDto, TableOptions, TableStateDto } from '../../shared/protocol';
import { SEATS, type Seat } from '../../shared/seats';
import { Op, OptimisticLockError } from 'sequelize';
import { ExchangeEventRow, ExchangeRow, HuddleNoteRow, participantsKey, TableRow, type EventType, type StoredExchangeOptions, type StoredSeats, type StoredTableOptions } from '../db/models';
import { patternsForTable } from '../teaching/pattern-source';
import { EventNotStored, type EventWriter } from '../db/event-writer';

export class TableError extends Error {
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

export interface Member {
  userId: number;
  displayName: string;
  as: 'player' | 'spectator';
  isAdmin: boolean;
}

interface Huddle {
  open: boolean;
  revealed: Seat[];
  /** The number of resolved passes when the last huddle opened, so each pass is held at most once automatically. */
  heldAt: number | null;
}

interface LiveExchange {
  id: string;
  options: ExchangeOptions;
  state: ExchangeState;
  seq: number;
  huddle: Huddle;
  notes: HuddleNoteDto[];
}

type StoredEvent = { type: EventType; seat: Seat | null; payload: unknown; userId: number | null };

/** What the table shows: the exchange as of its last stored event. */
interface Shown {
  exchangeId: string;
  seq: number;
  state: ExchangeState;
  huddle: Huddle;
  version: number;
}

/** What a queued task hands back: the promise that its events are stored (the queue does not wait for it). */
interface Appended {
  stored: Promise<void>;
}

const closedHuddle = (): Huddle => ({ open: false, revealed: [], heldAt: null });

export interface MasterHooks {
  /**
   * Called after every change, once it is stored: the transport sends each viewer its view, and
   * tells the other processes (unless the change came from one of them: `fromPeer`).
   */
  changed(master: TableMaster, fromPeer?: boolean): void;
  botDelayMs: number;
  /** How long a seated player may be gone mid-exchange before a bot may take the seat, in ms. */
  seatGraceMs?: number;
  /** Where exchange events are stored, in groups. */
  events: EventWriter;
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

export class TableMaster {
  exchange: LiveExchange | null = null;
  private queue: Promise<unknown> = Promise.resolve();
  private botTimers = new Map<Seat, NodeJS.Timeout>();
  private closed = false;
  /** User ids with at least one open socket at this table. */
  readonly connected = new Map<number, number>();
  spectators = 0;
  /** The table's pattern list, which its bots judge by; loaded when an exchange starts or is rebuilt. */
  patterns: readonly Pattern[] = starterPatterns;
  /**
   * The table runs ahead of its storage. A queued action is checked and applied to the in-memory
   * state at once, and its event is appended to the next group write; the next action of the table
   * may be checked against that state before the write returns. Nobody hears of an event before it
   * is stored: views are built from `shown`, the state as of the last stored event, and acks wait for
   * the store. If a write fails, everything after the last stored event is thrown away (`epoch`
   * moves on, so still-waiting events are dropped) and the next task rebuilds the table from its log.
   */
  private pending = 0;
  private shown: Shown | null = null;
  private epoch = 0;
  private broken = false;
  /** Whether the last thrown-away guesses lost their place to another process (so the actions behind them may be retried). */
  private lostToConflict = false;
  private lastWrite: Promise<void> = Promise.resolve();
  /** The same, but refused if that write was. */
  private lastStored: Promise<void> = Promise.resolve();
  /** Marking a finished exchange done, which the next task waits for. */
  private finishing: Promise<void> = Promise.resolve();
  /** The version last sent to the sockets, so one stored group gives each viewer one state. */
  sentVersion = -1;
  /** How many huddle notes the last states sent held: a note changes no version, yet must be sent. */
  sentNotes = -1;

  get noteCount(): number {
    return this.exchange?.notes.length ?? 0;
  }

  constructor(
    public row: TableRow,
    private hooks: MasterHooks,
  ) {}

  get id() {
    return this.row.id;
  }

  /** Tasks queued and not yet finished. */
  private tasks = 0;
  /** When the table was last asked for or worked on (ms since the epoch), so an idle one can leave memory. */
  lastUsed = Date.now();

  /**
   * Nothing about this table is under way in this process: no task queued, nothing waiting to be
   * stored or finished, no bot about to move, nobody at the table. Such a table can leave memory
   * and be read back from the database when it is next asked for.
   */
  get quiet(): boolean {
    return this.tasks === 0 && this.pending === 0 && this.botTimers.size === 0 && this.connected.size === 0 && this.spectators === 0 && !this.broken;
  }

  /** Runs `task` after every task queued before it: one action at a time per table. */
  run<T>(task: () => Promise<T> | T): Promise<T> {
    this.tasks += 1;
    this.lastUsed = Date.now();
    const next = this.queue
      .then(async () => {
        await this.finishing;
        if (this.broken) {
          await this.reload();
          await this.finishing;
        }
        return task();
      })
      .finally(() => {
        this.tasks -= 1;
        this.lastUsed = Date.now();
        this.noteStep();
      });
    this.queue = next.catch(() => undefined);
    // A refusal is answered once what the table shows has caught up with what it checked against,
    // so the asker already holds the state that explains it.
    return next.catch(async (err) => {
      await this.lastWrite;
      throw err;
    });
  }

  /** Rebuilds the open exchange from its stored events (after a restart). */
  static async load(row: TableRow, hooks: MasterHooks): Promise<TableMaster> {
    const master = new TableMaster(row, hooks);
    if (row.currentExchangeId) {
      const exchangeRow = await ExchangeRow.findByPk(row.currentExchangeId);
      if (exchangeRow) {
        const events = await ExchangeEventRow.findAll({ where: { exchangeId: exchangeRow.id }, order: [['seq', 'ASC']] });
        const notes = await HuddleNoteRow.findAll({ where: { exchangeId: exchangeRow.id }, order: [['id', 'ASC']] });
        master.exchange = rebuild(exchangeRow, events, notes.map(noteDto));
        master.showLive();
        master.patterns = (await patternsForTable(row.options.patternListId)).patterns;
      }
    }
    return master;
  }

  /** After a failed write, or when another process moved the table on: read the row and the log again. */
  private async reload(fromPeer = false) {
    await this.lastWrite;
    const row = await TableRow.findByPk(this.row.id);
    if (row) this.row = row;
    const exchangeRow = this.row.currentExchangeId ? await ExchangeRow.findByPk(this.row.currentExchangeId) : null;
    if (exchangeRow) {
      const events = await ExchangeEventRow.findAll({ where: { exchangeId: exchangeRow.id }, order: [['seq', 'ASC']] });
      const notes = await HuddleNoteRow.findAll({ where: { exchangeId: exchangeRow.id }, order: [['id', 'ASC']] });
      this.exchange = rebuild(exchangeRow, events, notes.map(noteDto));
    }
    this.pending = 0;
    this.broken = false;
    this.showLive();
    this.hooks.changed(this, fromPeer);
    await this.settleDue();
  }

  /** A process that stored a pass's last choice may have died before storing its resolve: settle what is due. */
  private async settleDue() {
    const live = this.exchange;
    if (!live || this.row.status !== 'playing') return;
    try {
      // The last resolve is stored but the table was never marked done (a process died in between).
      if (live.state.phase === 'done') {
        await this.finishIfDone(live, Promise.resolve());
        return;
      }
      const settled = this.settle(live);
      if (settled) await (await this.finishIfDone(live, settled)).stored;
    } catch (err) {
      if (!(err instanceof TableError && CONFLICTS.has(err.code))) console.error(`Table ${this.id} could not settle after reading its log`, err);
    }
  }

  /** Where this table's stored state stands, as told to the other processes. */
  get position(): TablePosition {
    const seq = (this.pending === 0 ? this.exchange?.seq : this.shown?.seq) ?? 0;
    return { revision: this.row.revision ?? 0, exchangeId: this.exchange?.id ?? null, seq };
  }

  /**
   * Another process stored a change to this table: catch up from the database, then show it here.
   * New events of the same exchange on an unchanged row are read and applied on their own (one
   * query); anything else (a row change, another exchange, a note) reads the table again whole.
   */
  catchUp(told?: TablePosition & { whole?: boolean }): Promise<void> {
    return this.run(async () => {
      await this.lastWrite;
      const live = this.exchange;
      if (told && !told.whole && live && !this.broken && told.exchangeId === live.id && told.revision === (this.row.revision ?? 0)) {
        if (told.seq <= live.seq) return;
        const events = await ExchangeEventRow.findAll({ where: { exchangeId: live.id, seq: { [Op.gte]: live.seq } }, order: [['seq', 'ASC']] });
        try {
          if (events.some((e, i) => e.seq !== live.seq + i)) throw new Error('a gap in the log');
          const next = fold(live.id, live.state, live.huddle, events);
          live.state = next.state;
          live.huddle = next.huddle;
          live.seq += events.length;
          this.showLive();
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

  /** Nothing is waiting to be stored: what the table holds is what it shows. */
  private showLive() {
    const live = this.exchange;
    this.shown = live ? { exchangeId: live.id, seq: live.seq, state: live.state, huddle: live.huddle, version: this.version } : null;
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
    return this.pending === 0 ? this.version : (this.shown?.version ?? this.version);
  }

  private shownExchange(): { id: string; state: ExchangeState; huddle: Huddle; notes: HuddleNoteDto[] } | null {
    const live = this.exchange;
    if (!live) return null;
    if (this.pending === 0 || !this.shown || this.shown.exchangeId !== live.id) return live;
    return { id: live.id, state: this.shown.state, huddle: this.shown.huddle, notes: live.notes };
  }

  // ───────────── who is asking ─────────────

  seatOf(userId: number): Seat | null {
    return SEATS.find((seat) => {
      const occupant = this.row.seats[seat];
      return occupant?.kind === 'user' && occupant.userId === userId;
    }) ?? null;
  }

  isHost(userId: number) {
    return this.row.hostId === userId;
  }

  private requireHost(viewer: Member) {
    if (!this.isHost(viewer.userId)) throw new TableError('NOT_HOST', 'Only the host of this table can do that.');
  }

  private requireExchange(): LiveExchange {
    if (this.row.status !== 'playing' || !this.exchange) throw new TableError('NOT_STARTED', 'No exchange is under way at this table.');
    return this.exchange;
  }

  private requireSeatChangesAllowed() {
    if (this.row.status === 'playing') throw new TableError('EXCHANGE_UNDER_WAY', 'Seats are fixed while an exchange is under way.');
  }

  // ───────────── seats and start ─────────────

  sit(viewer: Member, seat: Seat): Promise<void> {
    return this.retried(() => this.sitOnce(viewer, seat));
  }

  private sitOnce(viewer: Member, seat: Seat): Promise<void> {
    return this.run(async () => {
      if (viewer.as !== 'player') throw new TableError('SPECTATOR', 'You joined to watch. Join as a player to take a seat.');
      const warm = this.row.seats[seat];
      if (this.row.status === 'playing' && warm?.kind === 'bot' && warm.standsInFor?.userId === viewer.userId) {
        // Back from being away: the bot that kept this seat warm hands it back, rack and all.
        await this.saveRow({ seats: { ...this.row.seats, [seat]: { kind: 'user', userId: viewer.userId, displayName: warm.standsInFor.displayName } } });
        return;
      }
      this.requireSeatChangesAllowed();
      const occupant = this.row.seats[seat];
      if (occupant?.kind === 'user' && occupant.userId === viewer.userId) return;
      if (occupant) throw new TableError('SEAT_TAKEN', `The ${seat} seat is taken. Pick an empty seat.`);
      const seats = { ...this.row.seats };
      const current = this.seatOf(viewer.userId);
      if (current) seats[current] = null;
      seats[seat] = { kind: 'user', userId: viewer.userId, displayName: viewer.displayName };
      await this.saveRow({ seats });
    });
  }

  stand(viewer: Member): Promise<void> {
    return this.retried(() => this.standOnce(viewer));
  }

  private standOnce(viewer: Member): Promise<void> {
    return this.run(async () => {
      this.requireSeatChangesAllowed();
      const current = this.seatOf(viewer.userId);
      if (!current) throw new TableError('NOT_SEATED', 'You are not sitting at this table.');
      await this.saveRow({ seats: { ...this.row.seats, [current]: null } });
    });
  }

  seatBot(viewer: Member, seat: Seat, strategy: string): Promise<void> {
    return this.retried(() => this.seatBotOnce(viewer, seat, strategy));
  }

  private seatBotOnce(viewer: Member, seat: Seat, strategy: string): Promise<void> {
    return this.run(async () => {
      this.requireHost(viewer);
      if (!isBotStrategyId(strategy)) throw new TableError('BAD_INPUT', 'Unknown bot strategy.');
      const occupant = this.row.seats[seat];
      const info = BOT_STRATEGIES.find((s) => s.id === strategy)!;
      if (occupant?.kind === 'user') {
        // A player who is still here keeps the seat; one who left may be replaced once the grace time is over.
        if (this.row.status !== 'playing' || this.connected.has(occupant.userId)) {
          throw new TableError('SEAT_TAKEN', `${occupant.displayName} is sitting ${seat}. A bot can only replace a player who has left during an exchange.`);
        }
        const wait = this.graceLeft(occupant.userId);
        if (wait > 0) {
          throw new TableError('GRACE_TIME', `${occupant.displayName} may be back soon: a bot can take the ${seat} seat in ${Math.ceil(wait / 1000)} s.`);
        }
        await this.saveRow({ seats: { ...this.row.seats, [seat]: this.standIn(occupant, strategy, info.name) } });
        return;
      }
      await this.saveRow({ seats: { ...this.row.seats, [seat]: { kind: 'bot', strategy, displayName: `${info.name} (bot, ${seat})` } } });
    });
  }

  // ───────────── who is away ─────────────

  private awaySince = new Map<number, number>();
  private readonly loadedAt = Date.now();
  private handOffTimer: NodeJS.Timeout | null = null;

  private get seatGraceMs() {
    return this.hooks.seatGraceMs ?? 60_000;
  }

  /** When a seated player's last connection closed; a table read back after a restart counts from then. */
  awayTime(userId: number): number | null {
    if (this.connected.has(userId)) return null;
    return this.awaySince.get(userId) ?? this.loadedAt;
  }

  /** How long, in ms, until a bot may take this player's seat (0: now). */
  private graceLeft(userId: number, now = Date.now()): number {
    const since = this.awayTime(userId);
    return since === null ? 0 : Math.max(0, since + this.seatGraceMs - now);
  }

  private standIn(occupant: { userId: number; displayName: string }, strategy: string, name: string) {
    return { kind: 'bot' as const, strategy, displayName: `${name} (bot, for ${occupant.displayName})`, standsInFor: { userId: occupant.userId, displayName: occupant.displayName } };
  }

  /**
   * Called whenever who is connected changes: notes when seated players go and come back, and if
   * the host is the one gone mid-exchange, hands the host's seat to a bot once the grace time is
   * over (nobody else could), which the host takes back on return.
   */
  presenceChanged(now = Date.now()) {
    for (const seat of SEATS) {
      const o = this.row.seats[seat];
      if (o?.kind !== 'user') continue;
      if (this.connected.has(o.userId)) this.awaySince.delete(o.userId);
      else if (!this.awaySince.has(o.userId)) this.awaySince.set(o.userId, now);
    }
    if (this.handOffTimer) clearTimeout(this.handOffTimer);
    this.handOffTimer = null;
    const hostSeat = this.seatOf(this.row.hostId);
    if (this.closed || this.row.status !== 'playing' || !hostSeat || this.connected.has(this.row.hostId)) return;
    this.handOffTimer = setTimeout(() => {
      this.handOffTimer = null;
      this.run(async () => {
        const seat = this.seatOf(this.row.hostId);
        const o = seat ? this.row.seats[seat] : null;
        if (this.closed || !seat || o?.kind !== 'user' || this.row.status !== 'playing' || this.graceLeft(o.userId) > 0) return;
        await this.saveRow({ seats: { ...this.row.seats, [seat]: this.standIn(o, 'advised', 'Coach') } });
      })
        .then(() => this.hooks.changed(this))
        .catch((err) => console.error(`Table ${this.id}: handing the host's seat to a bot failed`, err));
    }, this.graceLeft(this.row.hostId, now));
    this.handOffTimer.unref?.();
  }

  start(viewer: Member): Promise<void> {
    return this.retried(() => this.startOnce(viewer));
  }

  private startOnce(viewer: Member): Promise<void> {
    return this.run(async () => {
      this.requireHost(viewer);
      if (this.row.status === 'playing') throw new TableError('EXCHANGE_UNDER_WAY', 'An exchange is already under way.');
      if (this.row.status === 'closed') throw new TableError('TABLE_CLOSED', 'This table is closed. Open a new table to deal again.');
      const empty = SEATS.filter((seat) => !this.row.seats[seat]);
      if (empty.length) throw new TableError('SEATS_EMPTY', `Fill every seat first (empty: ${empty.join(', ')}). Seat a bot in any seat nobody takes.`);
      // The engine's seed comes from the seed name, where it holds, and how many deals this table dealt before.
      const round = await ExchangeRow.count({ where: { tableId: this.row.id } });
      const { seed, seedName } = nextDealSeed(this.row, round);
      const options: StoredExchangeOptions = {
        seed,
        ...(seedName ? { seedName } : {}),
        jokers: this.row.options.jokers,
        secondCharleston: this.row.options.secondCharleston,
        courtesy: this.row.options.courtesy,
        ...(this.row.options.racks ? { racks: this.row.options.racks } : {}),
      };
      this.patterns = (await patternsForTable(this.row.options.patternListId)).patterns;
      const state = createExchange(options);
      const id = randomUUID();
      const participantIds = SEATS.flatMap((seat) => {
        const o = this.row.seats[seat];
        return o?.kind === 'user' ? [o.userId] : [];
      });
      await ExchangeRow.create({
        id,
        tableId: this.row.id,
        tableName: this.row.name,
        hostId: this.row.hostId,
        options,
        seats: this.row.seats,
        participants: participantsKey(participantIds),
        status: 'playing',
        startedAt: new Date(),
        finishedAt: null,
      });
      try {
        await this.saveRow({ status: 'playing', currentExchangeId: id });
      } catch (err) {
        // The table did not move to this exchange (another process changed it first): take the
        // exchange back, so it never shows as under way in history and the retry deals exactly one.
        // (Not one transaction: on SQLite it would hold the write lock while other writes wait.)
        await ExchangeRow.destroy({ where: { id } }).catch(() => undefined);
        throw err;
      }
      this.exchange = { id, options, state, seq: 0, huddle: closedHuddle(), notes: [] };
      this.showLive();
    });
  }

  /** The host closes the table for good; it leaves every list, and its exchanges stay in history. */
  closeTable(viewer: Member): Promise<void> {
    return this.retried(() => this.closeOnce(viewer));
  }

  private closeOnce(viewer: Member): Promise<void> {
    return this.run(async () => {
      this.requireHost(viewer);
      if (this.row.status === 'closed') return;
      if (this.row.status === 'playing') throw new TableError('EXCHANGE_UNDER_WAY', 'An exchange is under way. Close the table once it is over.');
      await this.saveRow({ status: 'closed' });
    });
  }

  /** The host changes what players are shown, at any time: advice on or off. */
  setAdvice(viewer: Member, hidden: boolean): Promise<void> {
    return this.retried(() => this.setAdviceOnce(viewer, hidden));
  }

  private setAdviceOnce(viewer: Member, hidden: boolean): Promise<void> {
    return this.run(async () => {
      this.requireHost(viewer);
      if (this.row.options.hideAdvice === hidden) return;
      await this.saveRow({ options: { ...this.row.options, hideAdvice: hidden } });
    });
  }

  // ───────────── the exchange ─────────────

  /**
   * One seat's action. If its place in the log turned out to be taken (another process stored an
   * event of this exchange first), the table has read its log again by the time the retry runs, and
   * the action is checked once more against that state: accepted if it still applies, refused if not.
   */
  act(viewer: Member, action: Action, version?: number, maxPerExchange = Infinity): Promise<void> {
    return this.retried(() => this.actOnce(viewer, action, version, maxPerExchange));
  }

  /**
   * Runs a table task, and once more if another process changed the table first (its event took
   * the log place, or its save raised the row's revision): by then the table has read the database
   * again, so the retry is checked against what is really stored. A second conflict is refused.
   *
   * Why this is safe with several processes: an action counts only once its event row is stored,
   * and the unique key on (exchangeId, seq) lets exactly one row into each place, so two processes
   * can never both store an action at the same point of an exchange; whichever loses never acks,
   * never shows its guess, and rebuilds from the rows that did get in. What it costs: nothing more
   * on one process; with others, one Redis message per stored group, one indexed read of the new
   * events on every other process holding the table, and on a lost place a reload of the table
   * (three reads) and the retry.
   */
  private retried(task: () => Promise<void>): Promise<void> {
    return task().catch((err) => {
      if (err instanceof TableError && CONFLICTS.has(err.code)) return task();
      throw err;
    });
  }

  private actOnce(viewer: Member, action: Action, version: number | undefined, maxPerExchange: number): Promise<void> {
    return this.run(async (): Promise<Appended> => {
      const seat = this.seatOf(viewer.userId);
      if (!seat || viewer.as !== 'player') throw new TableError('NOT_SEATED', 'Take a seat at this table to play.');
      const live = this.requireExchange();
      // A log grows only as far as real play takes it: a whole exchange is a few dozen moves a seat.
      // Past the budget only take-backs are refused, so a seat can always still commit its choice.
      if (action.type === 'withdraw' && live.state.log.reduce((n, e) => n + ('seat' in e && e.seat === seat ? 1 : 0), 0) >= maxPerExchange) {
        throw new TableError('TOO_MANY_MOVES', `Your seat has made ${maxPerExchange} moves in this exchange, far more than a Charleston needs, so choices can no longer be taken back. Commit your pass and let the table go on.`);
      }
      // Only a move to another step makes a choice stale: other seats committing meanwhile does not.
      if (version !== undefined && version < this.stepVersion()) {
        throw new TableError('STALE', 'The table moved on while you were choosing. Look again and resend.');
      }
      return this.applyAct(live, seat, action, viewer.userId);
    }).then(({ stored }) => stored);
  }

  /** Checks and applies one action, then whatever it makes due; hands back the promise that all of it is stored. */
  private async applyAct(live: LiveExchange, seat: Seat, action: Action, userId: number | null): Promise<Appended> {
    const result = act(live.state, seat, action);
    if (!result.ok) throw new TableError(result.code, result.message);
    const stored = [this.append(live, { type: 'act', seat, payload: action, userId }, result.state, live.huddle)];
    try {
      const settled = this.settle(live);
      if (settled) stored.push(settled);
    } catch (err) {
      // The action stands; a resolve that failed is tried again on the next action or restart.
      console.error(`Table ${this.id} could not settle after an action`, err);
    }
    return this.finishIfDone(live, Promise.all(stored).then(() => undefined));
  }

  /** The last resolve ended the exchange: once it is stored, mark the exchange and table done (inside the queue). */
  private async finishIfDone(live: LiveExchange, stored: Promise<void>): Promise<Appended> {
    if (live.state.phase !== 'done') return { stored };
    // The ack waits only for the store; the next task of this table waits for the finish too.
    this.finishing = stored
      .then(() => this.finish(live))
      .catch((err) => {
        if (!(err instanceof TableError)) console.error(`Table ${this.id} could not be marked done`, err);
      });
    return { stored };
  }

  /** Finishes whatever the stored log left due (a resolve that a crash cut off). */
  resume() {
    return this.run(() => this.settleDue());
  }

  /** After a change: hold the pass in a huddle, or resolve it. Hands back the store of what it appended, if anything. */
  private settle(live: LiveExchange): Promise<void> | null {
    const { state, huddle } = live;
    if (!canResolve(state) || huddle.open) return null;
    const passIndex = state.history.length;
    if (this.row.options.huddleEveryPass && isPassPhase(state.phase) && huddle.heldAt !== passIndex) {
      return this.append(live, { type: 'huddle-call', seat: null, payload: { auto: true }, userId: null }, state, { open: true, revealed: [], heldAt: passIndex });
    }
    const resolved = resolve(state);
    if (!resolved.ok) throw new TableError(resolved.code, resolved.message);
    return this.append(live, { type: 'resolve', seat: null, payload: null, userId: null }, resolved.state, { ...live.huddle, revealed: [] });
  }

  private async finish(live: LiveExchange) {
    await ExchangeRow.update({ status: 'done', finishedAt: new Date() }, { where: { id: live.id } });
    try {
      await this.saveRow({ status: 'done' });
      this.hooks.changed(this);
    } catch (err) {
      // Another process that serves this table marked it done first: nothing is lost.
      if (!(err instanceof TableError && err.code === 'ROW_CONFLICT')) throw err;
    }
  }

  // ───────────── the huddle ─────────────

  callHuddle(viewer: Member): Promise<void> {
    return this.retried(() => this.callHuddleOnce(viewer));
  }

  private callHuddleOnce(viewer: Member): Promise<void> {
    return this.run(async (): Promise<Appended> => {
      this.requireHost(viewer);
      const live = this.requireExchange();
      if (!isPassPhase(live.state.phase)) throw new TableError('WRONG_PHASE', 'A huddle holds a pass; call it while the table is choosing tiles.');
      if (live.huddle.open) throw new TableError('HUDDLE_OPEN', 'This pass is already held.');
      return { stored: this.append(live, { type: 'huddle-call', seat: null, payload: { auto: false }, userId: viewer.userId }, live.state, { open: true, revealed: [], heldAt: live.state.history.length }) };
    }).then(({ stored }) => stored);
  }

  reveal(viewer: Member, seat: Seat): Promise<void> {
    return this.retried(() => this.revealOnce(viewer, seat));
  }

  private revealOnce(viewer: Member, seat: Seat): Promise<void> {
    return this.run(async (): Promise<Appended> => {
      this.requireHost(viewer);
      const live = this.requireExchange();
      if (!live.huddle.open) throw new TableError('NO_HUDDLE', 'Call a huddle first: seats are shown only while a pass is held.');
      if (live.huddle.revealed.includes(seat)) return { stored: this.lastStored };
      return { stored: this.append(live, { type: 'huddle-reveal', seat, payload: null, userId: viewer.userId }, live.state, { ...live.huddle, revealed: [...live.huddle.revealed, seat] }) };
    }).then(({ stored }) => stored);
  }

  note(viewer: Member, text: string, seat?: Seat) {
    return this.run(async () => {
      this.requireHost(viewer);
      const live = this.requireExchange();
      const row = await HuddleNoteRow.create({
        exchangeId: live.id,
        passIndex: live.state.history.length,
        phase: live.state.phase,
        seat: seat ?? null,
        authorId: viewer.userId,
        authorName: viewer.displayName,
        text,
      });
      live.notes = [...live.notes, noteDto(row)];
    });
  }

  release(viewer: Member): Promise<void> {
    return this.retried(() => this.releaseOnce(viewer));
  }

  private releaseOnce(viewer: Member): Promise<void> {
    return this.run(async (): Promise<Appended> => {
      this.requireHost(viewer);
      const live = this.requireExchange();
      if (!live.huddle.open) throw new TableError('NO_HUDDLE', 'No huddle is open.');
      const stored = [this.append(live, { type: 'huddle-release', seat: null, payload: null, userId: viewer.userId }, live.state, { ...live.huddle, open: false, revealed: [] })];
      const settled = this.settle(live);
      if (settled) stored.push(settled);
      return this.finishIfDone(live, Promise.all(stored).then(() => undefined));
    }).then(({ stored }) => stored);
  }

  // ───────────── storage ─────────────

  /**
   * Moves the exchange on to `state` and `huddle` and appends the event that does so at the next
   * position of its log. The returned promise settles when the event is stored (or refused); only
   * then is the new state shown to anyone.
   */
  private append(live: LiveExchange, event: StoredEvent, state: ExchangeState, huddle: Huddle): Promise<void> {
    if (this.pending === 0) this.showLive();
    live.state = state;
    live.huddle = huddle;
    const seq = live.seq;
    live.seq += 1;
    this.noteStep();
    const snapshot: Shown = { exchangeId: live.id, seq: live.seq, state, huddle, version: this.version };
    const epoch = this.epoch;
    this.pending += 1;
    const stored = this.hooks.events.append(
      { exchangeId: live.id, seq, type: event.type, seat: event.seat, payload: event.payload === null ? null : JSON.stringify(event.payload), userId: event.userId, createdAt: new Date().toISOString() },
      {
        wanted: () => epoch === this.epoch,
        stored: () => {
          if (epoch !== this.epoch) return;
          this.pending -= 1;
          this.shown = snapshot;
          this.announce();
        },
      },
    );
    const guarded = stored.catch((err: Error) => {
      const conflict = err instanceof EventNotStored && err.conflict;
      if (epoch === this.epoch) {
        // Throw away every guess after the last stored event: the table goes back to what it last
        // showed (so nothing unstored is shown meanwhile), and the next task reads the log again.
        this.epoch += 1;
        this.pending = 0;
        this.broken = true;
        const shown = this.shown;
        if (shown && this.exchange && shown.exchangeId === this.exchange.id) {
          this.exchange.state = shown.state;
          this.exchange.huddle = shown.huddle;
          this.exchange.seq = shown.seq;
          this.noteStep();
        }
        this.lostToConflict = conflict;
        // Another process storing first is expected when several serve one table; anything else is not.
        if (!conflict) console.error(`Table ${this.id}: an event was not stored, so the table reloads its log`, err.message);
      }
      // An event dropped because an earlier guess lost its place is behind for the same reason.
      if (conflict || (epoch !== this.epoch && this.lostToConflict)) {
        throw new TableError('LOG_CONFLICT', 'The table moved on elsewhere before that move was stored. Look at the table again and resend it.');
      }
      throw new TableError('NOT_STORED', 'Rackside could not store that move. Look at the table again and resend it.');
    });
    this.lastStored = guarded;
    this.lastWrite = guarded.catch(() => undefined);
    return guarded;
  }

  private announcing = false;

  /** One notice per stored group: every event of the group is marked stored before the viewers hear. */
  private announce() {
    if (this.announcing) return;
    this.announcing = true;
    queueMicrotask(() => {
      this.announcing = false;
      try {
        this.hooks.changed(this);
      } catch (err) {
        console.error(`Table ${this.id}: telling the viewers of a stored change failed`, err);
      }
    });
  }

  /**
   * Saves row changes from a copy, so views show the change only once it is stored; the copy
   * replaces the row after the save. A save refused because another process changed the row
   * first (its revision moved on) is a conflict; any other failure leaves the row as it was.
   */
  private async saveRow(changes: Partial<Pick<TableRow, 'seats' | 'status' | 'currentExchangeId' | 'options'>>) {
    const next = TableRow.build(this.row.get({ plain: true }), { isNewRecord: false, raw: true });
    next.set(changes);
    try {
      await next.save();
      this.row = next;
    } catch (err) {
      this.broken = true;
      if (!(err instanceof OptimisticLockError)) throw err;
      throw new TableError('ROW_CONFLICT', 'The table changed elsewhere just now. Look at it again and retry.');
    }
  }

  // ───────────── bots ─────────────

  /** Lets every bot whose seat has something to do act, one after another, through the queue. */
  wakeBots() {
    const live = this.exchange;
    if (this.closed || !live || this.row.status !== 'playing') return;
    for (const seat of SEATS) {
      const occupant = this.row.seats[seat];
      if (occupant?.kind !== 'bot' || this.botTimers.has(seat)) continue;
      if (!this.botMove(live, seat, occupant.strategy)) continue;
      const timer = setTimeout(() => {
        this.run(async () => {
          this.botTimers.delete(seat);
          const now = this.exchange;
          const bot = this.row.seats[seat];
          if (this.closed || !now || bot?.kind !== 'bot' || this.row.status !== 'playing') return null;
          const action = this.botMove(now, seat, bot.strategy);
          if (!action) return null;
          try {
            return await this.applyAct(now, seat, action, null);
          } catch (err) {
            console.error(`Bot at ${seat} of table ${this.id} made a move the engine refused`, err);
            return null;
          }
        })
          .then((appended) => appended?.stored)
          .catch((err) => console.error(`A bot's move at table ${this.id} was not stored`, err));
      }, this.hooks.botDelayMs);
      this.botTimers.set(seat, timer);
    }
  }

  /**
   * What a bot does now, if anything. In the vote, bots wait until every person at the table has
   * voted (so nobody is skipped past the vote by a bot's instant stop), and on a table set so, they
   * always vote for the second Charleston.
   */
  private botMove(live: LiveExchange, seat: Seat, strategy: string): Action | null {
    if (live.state.phase === 'vote') {
      const people = SEATS.filter((s) => this.row.seats[s]?.kind === 'user');
      if (people.some((s) => live.state.votes[s] === undefined)) return null;
      if (this.row.options.botsPlaySecond) return live.state.votes[seat] === undefined ? { type: 'vote', stop: false } : null;
    }
    return chooseBotAction(strategy as never, viewFor(live.state, seat), this.patterns, `${live.id}:${seat}`);
  }

  private step = { key: '', version: 0 };

  /** Called after every task: remembers the table version at which the current step (phase and passes resolved) began. */
  private noteStep() {
    const live = this.exchange;
    const key = live ? `${live.id}:${live.state.phase}:${live.state.history.length}` : '';
    if (key !== this.step.key) this.step = { key, version: this.version };
  }

  private stepVersion(): number {
    return this.step.version;
  }

  /** Resolves once every task queued so far has finished and its events are stored. */
  async idle(): Promise<void> {
    await this.run(() => undefined);
    await this.lastWrite;
    await this.finishing;
  }

  close() {
    this.closed = true;
    if (this.handOffTimer) clearTimeout(this.handOffTimer);
    this.botTimers.forEach((t) => clearTimeout(t));
    this.botTimers.clear();
  }

  // ───────────── views ─────────────

  occupantDto(seat: Seat): SeatOccupant | null {
    const o = this.row.seats[seat];
    if (!o) return null;
    if (o.kind === 'bot') return o;
    const since = this.row.status === 'playing' ? this.awayTime(o.userId) : null;
    return { ...o, connected: this.connected.has(o.userId), awaySince: since === null ? null : new Date(since).toISOString() };
  }

  tableDto(forUserId: number | null): TableDto {
    const row = this.row;
    return {
      id: row.id,
      name: row.name,
      hostId: row.hostId,
      hostName: row.hostName,
      private: row.private,
      status: row.status,
      options: publicTableOptions(row.options, forUserId === row.hostId),
      seats: Object.fromEntries(SEATS.map((s) => [s, this.occupantDto(s)])) as TableDto['seats'],
      ...(forUserId === row.hostId && row.inviteCode ? { inviteCode: row.inviteCode } : {}),
      currentExchangeId: row.currentExchangeId,
      createdAt: row.createdAt.toISOString(),
    };
  }

  /** Which engine view a viewer gets. */
  viewerKind(viewer: Member): Viewer {
    const seat = viewer.as === 'player' ? this.seatOf(viewer.userId) : null;
    const live = this.shownExchange();
    if (live && live.state.phase === 'done' && (seat || this.isHost(viewer.userId))) return 'replay';
    if (this.isHost(viewer.userId) && this.row.options.teaching) return 'host';
    return seat ?? 'spectator';
  }

  stateFor(viewer: Member): TableStateDto {
    const live = this.shownExchange();
    const mySeat = viewer.as === 'player' ? this.seatOf(viewer.userId) : null;
    const view = live ? viewFor(live.state, this.viewerKind(viewer)) : null;
    const seats = Object.fromEntries(
      SEATS.map((seat): [Seat, SeatStateDto] => [
        seat,
        { occupant: this.occupantDto(seat), committed: view?.seats[seat].committed ?? false, rackSize: view?.seats[seat].rackSize ?? 0 },
      ]),
    ) as Record<Seat, SeatStateDto>;
    const revealed: TableStateDto['huddle']['revealed'] = {};
    if (live?.huddle.open) {
      for (const seat of live.huddle.revealed) revealed[seat] = { rack: rackOf(live.state, seat), pass: live.state.pending[seat] ?? null };
    }
    return {
      tableId: this.row.id,
      name: this.row.name,
      version: this.shownVersion,
      phase: live ? live.state.phase : 'lobby',
      status: this.row.status,
      hostId: this.row.hostId,
      isHost: this.isHost(viewer.userId),
      mySeat,
      myRack: mySeat && live ? rackOf(live.state, mySeat) : [],
      seats,
      options: publicTableOptions(this.row.options, this.isHost(viewer.userId)),
      exchangeId: live?.id ?? null,
      view,
      huddle: { open: live?.huddle.open ?? false, revealed, notes: live ? notesFor(live.notes, this.isHost(viewer.userId) ? 'host' : this.viewerKind(viewer)) : [] },
      spectators: this.spectators,
      ...(this.isHost(viewer.userId) && this.row.inviteCode ? { inviteCode: this.row.inviteCode } : {}),
    };
  }
}

/**
 * A note for the whole table is everyone's as it is written. A note on one seat is coaching for
 * that seat: its player and the host see it at once, everyone else in the replay once the
 * exchange is done (it may speak of that seat's tiles).
 */
export function notesFor(notes: readonly HuddleNoteDto[], viewer: Viewer): HuddleNoteDto[] {
  if (viewer === 'host' || viewer === 'replay') return [...notes];
  return notes.filter((n) => n.seat === null || n.seat === viewer);
}

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

/** Folds stored events back into a live exchange: the same function serves restarts and checks. */
export function rebuild(row: ExchangeRow, events: ExchangeEventRow[], notes: HuddleNoteDto[]): LiveExchange {
  const { state, huddle } = fold(row.id, createExchange(row.options), closedHuddle(), events);
  return { id: row.id, options: row.options, state, seq: events.length, huddle, notes };
}

/** Applies stored events, in order, to an exchange and its huddle. */
function fold(exchangeId: string, from: ExchangeState, fromHuddle: Huddle, events: ExchangeEventRow[]): { state: ExchangeState; huddle: Huddle } {
  let state = from;
  let huddle = fromHuddle;
  for (const event of events) {
    switch (event.type) {
      case 'act': {
        const result = act(state, event.seat as Seat, event.payload as Action);
        if (!result.ok) throw new Error(`Stored event ${event.seq} of exchange ${exchangeId} no longer applies: ${result.message}`);
        state = result.state;
        break;
      }
      case 'resolve': {
        const result = resolve(state);
        if (!result.ok) throw new Error(`Stored resolve ${event.seq} of exchange ${exchangeId} no longer applies: ${result.message}`);
        state = result.state;
        huddle = { ...huddle, revealed: [] };
        break;
      }
      case 'huddle-call':
        huddle = { open: true, revealed: [], heldAt: state.history.length };
        break;
      case 'huddle-reveal':
        huddle = { ...huddle, revealed: [...huddle.revealed, event.seat as Seat] };
        break;
      case 'huddle-release':
        huddle = { ...huddle, open: false, revealed: [] };
        break;
    }
  }
  return { state, huddle };
}

/**
 * What a viewer sees of a table's options: a drill's preset racks stay on the server, and only
 * the host sees the seed (with the seed and the public engine anyone could work out every rack).
 */
export function publicTableOptions(options: StoredTableOptions, isHost: boolean): TableOptions {
  const { racks: _racks, dealScope: _scope, ...rest } = options;
  if (isHost || rest.seed === null) return rest;
  return { ...rest, seed: null, seedHidden: true };
}

export function defaultTableOptions(input: Partial<TableOptions> = {}): TableOptions {
  return {
    seed: input.seed ?? null,
    jokers: input.jokers ?? true,
    secondCharleston: input.secondCharleston ?? true,
    courtesy: input.courtesy ?? true,
    huddleEveryPass: input.huddleEveryPass ?? false,
    teaching: input.teaching ?? false,
    hideAdvice: input.hideAdvice ?? false,
    botsPlaySecond: input.botsPlaySecond ?? false,
    patternListId: input.patternListId ?? STARTER_LIST_ID,
  };
}

export type { StoredSeats };

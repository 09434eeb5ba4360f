/**
 * A table runs ahead of its storage. A queued action is checked and applied to the in-memory
 * state at once, and its event is appended to the store's next group write; the next action of
 * the table may be checked against that state before the write returns. Nobody hears of an event
 * before it is stored: views are built from `shown`, the state as of the last stored event, and
 * acks wait for the store. If a write fails, everything after the last stored event is thrown away
 * (`epoch` moves on, so still-waiting events are dropped) and the table is `broken` until its next
 * task reads the log again.
 */
import type { Logger } from 'pino';
import { toRecord, type LogEvent, type TableExchange } from '../../shared/table';
import { TableError } from './dispatch';
import { StoreRefused, type TableStore } from './table-store';

/** What storing ahead reads and moves of its table. */
export interface AheadTable {
  readonly id: string;
  exchange(): TableExchange | null;
  setExchange(next: TableExchange): void;
  version(): number;
  /** The exchange moved on or went back: the table notes where its step stands. */
  moved(): void;
  /** A stored group is in: tell the viewers (once per group). */
  announce(): void;
}

export class StoredAhead {
  /** Events appended and not yet stored. */
  pending = 0;
  /** The exchange as of the last stored event, and its version. */
  shown: { exchange: TableExchange; version: number } | null = null;
  broken = false;
  private epoch = 0;
  /** Whether the last thrown-away guesses lost their place to another process (so the actions behind them may be retried). */
  private lostToConflict = false;
  /** Settles when the last appended event is written or refused. */
  lastWrite: Promise<void> = Promise.resolve();
  /** The same, but refused if that write was. */
  lastStored: Promise<void> = Promise.resolve();
  private announcing = false;

  constructor(
    private readonly table: AheadTable,
    private readonly store: TableStore,
    private readonly logger: Logger,
  ) {}

  /** Nothing is waiting to be stored: what the table holds is what it shows. */
  showLive() {
    const live = this.table.exchange();
    this.shown = live ? { exchange: live, version: this.table.version() } : null;
  }

  /** The table was read again from the store: nothing is ahead any more. */
  caughtUp() {
    this.pending = 0;
    this.broken = false;
    this.showLive();
  }

  /** The exchange as it may be shown (its notes are always the live ones: they take no place in the log). */
  shownExchange(): TableExchange | null {
    const live = this.table.exchange();
    if (this.pending === 0 || !this.shown || !live || this.shown.exchange.id !== live.id) return live;
    return { ...this.shown.exchange, notes: live.notes };
  }

  get shownVersion(): number {
    return this.pending === 0 ? this.table.version() : (this.shown?.version ?? this.table.version());
  }

  get shownSeq(): number {
    return (this.pending === 0 ? this.table.exchange()?.seq : this.shown?.exchange.seq) ?? 0;
  }

  /**
   * Moves the exchange on to `next` and appends the event that does so at the next place of its
   * log. The returned promise settles when the event is stored (or refused); only then is the new
   * state shown to anyone.
   */
  append(event: LogEvent, next: TableExchange, userId: number | null): Promise<void> {
    if (this.pending === 0) this.showLive();
    this.table.setExchange(next);
    this.table.moved();
    const snapshot = { exchange: next, version: this.table.version() };
    const epoch = this.epoch;
    this.pending += 1;
    const stored = this.store.append(
      { exchangeId: next.id, seq: next.seq - 1, userId, ...toRecord(event) },
      {
        wanted: () => epoch === this.epoch,
        stored: () => {
          if (epoch !== this.epoch) return;
          this.pending -= 1;
          this.shown = snapshot;
          this.tell();
        },
      },
    );
    const guarded = stored.catch((err: Error) => {
      const conflict = err instanceof StoreRefused && err.conflict;
      if (epoch === this.epoch) this.throwAway(err, conflict);
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

  /**
   * Throws away every guess after the last stored event: the table goes back to what it last
   * showed (so nothing unstored is shown meanwhile), and its next task reads the log again.
   */
  private throwAway(err: Error, conflict: boolean) {
    this.epoch += 1;
    this.pending = 0;
    this.broken = true;
    const shown = this.shown;
    const live = this.table.exchange();
    if (shown && live && shown.exchange.id === live.id) {
      this.table.setExchange({ ...shown.exchange, notes: live.notes });
      this.table.moved();
    }
    this.lostToConflict = conflict;
    // Another process storing first is expected when several serve one table; anything else is not.
    if (!conflict) this.logger.error({ tableId: this.table.id, error: err.message }, 'an event was not stored, so the table reloads its log');
  }

  /** One notice per stored group: every event of the group is marked stored before the viewers hear. */
  private tell() {
    if (this.announcing) return;
    this.announcing = true;
    queueMicrotask(() => {
      this.announcing = false;
      try {
        this.table.announce();
      } catch (err) {
        this.logger.error({ err, tableId: this.table.id }, 'telling the viewers of a stored change failed');
      }
    });
  }
}

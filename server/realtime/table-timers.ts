/**
 * A table's timed work: who is away and since when, the host's seat handed to a bot once the grace
 * time is over, and each bot's next move after its delay. Every piece of it runs through the
 * table's queue, like any command.
 */
import type { Logger } from 'pino';
import type { Action } from '../../shared/exchange/types';
import { SEATS, seatOfUser, type Seat } from '../../shared/seats';
import type { TableRecord } from './table-store';

/** What the timers read of their table and ask it to do. */
export interface TimedTable {
  readonly id: string;
  row(): TableRecord;
  hasExchange(): boolean;
  readonly connected: ReadonlyMap<number, number>;
  /** Queues work behind the table's other tasks. */
  queue(task: () => Promise<void>): Promise<void>;
  /** What the bot at `seat` would do now, if anything. */
  botMove(seat: Seat): Action | null;
  /** Queues that bot's move; resolves once it is stored. */
  moveBot(seat: Seat): Promise<void>;
  /** Hands this seat to a Coach bot that keeps it warm for its player. */
  standIn(seat: Seat): Promise<void>;
  changed(): void;
}

export interface TimerSettings {
  botDelayMs: number;
  /** How long a seated player may be gone mid-exchange before a bot may take the seat, in ms. */
  seatGraceMs: number;
  logger: Logger;
}

export class TableTimers {
  readonly bots = new Map<Seat, NodeJS.Timeout>();
  private awaySince = new Map<number, number>();
  private readonly loadedAt = Date.now();
  private handOffTimer: NodeJS.Timeout | null = null;
  private closed = false;

  constructor(
    private readonly table: TimedTable,
    private readonly settings: TimerSettings,
  ) {}

  /** When a seated player's last connection closed; a table read back after a restart counts from then. */
  awayTime(userId: number): number | null {
    if (this.table.connected.has(userId)) return null;
    return this.awaySince.get(userId) ?? this.loadedAt;
  }

  /** How long, in ms, until a bot may take this player's seat (0: now). */
  graceLeft(userId: number, now = Date.now()): number {
    const since = this.awayTime(userId);
    return since === null ? 0 : Math.max(0, since + this.settings.seatGraceMs - now);
  }

  private get playing() {
    return !this.closed && this.table.row().status === 'playing';
  }

  /**
   * Called whenever who is connected changes: notes when seated players go and come back, and if
   * the host is the one gone mid-exchange, hands the host's seat to a bot once the grace time is
   * over (nobody else could), which the host takes back on return.
   */
  presenceChanged(now = Date.now()) {
    const { connected } = this.table;
    const row = this.table.row();
    for (const seat of SEATS) {
      const o = row.seats[seat];
      if (o?.kind !== 'user') continue;
      if (connected.has(o.userId)) this.awaySince.delete(o.userId);
      else if (!this.awaySince.has(o.userId)) this.awaySince.set(o.userId, now);
    }
    if (this.handOffTimer) clearTimeout(this.handOffTimer);
    this.handOffTimer = null;
    const hostId = row.hostId;
    if (!this.playing || !seatOfUser(row.seats, hostId) || connected.has(hostId)) return;
    this.handOffTimer = setTimeout(() => {
      this.handOffTimer = null;
      this.table
        .queue(async () => {
          const seat = seatOfUser(this.table.row().seats, hostId);
          if (this.playing && seat && this.graceLeft(hostId) === 0) await this.table.standIn(seat);
        })
        .then(() => this.table.changed())
        .catch((err) => this.settings.logger.error({ err, tableId: this.table.id }, "handing the host's seat to a bot failed"));
    }, this.graceLeft(hostId, now));
    this.handOffTimer.unref?.();
  }

  /** Lets every bot whose seat has something to do act, one after another, through the queue. */
  wakeBots() {
    if (!this.playing || !this.table.hasExchange()) return;
    for (const seat of SEATS) {
      if (this.table.row().seats[seat]?.kind !== 'bot' || this.bots.has(seat) || !this.table.botMove(seat)) continue;
      const timer = setTimeout(() => {
        this.table.moveBot(seat).catch((err) => this.settings.logger.error({ err, tableId: this.table.id, seat }, "a bot's move was not stored"));
      }, this.settings.botDelayMs);
      this.bots.set(seat, timer);
    }
  }

  /** The bot at `seat` is moving now: its timer is spent, and whether it may move at all. */
  botDue(seat: Seat): boolean {
    this.bots.delete(seat);
    return this.playing;
  }

  close() {
    this.closed = true;
    if (this.handOffTimer) clearTimeout(this.handOffTimer);
    this.bots.forEach((t) => clearTimeout(t));
    this.bots.clear();
  }
}

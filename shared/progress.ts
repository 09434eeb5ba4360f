/** A player's progress over time: figures per finished exchange and over all of them. REST payload types. */
import type { Seat } from './seats';

export interface ProgressPointDto {
  exchangeId: string;
  tableName: string;
  finishedAt: string;
  seat: Seat;
  /** Fewest tiles away from the table's pattern list after the deal, and at the end. */
  awayBefore: number;
  awayAfter: number;
  /** awayBefore − awayAfter: positive when the passes brought the rack nearer. */
  gained: number;
  /** Passes the player sent (courtesy passes of 0 tiles are not passes). */
  passes: number;
  /** Passes that sent the same kinds (and the same blind count) as the top advice for the rack at that step; suggestions tied for the top score all count. */
  asAdvised: number;
  /** Passes that sent a tile of a kind held two or more times (jokers aside). */
  brokePair: number;
  /** Passes that sent at least one flower. */
  passedFlower: number;
}

export interface ProgressTotalsDto {
  exchanges: number;
  passes: number;
  /** Mean of `gained` over the exchanges; null with none. */
  meanGained: number | null;
  /** Shares of all passes, 0 to 1; null with no passes. */
  asAdvisedRate: number | null;
  brokePairRate: number | null;
  passedFlowerRate: number | null;
}

export interface ProgressDto {
  user: { id: number; displayName: string };
  totals: ProgressTotalsDto;
  /** Oldest first. */
  points: ProgressPointDto[];
  /** Only the most recent exchanges are counted; true when older ones were left out. */
  truncated: boolean;
}

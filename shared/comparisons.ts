/** Same deal, compared: the tables that played one deal side by side. REST payload types. */
import type { Phase } from './exchange/types';
import type { Seat } from './seats';
import type { TileKind } from './tiles';

/** What one seat sent in one pass: its own tiles, and how many it forwarded unseen. */
export interface ComparedPassDto {
  phase: Phase;
  sent: TileKind[];
  blind: number;
}

export interface ComparedSeatDto {
  seat: Seat;
  player: string;
  kind: 'user' | 'bot';
  /** Fewest tiles away from the deal's pattern list: after the deal, and at the end. */
  awayBefore: number;
  awayAfter: number;
  /** The pattern the final rack is nearest to. */
  nearest: string | null;
  passes: ComparedPassDto[];
}

export interface ComparedTableDto {
  exchangeId: string;
  tableId: string;
  tableName: string;
  finishedAt: string | null;
  /** 1 for the table whose best seat ended nearest; equal tables share a place. */
  place: number;
  /** The fewest tiles away any seat of this table ended, and the mean over its four seats. */
  bestAfter: number;
  meanAfter: number;
  seats: ComparedSeatDto[];
}

/** One seat at one table, in the standings of every seat that played the deal. */
export interface StandingDto {
  place: number;
  exchangeId: string;
  tableName: string;
  seat: Seat;
  player: string;
  awayBefore: number;
  awayAfter: number;
  nearest: string | null;
}

export interface DealComparisonDto {
  /** Stable within one answer; names the deal for links and headings. */
  key: string;
  title: string;
  drillName: string | null;
  /** Only a host of every table here (or an admin) sees the seed. */
  seed: string | null;
  patternListName: string;
  /** Finished tables, best first. */
  tables: ComparedTableDto[];
  /** Every seat of those tables, nearest first. */
  standings: StandingDto[];
  /** Tables on this deal still passing (not compared until they finish). */
  stillPlaying: number;
}

export interface ComparisonDto {
  title: string;
  deals: DealComparisonDto[];
  /** Deals left out for this viewer, with why (for instance their own table is still passing). */
  withheld: { title: string; reason: string }[];
}

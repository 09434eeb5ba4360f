import type { Seat } from '../seats';
import type { Tile, TileKind } from '../tiles';

export type { Seat } from '../seats';
export type { Tile, TileKind } from '../tiles';

export interface ExchangeOptions {
  seed: string;
  /** Default true; false deals from the set without jokers. */
  jokers?: boolean;
  /** Default true: offered after the first Charleston; false: never. */
  secondCharleston?: boolean;
  /** Default true. */
  courtesy?: boolean;
  /** Preset racks (drills); the rest is dealt from what remains. */
  racks?: Partial<Record<Seat, TileKind[]>>;
}

export type Phase =
  | 'first-right'
  | 'first-across'
  | 'first-left'
  | 'vote'
  | 'second-left'
  | 'second-across'
  | 'second-right'
  | 'courtesy-ask'
  | 'courtesy-pass'
  | 'done';

export type CourtesyCount = 0 | 1 | 2 | 3;

export type Action =
  /** Tile ids from the seat's own rack; tiles.length + blind = 3 (courtesy: = the agreed count). */
  | { type: 'pass'; tiles: string[]; blind?: number }
  /** Take back a committed pass, a "continue" vote or a courtesy ask before it settles. */
  | { type: 'withdraw' }
  /** In 'vote'; one stop ends the Charleston. */
  | { type: 'vote'; stop: boolean }
  | { type: 'courtesy-ask'; count: CourtesyCount };

export type RuleCode =
  | 'WRONG_PHASE'
  | 'ALREADY_COMMITTED'
  | 'NOT_YOUR_TILE'
  | 'DUPLICATE_TILE'
  | 'JOKER_NOT_PASSABLE'
  | 'WRONG_COUNT'
  | 'BLIND_NOT_ALLOWED'
  | 'NOT_READY'
  | 'BAD_ACTION'
  /** A withdraw with nothing committed (for instance after the pass resolved). */
  | 'NOT_COMMITTED';

export type Result<S = ExchangeState> =
  | { ok: true; state: S }
  | { ok: false; code: RuleCode; message: string };

/** One entry of the event log: a seat's action, or the resolution of the current step. */
export type LogEntry = { seat: Seat; action: Action } | { resolve: true };

export type Viewer = Seat | 'host' | 'spectator' | 'replay';

/** A committed pass as the engine keeps it. */
export interface CommittedPass {
  tiles: string[];
  blind: number;
}

/** What one seat gave and got in one resolved pass. */
export interface PassRecord {
  phase: Phase;
  /** Seat → tile ids it sent of its own rack. */
  sent: Record<Seat, string[]>;
  /** Seat → tile ids it forwarded blind (never shown to that seat). */
  forwarded: Record<Seat, string[]>;
  /** Seat → tile ids that landed in its rack. */
  received: Record<Seat, string[]>;
  /** Seat → how many tiles it chose to pass blind (0 outside the blind phases). */
  blind: Record<Seat, number>;
}

/**
 * The whole state: plain JSON. Internal fields may grow; the log and options are the source
 * of truth, everything else can be rebuilt by replay(options, log).
 */
export interface ExchangeState {
  options: Required<Omit<ExchangeOptions, 'racks'>> & Pick<ExchangeOptions, 'racks'>;
  phase: Phase;
  racks: Record<Seat, Tile[]>;
  /** Undealt tiles, in wall order. */
  wall: Tile[];
  /** Committed passes for the current pass phase. */
  pending: Partial<Record<Seat, CommittedPass>>;
  votes: Partial<Record<Seat, boolean>>;
  asks: Partial<Record<Seat, CourtesyCount>>;
  /** Courtesy count each seat must send in 'courtesy-pass' (the lower ask of its pair). */
  agreed: Partial<Record<Seat, CourtesyCount>>;
  /** Every resolved pass, in order. */
  history: PassRecord[];
  log: LogEntry[];
}

export interface SeatStatus {
  rackSize: number;
  /** Has committed this step (a pass, a vote, a courtesy ask). */
  committed: boolean;
}

/** What one viewer may see. The only way state leaves the engine. */
export interface ExchangeView {
  viewer: Viewer;
  phase: Phase;
  seats: Record<Seat, SeatStatus>;
  /** Racks this viewer may see: its own for a seat, every rack for 'host' and 'replay', none for 'spectator'. */
  racks: Partial<Record<Seat, Tile[]>>;
  /** Tiles that landed in a visible rack at the last resolved pass (blind-forwarded ones excluded for the forwarder). */
  received: Partial<Record<Seat, Tile[]>>;
  /** Committed passes this viewer may see: its own for a seat, all for 'host' and 'replay'. */
  pending: Partial<Record<Seat, CommittedPass>>;
  /** For a seat viewer: how many tiles it must send now (3 in a Charleston pass, the agreed count in courtesy), else 0. */
  passSize: number;
  /** Whether a blind pass is allowed in this phase. */
  blindAllowed: boolean;
  /**
   * Courtesy asks and agreed counts: a seat sees its own while the asks are open and every
   * seat's once they settle; 'host' and 'replay' always see all; 'spectator' none.
   */
  asks: Partial<Record<Seat, CourtesyCount>>;
  agreed: Partial<Record<Seat, CourtesyCount>>;
  /** Stop votes (true = stop), shown like the asks: own while voting, all once settled. */
  votes: Partial<Record<Seat, boolean>>;
  /**
   * Resolved passes as this viewer may see them; full for 'replay' and 'host'. A seat sees its
   * own sent and received ids and everyone's blind counts; every forwarded list is empty.
   * A spectator sees the phases and blind counts only.
   */
  history: PassRecord[];
  /** The kind of every tile id this view mentions, and of no other. */
  kinds: Record<string, TileKind>;
}

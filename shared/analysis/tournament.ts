/**
 * The bot tournament's pure core: paired deals, the measured seat rotating over the four seats,
 * and 95% intervals over deals.
 *
 * - A deal is one seed. Every run of a deal uses that seed, so the engine deals the same racks
 *   and makes the same blind picks; each bot is seeded by deal and seat (never by run), so a
 *   bot whose rack and history are the same makes the same choice in every run. Only the
 *   measured seat's strategy changes between runs; the three other seats play fixed
 *   strategies, named by where they sit from the measured seat (right, across, left).
 * - Rotation: by default every deal is measured at all four seats (east holds 14 tiles and
 *   passes differently), so each seat is measured equally often; 'one-seat-per-deal' measures
 *   deal i at seat i mod 4 instead.
 * - The figure of a seat is taken once the Charleston is over, from its rack alone: what a
 *   measure makes of it (finishing odds over the tiles it has not seen, tiles away beside).
 *   The measure's seed is the deal and seat, the same for every strategy, so the runs of one
 *   deal are compared on the same simulated draws as far as their racks allow.
 * - The four seats of one deal are not independent, so the unit of every interval is the deal:
 *   a deal's figure for a strategy is the mean over its measured seats, and strategies are
 *   compared by the mean of their per-deal differences.
 *
 * Long because the paired-deal schedule and its Student-t intervals are one measurement; the
 * interval arithmetic is the part to move out if it grows.
 */
import { act, canResolve, createExchange, resolve, viewFor } from '../exchange';
import type { ExchangeState } from '../exchange/types';
import { SEATS, seatTo, type Direction, type Seat } from '../seats';
import { fullSet, type TileKind } from '../tiles';
import { bestAway } from './away';
import { createBot, type BotStrategyId } from './bots';
import { completionOdds } from './odds';
import type { Pattern } from './pattern';

/** The strategies a tournament compares, from the weakest expected to the strongest. */
export const MEASURED_STRATEGIES: readonly BotStrategyId[] = ['random', 'multiples', 'advised'];

/** The comparisons the goal rests on: the first must beat the second. */
export const GOAL_COMPARISONS: readonly (readonly [BotStrategyId, BotStrategyId])[] = [
  ['advised', 'multiples'],
  ['multiples', 'random'],
];

/** Strategies of the three other seats, by where they sit from the measured seat. */
export type Opponents = Readonly<Record<Direction, BotStrategyId>>;
export const DIRECTIONS: readonly Direction[] = ['right', 'across', 'left'];

export function sameOpponents(strategy: BotStrategyId): Opponents {
  return { right: strategy, across: strategy, left: strategy };
}

export type Rotation = 'every-seat' | 'one-seat-per-deal';

/** What a measure says of one rack at the end of the Charleston. */
export interface SeatFigure {
  /** Chance of finishing the best pattern of the list, 0–1; null when the measure gives no odds. */
  odds: number | null;
  /** Tiles away from the closest pattern of the list. */
  away: number;
}

export interface MeasureContext {
  /** Every tile of the set the seat has not seen: the full set minus its own rack. */
  unseen: TileKind[];
  /** A seed of this deal and seat, the same for every strategy. */
  seed: string;
}

export type Measure = (rack: TileKind[], list: readonly Pattern[], context: MeasureContext) => SeatFigure;

/** The finishing-odds function the odds measure is built on (completionOdds, or a stand-in in tests). */
export type CompletionOddsFn = (
  rack: readonly TileKind[],
  list: readonly Pattern[],
  options: { unseen?: readonly TileKind[]; drawsLeft?: number; samples?: number; seed?: string },
) => { patterns: { id: string; odds: number }[]; families: { family: string; odds: number }[] };

/** Tiles away alone: the fallback when finishing odds are not wanted. */
export const awayMeasure: Measure = (rack, list) => ({ odds: null, away: bestAway(rack, list) });

export interface OddsMeasureOptions {
  /** Play-outs per rack; completionOdds's default when absent. */
  samples?: number;
  /** Draws the seat has left; completionOdds's default when absent. */
  drawsLeft?: number;
}

/** Finishing odds of the best pattern (the highest odds of any pattern of the list), tiles away beside. */
export function oddsMeasure(options: OddsMeasureOptions = {}, odds: CompletionOddsFn = completionOdds): Measure {
  return (rack, list, { unseen, seed }) => {
    const result = odds(rack, list, { unseen, seed, samples: options.samples, drawsLeft: options.drawsLeft });
    return { odds: result.patterns.reduce((best, p) => Math.max(best, p.odds), 0), away: bestAway(rack, list) };
  };
}

export function dealSeed(prefix: string, index: number): string {
  return `${prefix}-${index}`;
}

/** A bot's seed: the deal and the seat, never the run, so paired runs share every bot's chances. */
export function botSeed(deal: string, seat: Seat): string {
  return `${deal}:${seat}`;
}

/** The seed of the measure at one seat of one deal. */
export function measureSeed(deal: string, seat: Seat): string {
  return `${deal}:${seat}:measure`;
}

/** The seats measured in deal `index`. */
export function measuredSeats(index: number, rotation: Rotation): Seat[] {
  return rotation === 'every-seat' ? [...SEATS] : [SEATS[index % SEATS.length]];
}

/** Who plays what: the measured seat's strategy there, the fixed opponents around it. */
export function lineupFor(measured: Seat, strategy: BotStrategyId, opponents: Opponents): Record<Seat, BotStrategyId> {
  const lineup = { [measured]: strategy } as Record<Seat, BotStrategyId>;
  for (const direction of DIRECTIONS) lineup[seatTo(measured, direction)] = opponents[direction];
  return lineup;
}

/** Steps of a Charleston are few (eight passes, a vote, the courtesy asks); more means a stuck loop. */
const MAX_STEPS = 100;

/** Plays one exchange to the end with one bot per seat, each seeded by deal and seat. */
export function playExchange(seed: string, lineup: Record<Seat, BotStrategyId>, list: readonly Pattern[]): ExchangeState {
  const bots = Object.fromEntries(SEATS.map((seat) => [seat, createBot(lineup[seat], botSeed(seed, seat))]));
  let state = createExchange({ seed });
  for (let step = 0; state.phase !== 'done'; step++) {
    if (step > MAX_STEPS) throw new Error(`Exchange ${seed} did not finish.`);
    let moved = false;
    for (const seat of SEATS) {
      const action = bots[seat].chooseAction(viewFor(state, seat), list);
      if (!action) continue;
      const result = act(state, seat, action);
      if (!result.ok) throw new Error(`Exchange ${seed}: ${lineup[seat]} bot at ${seat} in ${state.phase}: ${result.code} ${result.message}`);
      state = result.state;
      moved = true;
    }
    if (canResolve(state)) {
      const result = resolve(state);
      if (!result.ok) throw new Error(`Exchange ${seed}: resolve in ${state.phase}: ${result.message}`);
      state = result.state;
    } else if (!moved) {
      throw new Error(`Exchange ${seed} is stuck in ${state.phase}.`);
    }
  }
  return state;
}

/** The tiles of the set a seat has not seen, when it has seen only its own rack. */
export function unseenBy(rack: readonly TileKind[], jokers = true): TileKind[] {
  const left = new Map<TileKind, number>();
  for (const kind of rack) left.set(kind, (left.get(kind) ?? 0) + 1);
  return fullSet(jokers).filter((kind) => {
    const n = left.get(kind) ?? 0;
    if (n === 0) return true;
    left.set(kind, n - 1);
    return false;
  });
}

export interface SeatRun {
  seat: Seat;
  strategy: BotStrategyId;
  /** The measured seat's rack when the Charleston is over. */
  rack: TileKind[];
  figure: SeatFigure;
  /** Whether the exchange stopped after the first Charleston. */
  stoppedEarly: boolean;
}

export interface DealResult {
  index: number;
  seed: string;
  seats: Seat[];
  runs: SeatRun[];
  /** Per strategy, the mean over the measured seats of this deal. */
  mean: Record<BotStrategyId, SeatFigure>;
}

export interface DealSpec {
  prefix: string;
  index: number;
  list: readonly Pattern[];
  measure: Measure;
  opponents: Opponents;
  rotation: Rotation;
  strategies?: readonly BotStrategyId[];
}

const lineupKey = (lineup: Record<Seat, BotStrategyId>) => SEATS.map((seat) => lineup[seat]).join(',');

/**
 * Plays one deal once per measured seat and strategy. Runs whose whole lineup is the same
 * (the measured strategy equal to every opponent's) are one game, played once.
 */
export function playDeal(spec: DealSpec): DealResult {
  const strategies = spec.strategies ?? MEASURED_STRATEGIES;
  const seed = dealSeed(spec.prefix, spec.index);
  const seats = measuredSeats(spec.index, spec.rotation);
  const games = new Map<string, ExchangeState>();
  const runs: SeatRun[] = [];
  for (const seat of seats) {
    for (const strategy of strategies) {
      const lineup = lineupFor(seat, strategy, spec.opponents);
      const key = lineupKey(lineup);
      let state = games.get(key);
      if (!state) {
        state = playExchange(seed, lineup, spec.list);
        games.set(key, state);
      }
      const rack = state.racks[seat].map((t) => t.kind);
      const figure = spec.measure(rack, spec.list, { unseen: unseenBy(rack, state.options.jokers), seed: measureSeed(seed, seat) });
      const stoppedEarly = !state.history.some((h) => h.phase === 'second-left');
      runs.push({ seat, strategy, rack, figure, stoppedEarly });
    }
  }
  const mean = Object.fromEntries(
    strategies.map((strategy) => {
      const mine = runs.filter((r) => r.strategy === strategy).map((r) => r.figure);
      const odds = mine.every((f) => f.odds !== null) ? average(mine.map((f) => f.odds!)) : null;
      return [strategy, { odds, away: average(mine.map((f) => f.away)) }];
    }),
  ) as Record<BotStrategyId, SeatFigure>;
  return { index: spec.index, seed, seats, runs, mean };
}

function average(values: readonly number[]): number {
  return values.reduce((a, b) => a + b, 0) / values.length;
}

/**
 * Two-sided 97.5% points of Student's t for 1–30 degrees of freedom, from memory (the usual
 * printed table); each is checked against jstat in the unit tests.
 */
const T975_TABLE = [
  12.706, 4.303, 3.182, 2.776, 2.571, 2.447, 2.365, 2.306, 2.262, 2.228, 2.201, 2.179, 2.16, 2.145, 2.131, 2.12, 2.11, 2.101, 2.093,
  2.086, 2.08, 2.074, 2.069, 2.064, 2.06, 2.056, 2.052, 2.048, 2.045, 2.042,
];
/** The 97.5% point of the standard normal distribution. */
const Z975 = 1.959964;

/**
 * The 97.5% point of Student's t with `df` degrees of freedom: the table up to 30, then the
 * Cornish–Fisher expansion in 1/df around the normal point (two terms past the normal).
 */
export function t975(df: number): number {
  if (!(df >= 1)) return Infinity;
  if (df <= T975_TABLE.length) return T975_TABLE[Math.floor(df) - 1];
  const z = Z975;
  return z + (z ** 3 + z) / (4 * df) + (5 * z ** 5 + 16 * z ** 3 + 3 * z) / (96 * df ** 2);
}

export interface Interval {
  n: number;
  mean: number;
  /** Sample standard deviation (n − 1 in the denominator). */
  sd: number;
  /** Half the width of the 95% interval: t(0.975, n − 1) × sd / √n. */
  half: number;
  low: number;
  high: number;
}

/** Mean and Student-t 95% interval of independent values. Fewer than two values give an unbounded interval. */
export function meanInterval(values: readonly number[]): Interval {
  const n = values.length;
  const mean = n > 0 ? average(values) : NaN;
  const sd = n > 1 ? Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (n - 1)) : NaN;
  const half = n > 1 ? (t975(n - 1) * sd) / Math.sqrt(n) : Infinity;
  return { n, mean, sd, half, low: mean - half, high: mean + half };
}

/** Whether an interval lies wholly above 0. */
export function aboveZero(interval: Interval): boolean {
  return interval.low > 0;
}

export interface StrategyRow {
  strategy: BotStrategyId;
  /** Mean over deals of the deal's mean finishing odds; null without odds. */
  odds: Interval | null;
  away: Interval;
}

export interface Difference {
  better: BotStrategyId;
  worse: BotStrategyId;
  /** Per deal, better's odds minus worse's (positive: better finishes more often). */
  odds: Interval | null;
  /** Per deal, worse's tiles away minus better's (positive: better is closer). */
  closer: Interval;
  /** Whether better beats worse on the tournament's measure by a margin whose interval excludes 0. */
  holds: boolean;
}

export interface TournamentSummary {
  deals: number;
  /** The figure the goal is judged on: finishing odds when the measure gives them, else tiles away. */
  judgedOn: 'odds' | 'away';
  rows: StrategyRow[];
  differences: Difference[];
  /** Every goal comparison holds. */
  goalHolds: boolean;
  /** Share of measured runs in which the exchange stopped after the first Charleston. */
  stoppedEarly: number;
  /** Mean figure per strategy and seat over every run at that seat (seats are not independent; no intervals). */
  bySeat: Record<BotStrategyId, Partial<Record<Seat, SeatFigure>>>;
}

export function difference(deals: readonly DealResult[], better: BotStrategyId, worse: BotStrategyId, judgedOn: 'odds' | 'away'): Difference {
  const withOdds = deals.every((d) => d.mean[better].odds !== null && d.mean[worse].odds !== null);
  const odds = withOdds ? meanInterval(deals.map((d) => d.mean[better].odds! - d.mean[worse].odds!)) : null;
  const closer = meanInterval(deals.map((d) => d.mean[worse].away - d.mean[better].away));
  const judged = judgedOn === 'odds' ? odds : closer;
  return { better, worse, odds, closer, holds: judged !== null && aboveZero(judged) };
}

/** Everything the tournament prints, from the played deals. */
export function summarize(deals: readonly DealResult[], strategies: readonly BotStrategyId[] = MEASURED_STRATEGIES): TournamentSummary {
  const judgedOn = deals.length > 0 && deals.every((d) => strategies.every((s) => d.mean[s].odds !== null)) ? 'odds' : 'away';
  const rows = strategies.map((strategy) => ({
    strategy,
    odds: judgedOn === 'odds' ? meanInterval(deals.map((d) => d.mean[strategy].odds!)) : null,
    away: meanInterval(deals.map((d) => d.mean[strategy].away)),
  }));
  const pairs: (readonly [BotStrategyId, BotStrategyId])[] = [...GOAL_COMPARISONS, ['advised', 'random']];
  const differences = pairs
    .filter(([a, b]) => strategies.includes(a) && strategies.includes(b))
    .map(([a, b]) => difference(deals, a, b, judgedOn));
  const goal = differences.filter((d) => GOAL_COMPARISONS.some(([a, b]) => a === d.better && b === d.worse));
  const runs = deals.flatMap((d) => d.runs);
  const bySeat = Object.fromEntries(
    strategies.map((strategy) => [
      strategy,
      Object.fromEntries(
        SEATS.flatMap((seat) => {
          const mine = runs.filter((r) => r.strategy === strategy && r.seat === seat).map((r) => r.figure);
          if (mine.length === 0) return [];
          const odds = mine.every((f) => f.odds !== null) ? average(mine.map((f) => f.odds!)) : null;
          return [[seat, { odds, away: average(mine.map((f) => f.away)) }]];
        }),
      ),
    ]),
  ) as TournamentSummary['bySeat'];
  return {
    deals: deals.length,
    judgedOn,
    rows,
    differences,
    goalHolds: goal.length === GOAL_COMPARISONS.length && goal.every((d) => d.holds),
    stoppedEarly: runs.length ? runs.filter((r) => r.stoppedEarly).length / runs.length : 0,
    bySeat,
  };
}

export interface TournamentOptions extends Omit<DealSpec, 'index'> {
  deals: number;
  /** Called after each deal, for a progress bar. */
  onDeal?: (done: number) => void;
}

/** Plays deals 0 … deals − 1 and summarizes them. */
export function runTournament(options: TournamentOptions): { deals: DealResult[]; summary: TournamentSummary } {
  const deals: DealResult[] = [];
  for (let index = 0; index < options.deals; index++) {
    deals.push(playDeal({ ...options, index }));
    options.onDeal?.(index + 1);
  }
  return { deals, summary: summarize(deals, options.strategies) };
}

/**
 * How a pattern list sits against random deals: which pattern is the nearest hand of each dealt
 * rack, and how often each pattern is within reach. Pure and seeded, shared by the list-balance
 * bench and the unit test that holds the starter list to its balance goals.
 */
import { standings, countsOf } from '../../shared/analysis/away';
import type { Pattern } from '../../shared/analysis/pattern';
import { createExchange } from '../../shared/exchange';
import { SEATS } from '../../shared/seats';
import type { TileKind } from '../../shared/tiles';

/** Balance goals of Rackside's own starter list. */
export const BALANCE_GOALS = { maxNearestShare: 0.08, maxSinglesAndPairsShare: 0.25 } as const;

/**
 * Racks of `deals` seeded deals: every seat's (four per deal: east's 14 tiles and three racks
 * of 13), or one seat's per deal, the seat going round (east on deals 0, 4, 8, …).
 */
export function dealtRacks(deals: number, seed = 'list-balance', seats: 'every-seat' | 'one-seat' = 'every-seat'): TileKind[][] {
  const racks: TileKind[][] = [];
  for (let i = 0; i < deals; i++) {
    const state = createExchange({ seed: `${seed}-${i}` });
    for (const seat of seats === 'every-seat' ? SEATS : [SEATS[i % SEATS.length]]) racks.push(state.racks[seat].map((t) => t.kind));
  }
  return racks;
}

/** A hand made only of singles and pairs: no group a joker may fill, so no jokers and no calls help it. */
export function onlySinglesAndPairs(p: Pattern): boolean {
  return p.groups.every((g) => g.size <= 2);
}

export interface PatternBalance {
  id: string;
  family: string;
  /** Share of racks on which this pattern is the nearest hand (first by tiles away, ties as rankPatterns breaks them). */
  nearest: number;
  /** Share of racks within `reach` tiles of it. */
  withinReach: number;
  /** Mean tiles away. */
  meanAway: number;
}

export interface ListBalance {
  racks: number;
  reach: number;
  patterns: PatternBalance[];
  maxNearest: { id: string; share: number };
  singlesAndPairsNearest: number;
}

/** Nearest-hand shares and reach over the racks: tiles away, ranked exactly as rankPatterns ranks them. */
export function measureBalance(list: readonly Pattern[], racks: readonly (readonly TileKind[])[], reach = 7): ListBalance {
  const nearest = new Array<number>(list.length).fill(0);
  const within = new Array<number>(list.length).fill(0);
  const awaySum = new Array<number>(list.length).fill(0);
  const index = new Map(list.map((p, i) => [p, i]));
  for (const rack of racks) {
    const ranked = standings(countsOf(rack), list);
    nearest[index.get(ranked[0].pattern)!]++;
    for (const s of ranked) {
      const i = index.get(s.pattern)!;
      awaySum[i] += s.away;
      if (s.away <= reach) within[i]++;
    }
  }
  const n = racks.length;
  const patterns = list.map((p, i) => ({ id: p.id, family: p.family, nearest: nearest[i] / n, withinReach: within[i] / n, meanAway: awaySum[i] / n }));
  const top = patterns.reduce((a, b) => (b.nearest > a.nearest ? b : a));
  const singles = patterns.filter((_, i) => onlySinglesAndPairs(list[i])).reduce((sum, p) => sum + p.nearest, 0);
  return { racks: n, reach, patterns, maxNearest: { id: top.id, share: top.nearest }, singlesAndPairsNearest: singles };
}

/**
 * Rackside's value scale, 10 to 100 in steps of 5, from a pattern's finishing odds: the likeliest
 * pattern of the list gets 10, the rarest 100, and the rest fall between on a log scale (halving
 * the odds adds the same to the value wherever it happens). Odds must be above 0: count a
 * pattern never finished as half a finish over the samples played.
 */
export function valueFromOdds(odds: number, likeliest: number, rarest: number): number {
  const hi = Math.log(likeliest);
  const lo = Math.log(rarest);
  const at = Math.log(odds);
  const share = hi === lo ? 0 : (hi - at) / (hi - lo);
  return Math.min(100, Math.max(10, 10 + 5 * Math.round((90 * share) / 5)));
}

/** A rack at a glance, for the rack panel: multiples, suits, numbers and the nearest patterns. */
import { DRAGON_KINDS, rankOf, SUITS, suitOf, TILE_KINDS, WIND_KINDS, type Suit, type TileKind } from '../tiles';
import { countsOf, rankPatterns, type RankedPattern } from './away';
import { JOKER } from './compile';
import type { Pattern } from './pattern';

export interface RackSummary {
  size: number;
  /** Kinds held exactly twice (jokers never count). */
  pairs: TileKind[];
  /** Kinds held three times or more. */
  pungs: TileKind[];
  bySuit: Record<Suit, number>;
  winds: number;
  dragons: number;
  flowers: number;
  jokers: number;
  /** The suit with the most tiles; ties go to the suit with more pairs and pungs, then bam, crack, dot. Null with no suit tiles. */
  leadingSuit: Suit | null;
  evens: number;
  odds: number;
  /** The three closest patterns, with tiles away and what each keeps. */
  nearest: RankedPattern[];
}

export function summarizeRack(hand: readonly TileKind[], list: readonly Pattern[]): RackSummary {
  const counts = countsOf(hand);
  const pairs: TileKind[] = [];
  const pungs: TileKind[] = [];
  counts.forEach((n, k) => {
    if (k === JOKER) return;
    if (n === 2) pairs.push(TILE_KINDS[k]);
    if (n >= 3) pungs.push(TILE_KINDS[k]);
  });
  const bySuit = { bam: 0, crack: 0, dot: 0 } as Record<Suit, number>;
  const multiplesIn = { bam: 0, crack: 0, dot: 0 } as Record<Suit, number>;
  let evens = 0;
  let odds = 0;
  for (const kind of hand) {
    const suit = suitOf(kind);
    if (!suit) continue;
    bySuit[suit]++;
    if (rankOf(kind)! % 2 === 0) evens++;
    else odds++;
  }
  for (const kind of [...pairs, ...pungs]) {
    const suit = suitOf(kind);
    if (suit) multiplesIn[suit]++;
  }
  let leadingSuit: Suit | null = null;
  for (const suit of SUITS) {
    if (bySuit[suit] === 0) continue;
    if (!leadingSuit || bySuit[suit] > bySuit[leadingSuit] || (bySuit[suit] === bySuit[leadingSuit] && multiplesIn[suit] > multiplesIn[leadingSuit])) {
      leadingSuit = suit;
    }
  }
  const count = (kinds: readonly TileKind[]) => hand.filter((k) => kinds.includes(k)).length;
  return {
    size: hand.length,
    pairs,
    pungs,
    bySuit,
    winds: count(WIND_KINDS),
    dragons: count(DRAGON_KINDS),
    flowers: count(['flower']),
    jokers: count(['joker']),
    leadingSuit,
    evens,
    odds,
    nearest: rankPatterns(hand, list, 3),
  };
}

/** How far a rack is from a pattern: exact, over every assignment of the pattern's variables. */
import { TILE_KINDS, type TileKind } from '../tiles';
import { compileUnchecked, JOKER, KIND_COUNT, kindIndex, type Assignment, type CompiledPattern } from './compile';
import { HAND_SIZE, type Pattern } from './pattern';
import { validatePattern } from './schema';

const cache = new WeakMap<Pattern, CompiledPattern>();

/**
 * The compiled form of a pattern, validated once and cached by object identity; treat a
 * pattern as frozen once it has been judged.
 */
export function compiled(pattern: Pattern): CompiledPattern {
  let hit = cache.get(pattern);
  if (!hit) {
    const errors = validatePattern(pattern);
    if (errors.length > 0) throw new Error(errors.join('\n'));
    hit = compileUnchecked(pattern);
    cache.set(pattern, hit);
  }
  return hit;
}

/** Tiles of each kind, indexed as TILE_KINDS. */
export function countsOf(hand: readonly TileKind[]): Uint8Array {
  const counts = new Uint8Array(KIND_COUNT);
  for (const kind of hand) counts[kindIndex(kind)]++;
  return counts;
}

/**
 * Most tiles that fit assignment `a`. Per kind, naturals fill singles and pairs first (jokers
 * can't), then bigger groups; jokers fill what is left of the bigger groups. Greedy is exact:
 * naturals only ever fit their own kind, and putting them in small groups first leaves the
 * most room a joker can use.
 */
export function fitAt(c: CompiledPattern, a: number, counts: Uint8Array): number {
  const flat = c.flat;
  let natural = 0;
  let open = 0;
  for (let i = c.starts[a], end = c.starts[a + 1]; i < end; i += 3) {
    const have = counts[flat[i]];
    const small = flat[i + 1];
    const big = flat[i + 2];
    const used = have < small + big ? have : small + big;
    natural += used;
    open += used > small ? big - (used - small) : big;
  }
  const jokers = counts[JOKER];
  return natural + (jokers < open ? jokers : open);
}

export interface BestFit {
  fit: number;
  assignment: number;
}

/** The best assignment; ties go to the one that uses more natural tiles, then to the first. */
export function bestFit(c: CompiledPattern, counts: Uint8Array): BestFit {
  let fit = -1;
  let assignment = 0;
  let bestNatural = -1;
  const jokers = counts[JOKER];
  for (let a = 0, n = c.starts.length - 1; a < n; a++) {
    const f = fitAt(c, a, counts);
    if (f > fit) {
      fit = f;
      assignment = a;
      bestNatural = -1;
    } else if (f === fit && jokers > 0) {
      // Without jokers every fit is all naturals, so only a rack with jokers can break a tie.
      if (bestNatural < 0) bestNatural = naturalAt(c, assignment, counts);
      const natural = naturalAt(c, a, counts);
      if (natural > bestNatural) {
        assignment = a;
        bestNatural = natural;
      }
    }
  }
  return { fit: Math.max(fit, 0), assignment };
}

function naturalAt(c: CompiledPattern, a: number, counts: Uint8Array): number {
  let natural = 0;
  for (let i = c.starts[a], end = c.starts[a + 1]; i < end; i += 3) {
    natural += Math.min(counts[c.flat[i]], c.flat[i + 1] + c.flat[i + 2]);
  }
  return natural;
}

/** 14 minus the most tiles of the hand that fit, over every assignment. A 13-tile rack is at best 1 away. */
export function tilesAway(hand: readonly TileKind[], pattern: Pattern): number {
  return HAND_SIZE - bestFit(compiled(pattern), countsOf(hand)).fit;
}

/** The same from counts, for callers that judge many racks. */
export function tilesAwayCounts(counts: Uint8Array, pattern: Pattern): number {
  return HAND_SIZE - bestFit(compiled(pattern), counts).fit;
}

export interface FitDetail {
  away: number;
  assignment: Assignment;
  /** Tiles of the hand that count toward the pattern (jokers included), in display order. */
  keep: TileKind[];
  /** Tiles still missing, one entry per empty slot, in display order. */
  need: TileKind[];
}

/** The best assignment spelled out: what to keep and what is still missing. */
export function fitDetail(hand: readonly TileKind[], pattern: Pattern): FitDetail {
  const c = compiled(pattern);
  const counts = countsOf(hand);
  const best = bestFit(c, counts);
  const keep: TileKind[] = [];
  const need: TileKind[] = [];
  let jokers = counts[JOKER];
  for (let i = c.starts[best.assignment], end = c.starts[best.assignment + 1]; i < end; i += 3) {
    const kind = TILE_KINDS[c.flat[i]];
    const small = c.flat[i + 1];
    const big = c.flat[i + 2];
    const used = Math.min(counts[c.flat[i]], small + big);
    for (let k = 0; k < used; k++) keep.push(kind);
    const openSmall = Math.max(0, small - used);
    const openBig = big - Math.max(0, used - small);
    const byJoker = Math.min(jokers, openBig);
    jokers -= byJoker;
    for (let k = 0; k < openSmall + openBig - byJoker; k++) need.push(kind);
  }
  const jokersUsed = counts[JOKER] - jokers;
  for (let k = 0; k < jokersUsed; k++) keep.push('joker');
  return { away: HAND_SIZE - best.fit, assignment: c.assignments[best.assignment], keep, need };
}

export interface RankedPattern {
  pattern: Pattern;
  away: number;
  keep: TileKind[];
  need: TileKind[];
}

export interface Standing {
  pattern: Pattern;
  c: CompiledPattern;
  order: number;
  away: number;
  natural: number;
  assignment: number;
}

/** Every pattern of the list judged against counts, closest first (ties: more naturals, then list order). */
export function standings(counts: Uint8Array, list: readonly Pattern[]): Standing[] {
  const scored = list.map((pattern, order) => {
    const c = compiled(pattern);
    const best = bestFit(c, counts);
    return { pattern, c, order, away: HAND_SIZE - best.fit, natural: naturalAt(c, best.assignment, counts), assignment: best.assignment };
  });
  return scored.sort((a, b) => a.away - b.away || b.natural - a.natural || a.order - b.order);
}

/** The closest patterns first (ties: more natural tiles kept, then list order), with what each keeps and still needs. */
export function rankPatterns(hand: readonly TileKind[], list: readonly Pattern[], limit = 5): RankedPattern[] {
  return standings(countsOf(hand), list)
    .slice(0, Math.max(0, limit))
    .map(({ pattern }) => {
      const { away, keep, need } = fitDetail(hand, pattern);
      return { pattern, away, keep, need };
    });
}

/** The fewest tiles away over a whole list (14 for an empty list). */
export function bestAway(hand: readonly TileKind[], list: readonly Pattern[]): number {
  const counts = countsOf(hand);
  let best = HAND_SIZE;
  for (const pattern of list) best = Math.min(best, HAND_SIZE - bestFit(compiled(pattern), counts).fit);
  return best;
}

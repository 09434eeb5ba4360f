/**
 * What the tiles a rack still lacks for a pattern cost, not just how many there are.
 *
 * Cost model. Each missing tile costs COST_UNIT divided by its "rate", the number of unseen
 * tiles that could fill its slot, so an exact tile with all four copies unseen costs 1, one
 * with a single copy left costs 4, and one with none left can't be had (Infinity):
 * - A single or pair needs that exact natural tile: rate = copies of the kind still unseen,
 *   less the ones earlier missing tiles of the same kind already count on (the second tile of
 *   a missing pair has one copy fewer to come from).
 * - A tile of a pung or bigger has the same natural copies (after the singles and pairs of its
 *   kind are served) plus a share of the unseen jokers: the jokers are split evenly over every
 *   missing tile of such groups, since one joker fills only one of them. The last missing tile
 *   of each such group may also be claimed from another player's discard (a claimed tile must
 *   complete the group it is shown with), so for hands that may be exposed its natural copies
 *   count 1 + OTHER_PLAYERS × callRate times: three other players discard each round, and a
 *   needed discard is claimed at `callRate`. A tile only jokers can fill (no natural copy left)
 *   costs its joker share alone, and the hand can't be had when such tiles outnumber the
 *   unseen jokers.
 * - Jokers already on the rack take the dearest missing tiles of groups of three or more.
 * The price of a pattern is the sum over its missing tiles, for the assignment of its suits and
 * numbers that costs least (ties: more tiles already in place, then more natural tiles, then
 * the first). It reads as "effort", not as tiles away: 7 missing singles with three copies
 * left each cost about 9, 7 missing tiles of pungs about 2 to 3.
 *
 * A little over 300 lines: the cost model, its scarcity rates and the ranking by price share one
 * set of constants.
 */
import { copiesInSet, TILE_KINDS, type TileKind } from '../tiles';
import { compiled, countsOf, fitAt } from './away';
import { groupKind, JOKER as JOKER_KIND, KIND_COUNT as KINDS, type CompiledPattern } from './compile';
import { buildsWithoutCalls, HAND_SIZE as FULL_HAND, JOKER_MIN_GROUP, type Pattern } from './pattern';

// Local copies: imported bindings are read through accessors in some builds, too slow for the inner loops.
const JOKER = JOKER_KIND;
const KIND_COUNT = KINDS;
const HAND_SIZE = FULL_HAND;

/** An exact tile with this many copies unseen costs 1. */
export const COST_UNIT = 4;
/** Players who discard between two of this seat's draws. */
export const OTHER_PLAYERS = 3;
/**
 * The chance that a discard this seat needs to complete a group of three or more can be
 * claimed (nobody with a better claim takes it first): a modelling choice, no published source.
 */
export const DEFAULT_CALL_RATE = 0.6;

export interface MissingTile {
  kind: TileKind;
  /** Size of the group the tile belongs to. */
  groupSize: number;
  /** Whether a joker may stand in (groups of three or more). */
  jokerable: boolean;
  /** Copies of the kind still unseen by this seat. */
  copiesLeft: number;
  cost: number;
}

export interface MissingPrice {
  price: number;
  missing: MissingTile[];
}

export interface PricedPattern {
  pattern: Pattern;
  price: number;
  away: number;
  /** Tiles of groups of three or more not yet filled by a natural: how many jokers the hand can use. */
  jokerRoom: number;
  keep: TileKind[];
  need: TileKind[];
  missing: MissingTile[];
}

/** Unseen copies of each kind: the given tiles, or the full set less the rack. */
export function unseenCounts(rack: readonly TileKind[] | Uint8Array, unseen?: readonly TileKind[]): Uint8Array {
  if (unseen) return countsOf(unseen);
  const counts = rack instanceof Uint8Array ? rack : countsOf(rack);
  const out = new Uint8Array(KIND_COUNT);
  for (let k = 0; k < KIND_COUNT; k++) out[k] = Math.max(0, copiesInSet(TILE_KINDS[k]) - counts[k]);
  return out;
}

/** One missing tile while pricing: its kind, whether it is in a big group, and the copies it may come from. */
interface Slot {
  kind: number;
  big: boolean;
  /** Natural copies left for this tile after the earlier missing tiles of its kind. */
  avail: number;
  /** Filled by a joker already on the rack: costs nothing. */
  filled: boolean;
  cost: number;
}

const scratch: Slot[] = Array.from({ length: HAND_SIZE }, () => ({ kind: 0, big: false, avail: 0, filled: false, cost: 0 }));

/**
 * The price of assignment `a`; with `sink`, the missing tiles are also written to it (in
 * kind order, singles and pairs of a kind before its bigger groups).
 */
function priceAt(
  c: CompiledPattern,
  a: number,
  counts: Uint8Array,
  unseen: Uint8Array,
  exposable: boolean,
  callRate: number,
  sink?: Slot[],
): number {
  const flat = c.flat;
  const start = c.starts[a];
  const end = c.starts[a + 1];
  let openBig = 0;
  for (let i = start; i < end; i += 3) {
    const have = counts[flat[i]];
    const small = flat[i + 1];
    const big = flat[i + 2];
    const used = have < small + big ? have : small + big;
    openBig += used > small ? big - (used - small) : big;
  }
  const held = counts[JOKER];
  const bigMissing = openBig > held ? openBig - held : 0;
  const share = unseen[JOKER] / (bigMissing > 0 ? bigMissing : 1);
  const boost = exposable ? 1 + OTHER_PLAYERS * callRate : 1;

  let price = 0;
  let n = 0;
  for (let i = start; i < end; i += 3) {
    const kind = flat[i];
    const have = counts[kind];
    const small = flat[i + 1];
    const big = flat[i + 2];
    const smallMissing = small > have ? small - have : 0;
    for (let j = 0; j < smallMissing; j++) {
      const slot = scratch[n++];
      slot.kind = kind;
      slot.big = false;
      slot.avail = unseen[kind] - j;
      slot.filled = false;
      slot.cost = slot.avail > 0 ? COST_UNIT / slot.avail : Infinity;
    }
    const inBig = have > small ? Math.min(have - small, big) : 0;
    for (let j = 0; j < big - inBig; j++) {
      const slot = scratch[n++];
      slot.kind = kind;
      slot.big = true;
      slot.avail = unseen[kind] - smallMissing - j;
      slot.filled = false;
      slot.cost = 0;
    }
  }

  // Jokers on the rack take the big-group tiles with the fewest natural copies left: the dearest.
  let jokers = held;
  let jokerOnly = 0;
  while (jokers > 0) {
    let worst = -1;
    for (let s = 0; s < n; s++) {
      const slot = scratch[s];
      if (slot.big && !slot.filled && (worst < 0 || slot.avail < scratch[worst].avail)) worst = s;
    }
    if (worst < 0) break;
    scratch[worst].filled = true;
    jokers--;
  }
  for (let s = 0; s < n; s++) {
    const slot = scratch[s];
    if (!slot.big || slot.filled) continue;
    // The last missing tile of the kind's group (fewest copies left) may be a claimed discard.
    let last = true;
    for (let t = 0; t < n; t++) {
      const other = scratch[t];
      if (t !== s && other.big && !other.filled && other.kind === slot.kind && other.avail < slot.avail) last = false;
    }
    const natural = slot.avail > 0 ? slot.avail * (last ? boost : 1) : 0;
    if (slot.avail <= 0) jokerOnly++;
    const rate = natural + share;
    slot.cost = rate > 0 ? COST_UNIT / rate : Infinity;
  }
  if (jokerOnly > unseen[JOKER]) price = Infinity;
  const out = sink ?? null;
  for (let s = 0; s < n; s++) {
    const slot = scratch[s];
    if (slot.filled) continue;
    price += slot.cost;
    if (out) out.push({ ...slot });
  }
  return price;
}

/** The price of every assignment of a compiled pattern. */
export function assignmentPrices(c: CompiledPattern, counts: Uint8Array, unseen: Uint8Array, exposable: boolean, callRate = DEFAULT_CALL_RATE): Float64Array {
  const n = c.starts.length - 1;
  const out = new Float64Array(n);
  for (let a = 0; a < n; a++) out[a] = priceAt(c, a, counts, unseen, exposable, callRate);
  return out;
}

function naturalAt(c: CompiledPattern, a: number, counts: Uint8Array): number {
  let natural = 0;
  for (let i = c.starts[a], end = c.starts[a + 1]; i < end; i += 3) natural += Math.min(counts[c.flat[i]], c.flat[i + 1] + c.flat[i + 2]);
  return natural;
}

/**
 * Assignment indexes, cheapest first (ties: more tiles in place, more naturals, then
 * enumeration order); with `limit`, only that many, without sorting the rest.
 */
export function cheapestAssignments(c: CompiledPattern, counts: Uint8Array, prices: Float64Array, limit = Infinity): number[] {
  let pool: number[];
  if (limit < prices.length) {
    // The limit-th lowest price: only assignments at or under it can be among the cheapest.
    const lowest: number[] = [];
    for (let a = 0; a < prices.length; a++) {
      const p = prices[a];
      if (lowest.length >= limit && p >= lowest[lowest.length - 1]) continue;
      let at = lowest.length;
      while (at > 0 && lowest[at - 1] > p) at--;
      lowest.splice(at, 0, p);
      if (lowest.length > limit) lowest.pop();
    }
    const cut = lowest[lowest.length - 1];
    pool = [];
    for (let a = 0; a < prices.length; a++) if (prices[a] <= cut) pool.push(a);
  } else pool = Array.from(prices.keys());
  const fit = new Map(pool.map((a) => [a, fitAt(c, a, counts)]));
  const natural = new Map(pool.map((a) => [a, naturalAt(c, a, counts)]));
  pool.sort((x, y) => prices[x] - prices[y] || fit.get(y)! - fit.get(x)! || natural.get(y)! - natural.get(x)! || x - y || 0);
  return limit < pool.length ? pool.slice(0, limit) : pool;
}

/** Cheapest assignment index (same ties as cheapestAssignments) without sorting them all. */
function cheapest(c: CompiledPattern, counts: Uint8Array, prices: Float64Array): number {
  let best = 0;
  let bestFit = -1;
  let bestNatural = -1;
  for (let a = 0; a < prices.length; a++) {
    if (prices[a] > prices[best]) continue;
    const fit = fitAt(c, a, counts);
    if (prices[a] < prices[best] || bestFit < 0) {
      best = a;
      bestFit = fit;
      bestNatural = naturalAt(c, a, counts);
      continue;
    }
    if (fit < bestFit) continue;
    const natural = naturalAt(c, a, counts);
    if (fit > bestFit || natural > bestNatural) {
      best = a;
      bestFit = fit;
      bestNatural = natural;
    }
  }
  return best;
}

/** Sizes of the groups of each kind at assignment `a`: singles and pairs, then bigger groups, in pattern order. */
function groupSizes(pattern: Pattern, c: CompiledPattern, a: number): Map<number, { small: number[]; big: number[] }> {
  const out = new Map<number, { small: number[]; big: number[] }>();
  for (const group of pattern.groups) {
    const kind = TILE_KINDS.indexOf(groupKind(group, c.assignments[a]));
    const entry = out.get(kind) ?? { small: [], big: [] };
    (group.size >= JOKER_MIN_GROUP ? entry.big : entry.small).push(group.size);
    out.set(kind, entry);
  }
  return out;
}

/** The missing tiles of assignment `a`, each with the size of the group it completes. */
function missingAt(pattern: Pattern, c: CompiledPattern, a: number, counts: Uint8Array, unseen: Uint8Array, callRate: number): MissingPrice {
  const slots: Slot[] = [];
  const price = priceAt(c, a, counts, unseen, !buildsWithoutCalls(pattern), callRate, slots);
  const sizes = groupSizes(pattern, c, a);
  // Natural tiles fill the groups of their kind in pattern order, so the missing ones are the last slots.
  const openSizes = new Map<number, { small: number[]; big: number[] }>();
  for (const [kind, { small, big }] of sizes) {
    const expand = (list: number[]) => list.flatMap((size) => Array.from({ length: size }, () => size));
    const smallSlots = expand(small);
    const bigSlots = expand(big);
    const have = counts[kind];
    const inSmall = Math.min(have, smallSlots.length);
    const inBig = Math.min(have - inSmall, bigSlots.length);
    openSizes.set(kind, { small: smallSlots.slice(inSmall), big: bigSlots.slice(inBig) });
  }
  const missing = slots.map((slot): MissingTile => {
    const open = openSizes.get(slot.kind)!;
    const groupSize = (slot.big ? open.big.pop() : open.small.shift()) ?? (slot.big ? JOKER_MIN_GROUP : 1);
    return { kind: TILE_KINDS[slot.kind], groupSize, jokerable: slot.big, copiesLeft: unseen[slot.kind], cost: slot.cost };
  });
  return { price, missing };
}

/**
 * What the rack still lacks for a pattern, tile by tile, priced by how hard each is to get
 * (see the cost model above), for the assignment of the pattern that costs least. `unseen`
 * is every tile this seat has not seen; by default the full set less the rack.
 */
export function missingPrice(rack: readonly TileKind[], pattern: Pattern, unseen?: readonly TileKind[], callRate = DEFAULT_CALL_RATE): MissingPrice {
  const c = compiled(pattern);
  const counts = countsOf(rack);
  const pool = unseenCounts(counts, unseen);
  const prices = assignmentPrices(c, counts, pool, !buildsWithoutCalls(pattern), callRate);
  return missingAt(pattern, c, cheapest(c, counts, prices), counts, pool, callRate);
}

/** Keep and need of assignment `a`, as fitDetail spells them for the best-fitting one. */
function keepAndNeed(c: CompiledPattern, a: number, counts: Uint8Array): { keep: TileKind[]; need: TileKind[]; jokerRoom: number } {
  const keep: TileKind[] = [];
  const need: TileKind[] = [];
  let jokers = counts[JOKER];
  let jokerRoom = 0;
  for (let i = c.starts[a], end = c.starts[a + 1]; i < end; i += 3) {
    const kind = TILE_KINDS[c.flat[i]];
    const small = c.flat[i + 1];
    const big = c.flat[i + 2];
    const used = Math.min(counts[c.flat[i]], small + big);
    for (let k = 0; k < used; k++) keep.push(kind);
    const openSmall = Math.max(0, small - used);
    const openBig = big - Math.max(0, used - small);
    jokerRoom += openBig;
    const byJoker = Math.min(jokers, openBig);
    jokers -= byJoker;
    for (let k = 0; k < openSmall + openBig - byJoker; k++) need.push(kind);
  }
  for (let k = 0; k < counts[JOKER] - jokers; k++) keep.push('joker');
  return { keep, need, jokerRoom };
}

/**
 * The cheapest patterns first, like rankPatterns but by price: ties go to the hand that can
 * use more jokers, then to fewer tiles away, then to list order.
 */
export function rankByPrice(rack: readonly TileKind[], list: readonly Pattern[], limit = 5, unseen?: readonly TileKind[], callRate = DEFAULT_CALL_RATE): PricedPattern[] {
  const counts = countsOf(rack);
  const pool = unseenCounts(counts, unseen);
  const scored = list.map((pattern, order) => {
    const c = compiled(pattern);
    const prices = assignmentPrices(c, counts, pool, !buildsWithoutCalls(pattern), callRate);
    const a = cheapest(c, counts, prices);
    const { keep, need, jokerRoom } = keepAndNeed(c, a, counts);
    return { pattern, c, a, order, price: prices[a], away: HAND_SIZE - fitAt(c, a, counts), jokerRoom, keep, need };
  });
  scored.sort((x, y) => x.price - y.price || y.jokerRoom - x.jokerRoom || x.away - y.away || x.order - y.order || 0);
  return scored.slice(0, Math.max(0, limit)).map(({ pattern, c, a, price, away, jokerRoom, keep, need }) => ({
    pattern,
    price,
    away,
    jokerRoom,
    keep,
    need,
    missing: missingAt(pattern, c, a, counts, pool, callRate).missing,
  }));
}

/**
 * Finishing odds: the rest of a hand played out many times for one seat, seeded, so the same
 * rack, list and seed give the same figures on any machine.
 *
 * The model, per sample:
 * - The tiles this seat has not seen are shuffled once per sample (a partial Fisher–Yates
 *   from one seeded generator, each sample taking the same count of values from it). Each round takes four of them in turn: this seat's draw,
 *   then one discard from each of the three other players. So other players' discards are
 *   drawn from the same unseen pool. A round whose draw would run past the pool is not played.
 * - Every pattern and family is judged against that same order of tiles (common random
 *   numbers): comparisons between patterns, racks and draw counts differ only by the hand, not
 *   by luck. Because a sample's order never depends on how many rounds are played (up to
 *   ROUND_CAP), and a finished hand stays finished, more draws never lower the odds, sample by
 *   sample.
 * - The seat aims at a few concrete hands (a pattern with its suits and numbers fixed), the
 *   cheapest by price (price.ts). Its target is the one with the most tiles in place (ties:
 *   the cheaper at the start). Policy: a drawn tile that no aim can use is thrown at once;
 *   otherwise it is kept and the seat throws the tile that serves the fewest aims, never one
 *   the target uses (a joker only when no aim has room for it). Jokers fill groups of three
 *   or more only (the same counting as tilesAway).
 * - Claims: a discard the seat needs may be claimed with probability `callRate` (one uniform
 *   per discard, drawn whether used or not). A claim that finishes the hand is taken for any
 *   group and any hand, also one built without calls. Otherwise, only for a hand that may be
 *   exposed, a claim must complete a group of three or more at once, as an exposure: the rack
 *   already holds the group's singles and pairs of that kind and enough jokers for the rest
 *   of the group. After an exposure the seat keeps that target to the end.
 * - Pattern odds: the share of samples in which the seat, aiming only at that pattern (its
 *   cheapest few assignments), finishes it within `drawsLeft` draws. Family odds: the share in
 *   which the seat, aiming at every simulated pattern of the family at once and switching
 *   target as above, finishes any of them. Only the `nearest` patterns by price are simulated;
 *   the others, and families with none of them, are left out of the result (they are further
 *   than every pattern shown).
 *
 * Long because the play-out (draws, discards, jokers, calls) is one simulation whose parts share
 * its state; the discard policy is the seam to split along if it grows.
 */
import { rngFor } from '../random';
import type { TileKind } from '../tiles';
import { compiled, countsOf, fitAt } from './away';
import { JOKER as JOKER_KIND, KIND_COUNT as KINDS, type CompiledPattern } from './compile';
import { buildsWithoutCalls, HAND_SIZE as FULL_HAND, type Pattern } from './pattern';
import { assignmentPrices, cheapestAssignments, DEFAULT_CALL_RATE, OTHER_PLAYERS, unseenCounts } from './price';

// Local copies: imported bindings are read through accessors in some builds, too slow for the inner loops.
const JOKER = JOKER_KIND;
const KIND_COUNT = KINDS;
const HAND_SIZE = FULL_HAND;

export interface OddsOptions {
  /** Every tile this seat has not seen; by default the full set less the rack. */
  unseen?: readonly TileKind[];
  /** Draws this seat still has from the wall. */
  drawsLeft?: number;
  /** Hands played out; the standard error of a figure is at most 0.5 / √samples. */
  samples?: number;
  seed?: string;
  /** Chance that a needed discard can be claimed (0 turns claims off). */
  callRate?: number;
  /** How many patterns, cheapest by price, are played out. */
  nearest?: number;
  /** How many assignments (suits and numbers) of each pattern are aimed at. */
  assignments?: number;
}

export interface CompletionOdds {
  /** The simulated patterns, likeliest first (ties in list order). */
  patterns: { id: string; odds: number }[];
  /** Families with a simulated pattern, likeliest first (ties in list order). */
  families: { family: string; odds: number }[];
}

/**
 * Defaults: about 18 draws is what a seat has left early in play (99 wall tiles after the
 * deal, four seats drawing in turn, hands often ending before the wall does); 300 samples keep
 * the standard error under 3 points; ten patterns and three assignments each cover the hands
 * worth aiming at while the whole run stays within a few milliseconds.
 */
export const ODDS_DEFAULTS = { drawsLeft: 18, samples: 200, seed: 'rackside-odds', callRate: DEFAULT_CALL_RATE, nearest: 10, assignments: 3 } as const;

/**
 * Rounds every sample's order is drawn for, whatever the draws left: about the most a seat can
 * have (99 wall tiles after the deal, four seats drawing in turn). Up to this many draws, more
 * draws never lower the odds sample by sample; beyond it samples are drawn afresh.
 */
export const ROUND_CAP = 25;

/** An assignment is aimed at only if its price is within this of its pattern's cheapest (one exact tile with four copies left). */
const AIM_MARGIN = 1;

/** One concrete hand aimed at: what it needs of each kind, split into singles and pairs and bigger groups. */
interface Aim {
  need: Uint8Array;
  small: Uint8Array;
  exposable: boolean;
  /** Tiles in place and room for jokers on the dealt rack. */
  nat0: number;
  open0: number;
}

/** A set of aims played out together: one pattern's, or one family's. */
interface Plan {
  aims: Aim[];
  /** Most of each kind any aim can use, to throw useless draws at once. */
  maxNeed: Uint8Array;
  /** served[k * STEPS + n]: how many aims need at least n tiles of kind k. */
  served: Uint8Array;
  /** The kinds (not jokers) some aim uses, and whether some aim has a group a joker can join. */
  kinds: Int8Array;
  jokers: boolean;
  finished: number;
}

const STEPS = HAND_SIZE + 2;

function aimOf(c: CompiledPattern, a: number, counts: Uint8Array, exposable: boolean): Aim {
  const need = new Uint8Array(KIND_COUNT);
  const small = new Uint8Array(KIND_COUNT);
  for (let i = c.starts[a], end = c.starts[a + 1]; i < end; i += 3) {
    need[c.flat[i]] = c.flat[i + 1] + c.flat[i + 2];
    small[c.flat[i]] = c.flat[i + 1];
  }
  let nat0 = 0;
  let open0 = 0;
  for (let k = 0; k < KIND_COUNT; k++) {
    if (need[k] === 0) continue;
    const used = Math.min(counts[k], need[k]);
    nat0 += used;
    open0 += need[k] - small[k] - Math.max(0, used - small[k]);
  }
  return { need, small, exposable, nat0, open0 };
}

function planOf(aims: Aim[]): Plan {
  const maxNeed = new Uint8Array(KIND_COUNT);
  const served = new Uint8Array(KIND_COUNT * STEPS);
  for (const aim of aims) {
    for (let k = 0; k < KIND_COUNT; k++) {
      if (aim.need[k] > maxNeed[k]) maxNeed[k] = aim.need[k];
      for (let n = 1; n <= aim.need[k]; n++) served[k * STEPS + n]++;
    }
  }
  const kinds: number[] = [];
  for (let k = 0; k < KIND_COUNT; k++) if (k !== JOKER && maxNeed[k] > 0) kinds.push(k);
  const jokers = aims.some((aim) => aim.need.some((n, k) => n > aim.small[k]));
  return { aims, maxNeed, served, kinds: Int8Array.from(kinds), jokers, finished: 0 };
}

/** Working state of one play-out, reused between samples. */
class Player {
  readonly counts = new Uint8Array(KIND_COUNT);
  nat = new Int32Array(0);
  open = new Int32Array(0);
  size = 0;
  lockedJokers = 0;
  locked = -1;
  /** Kinds held beyond what any aim can use, as bits (kinds 0–31, then 32 on): tiles that serve nothing. */
  spareLow = 0;
  spareHigh = 0;
  private readonly startSpare: [number, number];

  constructor(
    readonly plan: Plan,
    private readonly start: Uint8Array,
  ) {
    this.nat = new Int32Array(plan.aims.length);
    this.open = new Int32Array(plan.aims.length);
    this.counts.set(start);
    for (let k = 0; k < KIND_COUNT; k++) if (k !== JOKER) this.mark(k);
    this.startSpare = [this.spareLow, this.spareHigh];
  }

  private mark(k: number) {
    const spare = this.counts[k] > this.plan.maxNeed[k];
    if (k < 32) this.spareLow = spare ? this.spareLow | (1 << k) : this.spareLow & ~(1 << k);
    else this.spareHigh = spare ? this.spareHigh | (1 << (k - 32)) : this.spareHigh & ~(1 << (k - 32));
  }

  reset() {
    this.counts.set(this.start);
    this.size = 0;
    for (let k = 0; k < KIND_COUNT; k++) this.size += this.start[k];
    const aims = this.plan.aims;
    for (let i = 0; i < aims.length; i++) {
      this.nat[i] = aims[i].nat0;
      this.open[i] = aims[i].open0;
    }
    this.lockedJokers = 0;
    this.locked = -1;
    this.spareLow = this.startSpare[0];
    this.spareHigh = this.startSpare[1];
  }

  fit(i: number): number {
    const jokers = this.counts[JOKER];
    return this.nat[i] + (jokers < this.open[i] ? jokers : this.open[i]);
  }

  finished(): boolean {
    if (this.locked >= 0) return this.fit(this.locked) === HAND_SIZE;
    for (let i = 0; i < this.plan.aims.length; i++) if (this.fit(i) === HAND_SIZE) return true;
    return false;
  }

  /** The aim with the most tiles in place; ties to the earlier (cheaper) one. */
  target(): number {
    if (this.locked >= 0) return this.locked;
    let best = 0;
    let bestFit = -1;
    for (let i = 0; i < this.plan.aims.length; i++) {
      const f = this.fit(i);
      if (f > bestFit) {
        best = i;
        bestFit = f;
      }
    }
    return best;
  }

  /** Whether any aim still open to the seat has room for one more of kind k. */
  useful(k: number): boolean {
    if (k === JOKER) {
      const jokers = this.counts[JOKER];
      for (let i = 0; i < this.plan.aims.length; i++) if ((this.locked < 0 || this.locked === i) && this.open[i] > jokers) return true;
      return false;
    }
    return this.counts[k] < this.plan.maxNeed[k];
  }

  add(k: number) {
    const have = ++this.counts[k];
    this.size++;
    if (k === JOKER) return;
    this.mark(k);
    const aims = this.plan.aims;
    for (let i = 0; i < aims.length; i++) {
      if (have > aims[i].need[k]) continue;
      this.nat[i]++;
      if (have > aims[i].small[k]) this.open[i]--;
    }
  }

  remove(k: number) {
    const have = this.counts[k]--;
    this.size--;
    if (k === JOKER) return;
    this.mark(k);
    const aims = this.plan.aims;
    for (let i = 0; i < aims.length; i++) {
      if (have > aims[i].need[k]) continue;
      this.nat[i]--;
      if (have > aims[i].small[k]) this.open[i]++;
    }
  }

  /** Whether one tile of kind k (held) counts toward aim i. */
  private serves(i: number, k: number): boolean {
    if (k === JOKER) return this.counts[JOKER] <= this.open[i];
    return this.counts[k] <= this.plan.aims[i].need[k];
  }

  /** Throw the held tile that serves the fewest aims, never one the target uses; jokers last; then the lowest kind. */
  discard() {
    // A held tile beyond what any aim can use serves nothing: the lowest such kind goes first.
    if (this.spareLow !== 0) {
      this.remove(31 - Math.clz32(this.spareLow & -this.spareLow));
      return;
    }
    if (this.spareHigh !== 0) {
      this.remove(63 - Math.clz32(this.spareHigh & -this.spareHigh));
      return;
    }
    const target = this.target();
    let pick = -1;
    let pickScore = Infinity;
    const served = this.plan.served;
    for (let k = 0; k < KIND_COUNT; k++) {
      if (this.counts[k] === 0) continue;
      let score = this.serves(target, k) ? 1000 : 0;
      if (this.locked >= 0) {
        // Only the target counts once the seat has exposed a group.
      } else if (k !== JOKER) score += 2 * served[k * STEPS + this.counts[k]];
      else for (let i = 0; i < this.plan.aims.length; i++) if (this.serves(i, k)) score += 2;
      if (k === JOKER) score += 1;
      if (score < pickScore) {
        pick = k;
        pickScore = score;
      }
    }
    this.remove(pick);
  }

  /** Claim a discard of kind k if it finishes the hand, or completes a group of the target as an exposure. */
  claim(k: number): boolean {
    if (k === JOKER || this.counts[k] >= this.plan.maxNeed[k]) return false;
    const t = this.target();
    // Only a hand one tile short can be finished by a claim; the target has the most tiles in place.
    if (this.fit(t) === HAND_SIZE - 1) {
      this.add(k);
      if (this.finished()) return true;
      this.remove(k);
    }
    const aim = this.plan.aims[t];
    const have = this.counts[k];
    const big = aim.need[k] - aim.small[k];
    const inBig = Math.max(0, Math.min(have, aim.need[k]) - aim.small[k]);
    const openGroup = big - inBig;
    if (aim.exposable && big > 0 && have >= aim.small[k] && openGroup >= 1 && openGroup - 1 <= this.counts[JOKER] - this.lockedJokers) {
      this.add(k);
      this.lockedJokers += openGroup - 1;
      this.locked = t;
      if (this.size > HAND_SIZE - 1) this.discard();
    }
    return false;
  }
}

/**
 * Where each kind turns up in one sample, as bits over rounds (bit r of word r / 32): this
 * seat's draws, and for each other player the discards whose claim chance came up. A play-out
 * then visits only the rounds where a kind its aims use turns up, in round order.
 */
class Sample {
  readonly draws: Int32Array;
  readonly claims: Int32Array;

  constructor(
    readonly words: number,
    readonly order: Int8Array,
  ) {
    this.draws = new Int32Array(KIND_COUNT * words);
    this.claims = new Int32Array(OTHER_PLAYERS * KIND_COUNT * words);
  }

  /** Index the first `length` tiles of the order: every fourth a draw, the three between discards. */
  index(uniforms: Float64Array, length: number, callRate: number) {
    this.draws.fill(0);
    this.claims.fill(0);
    const words = this.words;
    for (let at = 0; at < length; at++) {
      const round = at >> 2;
      const seat = at & 3;
      const bit = 1 << (round & 31);
      const k = this.order[at];
      if (seat === 0) this.draws[k * words + (round >> 5)] |= bit;
      else if (uniforms[at] < callRate) this.claims[((seat - 1) * KIND_COUNT + k) * words + (round >> 5)] |= bit;
    }
  }
}

/** Play one sample for a plan; true when the hand finishes. */
function playOut(player: Player, sample: Sample): boolean {
  player.reset();
  if (player.finished()) return true;
  while (player.size > HAND_SIZE - 1) player.discard();
  const { draws, claims, words, order } = sample;
  const { kinds, jokers } = player.plan;
  const second = KIND_COUNT * words;
  const third = 2 * second;
  for (let w = 0; w < words; w++) {
    let drawn = jokers ? draws[JOKER * words + w] : 0;
    let first = 0;
    let next = 0;
    let last = 0;
    for (let i = 0; i < kinds.length; i++) {
      const at = kinds[i] * words + w;
      drawn |= draws[at];
      first |= claims[at];
      next |= claims[second + at];
      last |= claims[third + at];
    }
    let any = drawn | first | next | last;
    while (any !== 0) {
      const bit = any & -any;
      any ^= bit;
      const base = 4 * (w * 32 + 31 - Math.clz32(bit));
      if (drawn & bit) {
        const k = order[base];
        if (player.useful(k)) {
          player.add(k);
          if (player.finished()) return true;
          if (player.size > HAND_SIZE - 1) player.discard();
        }
      }
      if (first & bit && player.claim(order[base + 1])) return true;
      if (next & bit && player.claim(order[base + 2])) return true;
      if (last & bit && player.claim(order[base + 3])) return true;
    }
  }
  return false;
}

/**
 * The odds of finishing each of the nearest patterns, and each of their families, within the
 * draws left. Seeded and deterministic; see the model at the top of this file.
 */
export function completionOdds(rack: readonly TileKind[], list: readonly Pattern[], options: OddsOptions = {}): CompletionOdds {
  const drawsLeft = Math.max(0, Math.floor(options.drawsLeft ?? ODDS_DEFAULTS.drawsLeft));
  const samples = Math.max(1, Math.floor(options.samples ?? ODDS_DEFAULTS.samples));
  const seed = options.seed ?? ODDS_DEFAULTS.seed;
  const callRate = Math.min(1, Math.max(0, options.callRate ?? ODDS_DEFAULTS.callRate));
  const nearest = Math.max(0, Math.floor(options.nearest ?? ODDS_DEFAULTS.nearest));
  const perPattern = Math.max(1, Math.floor(options.assignments ?? ODDS_DEFAULTS.assignments));

  const counts = countsOf(rack);
  const pool = unseenCounts(counts, options.unseen);

  // The cheapest patterns, each with its cheapest assignments.
  const priced = list.map((pattern, order) => {
    const c = compiled(pattern);
    const exposable = !buildsWithoutCalls(pattern);
    const prices = assignmentPrices(c, counts, pool, exposable, callRate);
    // Assignments much dearer than the cheapest are not worth aiming at.
    const ranked = cheapestAssignments(c, counts, prices, perPattern);
    const cheap = ranked.filter((a) => prices[a] < Infinity && prices[a] <= prices[ranked[0]] + AIM_MARGIN);
    const fit = cheap.length > 0 ? fitAt(c, cheap[0], counts) : 0;
    return { pattern, c, order, exposable, cheap, price: cheap.length > 0 ? prices[cheap[0]] : Infinity, fit };
  });
  priced.sort((x, y) => x.price - y.price || y.fit - x.fit || x.order - y.order || 0);
  const chosen = priced.slice(0, nearest);

  const patternPlans = chosen.map(({ c, cheap, exposable }) => planOf(cheap.map((a) => aimOf(c, a, counts, exposable))));
  const familyNames: string[] = [];
  for (const { pattern } of chosen) if (!familyNames.includes(pattern.family)) familyNames.push(pattern.family);
  // A family with one simulated pattern has that pattern's odds: no need to play it twice.
  const familyPlans = familyNames.map((family) => {
    const members = chosen.map((p, i) => ({ p, i })).filter(({ p }) => p.pattern.family === family);
    return members.length === 1 ? patternPlans[members[0].i] : planOf(members.flatMap(({ i }) => patternPlans[i].aims));
  });
  const plans = [...new Set([...patternPlans, ...familyPlans])].filter((plan) => plan.aims.length > 0);
  const players = plans.map((plan) => new Player(plan, counts));

  // The unseen tiles as kind indexes, shuffled afresh for each sample. One generator serves
  // every sample, and each sample takes the same number of values from it whatever the draws
  // left (up to ROUND_CAP rounds), so a sample's order never depends on the draws left.
  const base: number[] = [];
  for (let k = 0; k < KIND_COUNT; k++) for (let n = 0; n < pool[k]; n++) base.push(k);
  const shuffled = Math.min(4 * Math.max(ROUND_CAP, drawsLeft), base.length);
  const length = Math.min(4 * drawsLeft, base.length);
  const order = new Int8Array(base.length);
  const uniforms = new Float64Array(shuffled);
  const sample = new Sample(Math.max(1, Math.ceil(length / 4 / 32)), order);
  const rng = rngFor(seed, 'completion-odds');
  for (let s = 0; s < samples && players.length > 0; s++) {
    order.set(base);
    for (let i = 0; i < shuffled; i++) {
      // One value gives both the position and, from what is left over after taking the whole
      // part, an independent uniform for the claim chance (about 45 of its 52 random bits
      // remain). Every discard gets one whether it is used or not.
      const scaled = rng() * (base.length - i);
      const whole = Math.floor(scaled);
      const j = i + whole;
      const held = order[i];
      order[i] = order[j];
      order[j] = held;
      uniforms[i] = scaled - whole;
    }
    sample.index(uniforms, length, callRate);
    for (const player of players) if (playOut(player, sample)) player.plan.finished++;
  }

  const oddsOf = (plan: Plan) => (plan.aims.length === 0 ? 0 : plan.finished / samples);
  const patterns = chosen.map((p, i) => ({ id: p.pattern.id, odds: oddsOf(patternPlans[i]), order: p.order }));
  patterns.sort((x, y) => y.odds - x.odds || x.order - y.order);
  const families = familyNames.map((family, i) => ({ family, odds: oddsOf(familyPlans[i]), order: i }));
  families.sort((x, y) => y.odds - x.odds || x.order - y.order);
  return {
    patterns: patterns.map(({ id, odds }) => ({ id, odds })),
    families: families.map(({ family, odds }) => ({ family, odds })),
  };
}

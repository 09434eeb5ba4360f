/**
 * Pass advice: every legal pass, ranked by the finishing odds the rack keeps, with the defence
 * risk beside it, and reasons that say what each choice keeps and gives away, pros and cons
 * apart, against the choices around it.
 *
 * How a pass is judged:
 * 1. The patterns in view are the list's cheapest by price (price.ts), ADVICE.nearest of them,
 *    each with its cheapest choices of suits and numbers. The rack's odds of finishing them
 *    now (odds.ts) give the focus (focus.ts): live families, flexible and spare tiles.
 * 2. Every legal pass (never a joker; with blind allowed, every split of own and blind tiles)
 *    is first priced: the tiles kept, against each pattern in view, at its cheapest choice;
 *    the prices are pooled (a soft minimum, so two near hands count more than one) and each
 *    tile to arrive is credited ADVICE.arrival. This is quick and orders every pass.
 * 3. The best ADVICE.simulate passes by price (and the best of each blind count) are then
 *    played out by completionOdds on the tiles kept, with one more draw for each tile to
 *    arrive, on the same seed and the same unseen tiles as the rack before the pass (common
 *    random numbers: two passes are compared on the same draws). Their figure is a blend of
 *    the best pattern's odds and the best family's odds (keeping a family open is worth
 *    something while the hand is not picked).
 * 4. The score is that figure, less the defence risk (defence.ts) times ADVICE.defence, less a
 *    small prior for breaking a pair or giving a flower that a live family uses (a teacher
 *    wants a reason for either), less a hair of the price so ties go to the cheaper rack.
 *    Passes that were not played out rank below those that were, in price order.
 *
 * Long because ranking the passes, their reasons and how each compares with the choices around it
 * read as one argument; the wording of reasons is the part to move out if it grows.
 */
import type { ExchangeView, PassRecord, Phase } from '../exchange/types';
import { PASS_SIZE } from '../exchange/constants';
import { isSeat, type Seat } from '../seats';
import { rankOf, suitOf, TILE_KINDS, tileName, type TileKind } from '../tiles';
import { countsOf, tilesAwayCounts } from './away';
import { JOKER, KIND_COUNT, type CompiledPattern } from './compile';
import { passRisk, passTarget, readNeighbours, riskSentence, type NeighbourRead, type PassRisk } from './defence';
import { focusOf, needOf, percent, pricePatterns, servedBy, type FamilyFocus, type PricedPattern, type RackFocus } from './focus';
import { completionOdds, ODDS_DEFAULTS, type CompletionOdds } from './odds';
import type { Pattern } from './pattern';
import { assignmentPrices, unseenCounts } from './price';
import { countOf, joinWords, multipleOf, numberWord, pluralName } from './words';


/**
 * The advice's settings. Samples, patterns and passes played out keep the whole advice within
 * tens of milliseconds; the weights are teaching choices (no published source).
 */
export const ADVICE = {
  /** Patterns in view, cheapest by price. */
  nearest: 8,
  /** Choices of suits and numbers aimed at per pattern. */
  assignments: 2,
  /** Passes played out, best by price first. */
  simulate: 6,
  /** Of each blind count, at least this many are played out. */
  perBlind: 1,
  /** Hands played out per pass. */
  samples: 64,
  /** Draws left after the Charleston (as the odds assume), plus one per tile still to arrive. */
  drawsLeft: ODDS_DEFAULTS.drawsLeft,
  /** Weight of the best pattern's odds in the figure; the rest is the best family's. */
  patternShare: 0.5,
  /** Odds points (0–1 scale) one unit of defence risk costs. */
  defence: 0.01,
  /** Breaking a pair or pung (or giving one away): its cost in odds when a live family uses the kind, and when none does. */
  pairPrior: 0.012,
  deadPairPrior: 0.004,
  /** Giving away a flower a live family uses. */
  flowerPrior: 0.008,
  /** Each tile passed that a live family uses: with odds alike, spare tiles go first. */
  usePrior: 0.004,
  /** Price units credited for each tile to arrive. */
  arrival: 0.25,
  /** Softness of the pooled price: two hands this far apart in price count e-fold apart. */
  softness: 1,
  /** Odds per price unit: a tie-breaker between passes with the same odds. */
  priceTie: 0.0005,
} as const;

export interface AdviceContext {
  phase: Phase;
  blindAllowed: boolean;
  /** Tiles to send; default 3 (a courtesy pass sends the agreed count). */
  count?: number;
  /** No longer used: the patterns in view are the cheapest by price. Kept so older callers compile. */
  margin?: number;
  /** The seat choosing, for defence: with `history` and `kinds` it reads the neighbours. */
  seat?: Seat;
  /** The resolved passes as this seat sees them (ExchangeView.history). */
  history?: readonly PassRecord[];
  /** Kinds of the tile ids in `history` (ExchangeView.kinds). */
  kinds?: Readonly<Record<string, TileKind>>;
  /** Every tile this seat has not seen; by default the full set less the rack. */
  unseen?: readonly TileKind[];
  /** Seed of the odds; the same seed gives the same advice. */
  seed?: string;
  /** Hands played out per pass (default ADVICE.samples). */
  samples?: number;
  /** Passes played out (default ADVICE.simulate); 0 ranks by price alone. */
  simulate?: number;
}

export type ReasonKind = 'pro' | 'con' | 'defence';

/** One reason: a benefit, a drawback, or the risk of feeding the neighbour. */
export interface Reason {
  kind: ReasonKind;
  text: string;
}

export interface PassAdvice {
  /** Own tiles to send (never a joker); tiles.length + blind = the pass size. */
  tiles: TileKind[];
  /** Arriving tiles to forward unseen. */
  blind: number;
  /** Higher is better: the odds figure (0–1) less the defence and the priors; passes not played out score below every one that was. */
  score: number;
  /** Finishing odds of the best pattern now and after this pass (tiles to arrive counted as draws); null when not played out. */
  odds: { before: number; after: number } | null;
  /** after − before, when played out. */
  gain: number | null;
  /** The risk of feeding the neighbour the pass goes to. */
  risk: PassRisk;
  /** Every reason, pros, cons and defence apart. */
  details: Reason[];
  /** The same reasons as plain text, for older callers. */
  reasons: string[];
  /** The pattern the kept tiles are likeliest to finish (or cheapest, when not played out), its tiles away before new tiles arrive, and its odds. */
  toward: { id: string; name: string; away: number; odds: number | null } | null;
}

/** Everything the advice worked out: the passes, best first, the rack's focus, and what each neighbour seems to do. */
export interface AdviceResult {
  advice: PassAdvice[];
  focus: RackFocus;
  neighbours: NeighbourRead[];
}

/** Every multiset of `size` kinds drawn from `counts` (kind indices, ascending). Jokers are never chosen. */
export function passChoices(counts: Uint8Array, size: number): number[][] {
  const kinds: number[] = [];
  for (let k = 0; k < KIND_COUNT; k++) if (k !== JOKER && counts[k] > 0) kinds.push(k);
  const out: number[][] = [];
  const pick: number[] = [];
  const walk = (from: number) => {
    if (pick.length === size) {
      out.push([...pick]);
      return;
    }
    for (let i = from; i < kinds.length; i++) {
      const k = kinds[i];
      const used = pick.filter((p) => p === k).length;
      if (used >= counts[k]) continue;
      pick.push(k);
      walk(used + 1 < counts[k] ? i : i + 1);
      pick.pop();
    }
  };
  walk(0);
  return out;
}

/** The advice context for a seat's view of an exchange: its pass, and its history for defence. */
export function adviceContextFor(view: ExchangeView): AdviceContext {
  return {
    phase: view.phase,
    blindAllowed: view.blindAllowed,
    count: view.passSize,
    seat: isSeat(view.viewer) ? view.viewer : undefined,
    history: view.history,
    kinds: view.kinds,
  };
}

/** One pattern in view, cut down to its cheapest choices, for quick pricing of many passes. */
interface Aimed {
  p: PricedPattern;
  mini: CompiledPattern;
}

function cutDown(c: CompiledPattern, picks: readonly number[]): CompiledPattern {
  const flat: number[] = [];
  const starts: number[] = [];
  for (const a of picks) {
    starts.push(flat.length);
    for (let i = c.starts[a]; i < c.starts[a + 1]; i++) flat.push(c.flat[i]);
  }
  starts.push(flat.length);
  return { pattern: c.pattern, assignments: picks.map((a) => c.assignments[a]), flat: Int16Array.from(flat), starts: Int32Array.from(starts) };
}

interface Option {
  passed: number[];
  blind: number;
  own: number;
  kept: Uint8Array;
  /** Pooled price after the pass, less the arrivals' credit: lower is better. */
  est: number;
  /** The cheapest pattern for the kept tiles, by price. */
  cheapest: number;
  risk: PassRisk;
  prior: number;
  odds: CompletionOdds | null;
  /** Best pattern's odds after, and the blended figure. */
  best: number;
  figure: number;
  score: number;
}

/** The blend of best pattern and best family the advice ranks by. */
function figureOf(odds: CompletionOdds): { best: number; figure: number } {
  const best = odds.patterns[0]?.odds ?? 0;
  const family = odds.families[0]?.odds ?? 0;
  return { best, figure: ADVICE.patternShare * best + (1 - ADVICE.patternShare) * family };
}

/**
 * Rank every legal pass, best first, and say why. Options with the same kinds are one option.
 * See the top of this file for how a pass is judged.
 */
export function advisePass(hand: readonly TileKind[], list: readonly Pattern[], context: AdviceContext): PassAdvice[] {
  return adviseRack(hand, list, context).advice;
}

/** The advice with the focus and the neighbours' reads it rests on. */
export function adviseRack(hand: readonly TileKind[], list: readonly Pattern[], context: AdviceContext): AdviceResult {
  const count = context.count ?? PASS_SIZE;
  const counts = countsOf(hand);
  const pool = unseenCounts(counts, context.unseen);
  const unseen: TileKind[] = [];
  for (let k = 0; k < KIND_COUNT; k++) for (let n = 0; n < pool[k]; n++) unseen.push(TILE_KINDS[k]);
  const seed = context.seed ?? 'rackside-advice';
  const samples = Math.max(1, Math.floor(context.samples ?? ADVICE.samples));
  const simulate = Math.max(0, Math.floor(context.simulate ?? ADVICE.simulate));

  // 1. The patterns in view and the rack's odds now.
  const played = pricePatterns(counts, pool, list)
    .filter((p) => Number.isFinite(p.price) && p.cheap.length > 0)
    .slice(0, ADVICE.nearest);
  const inView = played.map((p) => p.pattern);
  const oddsOptions = (drawsLeft: number) => ({ unseen, seed, samples, drawsLeft, nearest: ADVICE.nearest, assignments: ADVICE.assignments });
  const before = completionOdds(hand, inView, oddsOptions(ADVICE.drawsLeft));
  const focus = focusOf(counts, played, before, context.phase);
  const beforeBest = before.patterns[0]?.odds ?? 0;

  // What the live families use of each kind, and what any pattern in view uses.
  const liveServed = focus.live.map((f) => servedBy(f, played));
  const liveMost = new Uint8Array(KIND_COUNT);
  for (const s of liveServed) for (let k = 0; k < KIND_COUNT; k++) if (s[k] > liveMost[k]) liveMost[k] = s[k];
  const viewMost = new Uint8Array(KIND_COUNT);
  const viewUser: (PricedPattern | null)[] = new Array(KIND_COUNT).fill(null);
  for (const p of played) {
    for (const a of p.cheap) {
      const need = needOf(p.c, a);
      for (let k = 0; k < KIND_COUNT; k++) {
        if (need[k] > viewMost[k]) viewMost[k] = need[k];
        if (need[k] > 0 && !viewUser[k]) viewUser[k] = p;
      }
    }
  }

  // Defence: what the neighbours seem to do, and who this pass goes to.
  const neighbours = context.seat && context.history && context.kinds ? readNeighbours({ seat: context.seat, history: context.history, kinds: context.kinds }) : [];
  const target = passTarget(context.seat, context.phase);
  const read = neighbours.find((n) => n.seat === target.to) ?? null;

  // 2. Every legal pass, priced.
  const aimed: Aimed[] = played.map((p) => ({ p, mini: cutDown(p.c, p.cheap.slice(0, ADVICE.assignments)) }));
  const options: Option[] = [];
  const maxBlind = context.blindAllowed ? count : 0;
  for (let blind = 0; blind <= maxBlind; blind++) {
    const own = count - blind;
    for (const passed of passChoices(counts, own)) {
      const kept = counts.slice();
      for (const k of passed) kept[k]--;
      let pooled = 0;
      let cheapest = -1;
      let cheapestPrice = Infinity;
      aimed.forEach(({ p, mini }, i) => {
        const prices = assignmentPrices(mini, kept, pool, p.exposable);
        let price = Infinity;
        for (const x of prices) if (x < price) price = x;
        if (Number.isFinite(price)) pooled += Math.exp(-price / ADVICE.softness);
        if (price < cheapestPrice) {
          cheapestPrice = price;
          cheapest = i;
        }
      });
      const est = (pooled > 0 ? -ADVICE.softness * Math.log(pooled) : 1000) - own * ADVICE.arrival;
      const tiles = passed.map((k) => TILE_KINDS[k]);
      const risk = passRisk(tiles, target.direction, read);
      options.push({ passed, blind, own, kept, est, cheapest, risk, prior: priorOf(passed, counts, liveMost), odds: null, best: 0, figure: 0, score: 0 });
    }
  }
  options.sort((x, y) => x.est + 0.2 * x.risk.score - (y.est + 0.2 * y.risk.score) || x.blind - y.blind || keyOf(x).localeCompare(keyOf(y)));

  // 3. The best by price are played out, and the best of each blind count.
  const chosen = new Set<Option>(options.slice(0, simulate));
  if (simulate > 0) {
    for (let blind = 0; blind <= maxBlind; blind++) options.filter((o) => o.blind === blind).slice(0, ADVICE.perBlind).forEach((o) => chosen.add(o));
  }
  if (inView.length > 0) {
    for (const o of chosen) {
      const keptKinds: TileKind[] = [];
      for (let k = 0; k < KIND_COUNT; k++) for (let n = 0; n < o.kept[k]; n++) keptKinds.push(TILE_KINDS[k]);
      o.odds = completionOdds(keptKinds, inView, oddsOptions(ADVICE.drawsLeft + o.own));
      Object.assign(o, figureOf(o.odds));
    }
  }

  // 4. Scores: played-out passes by their figure, the rest below them in price order.
  const stageKey = (o: Option) => o.est + 0.2 * o.risk.score;
  const penalty = (o: Option) => ADVICE.defence * o.risk.score + o.prior + ADVICE.priceTie * Math.min(o.est, 100);
  if (inView.length === 0) {
    // Nothing to aim at: only the defence and the priors tell passes apart.
    for (const o of options) o.score = -(ADVICE.defence * o.risk.score + o.prior);
  } else {
    let floor = Infinity;
    for (const o of options) {
      if (!o.odds) continue;
      o.score = o.figure - penalty(o);
      floor = Math.min(floor, o.score);
    }
    const rest = options.filter((o) => !o.odds);
    if (!Number.isFinite(floor)) floor = 0;
    const top = rest.length > 0 ? stageKey(rest[0]) : 0;
    for (const o of rest) o.score = floor - 0.001 - ADVICE.priceTie * (stageKey(o) - top);
  }
  options.sort((x, y) => y.score - x.score || x.blind - y.blind || keyOf(x).localeCompare(keyOf(y)));

  // 5. Reasons, comparing each of the first few with its neighbours in the ranking.
  const words = new Words(counts, pool, focus, liveServed, liveMost, viewMost, viewUser);
  const advice = options.map((o, i): PassAdvice => {
    const details = words.reasonsFor(o, i, options, beforeBest, played);
    const towardIndex = o.odds ? played.findIndex((p) => p.pattern.id === o.odds!.patterns[0]?.id) : o.cheapest;
    const toward = towardIndex >= 0 ? played[towardIndex].pattern : null;
    return {
      tiles: o.passed.map((k) => TILE_KINDS[k]),
      blind: o.blind,
      score: o.score,
      odds: o.odds ? { before: beforeBest, after: o.best } : null,
      gain: o.odds ? o.best - beforeBest : null,
      risk: o.risk,
      details,
      reasons: details.map((d) => d.text),
      toward: toward ? { id: toward.id, name: toward.name, away: tilesAwayCounts(o.kept, toward), odds: o.odds ? (o.odds.patterns.find((p) => p.id === toward.id)?.odds ?? 0) : null } : null,
    };
  });
  return { advice, focus, neighbours };
}

/** The teacher's priors: breaking a pair or pung, giving a flower a live family uses, passing a tile a live family uses. */
function priorOf(passed: readonly number[], counts: Uint8Array, liveMost: Uint8Array): number {
  let prior = 0;
  const seen = new Set<number>();
  for (const k of passed) {
    if (seen.has(k)) continue;
    seen.add(k);
    if (counts[k] >= 2) prior += liveMost[k] > 0 ? ADVICE.pairPrior : ADVICE.deadPairPrior;
    if (TILE_KINDS[k] === 'flower' && liveMost[k] > 0) prior += ADVICE.flowerPrior;
    const n = passed.filter((x) => x === k).length;
    prior += ADVICE.usePrior * Math.min(n, Math.max(0, liveMost[k] - (counts[k] - n)));
  }
  return prior;
}

function capital(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function keyOf(o: Pick<Option, 'passed'>): string {
  return o.passed.map((k) => String(k).padStart(2, '0')).join(',');
}

const ORDINALS = ['first', 'second', 'third', 'fourth', 'fifth', 'sixth'];
/** How many of the top passes get reasons that compare them with their neighbours in the ranking. */
const COMPARED = 5;

/** The words of the advice: what each tile does for the rack, and each pass's reasons. */
class Words {
  constructor(
    private readonly counts: Uint8Array,
    private readonly pool: Uint8Array,
    private readonly focus: RackFocus,
    private readonly liveServed: Uint8Array[],
    private readonly liveMost: Uint8Array,
    private readonly viewMost: Uint8Array,
    private readonly viewUser: (PricedPattern | null)[],
  ) {}

  /** The live families a kind serves. */
  users(k: number): FamilyFocus[] {
    return this.focus.live.filter((_, i) => this.liveServed[i][k] > 0);
  }

  /** Of `n` tiles of kind k passed, how many a live family wanted (the rest are spare). */
  serving(k: number, n: number): number {
    const kept = this.counts[k] - n;
    return Math.min(n, Math.max(0, this.liveMost[k] - kept));
  }

  /** What one tile does for the rack, in a few words. */
  role(k: number): string {
    const users = this.users(k);
    if (users.length >= 2) return `a tile for ${numberWord(users.length)} live families: ${joinWords(users.slice(0, 2).map((f) => f.lean))}`;
    if (users.length === 1) return `a tile for ${users[0].lean}`;
    const user = this.viewMost[k] > 0 ? this.viewUser[k] : null;
    if (user) return `it could still serve ${user.pattern.name}, a hand further off`;
    const kind = TILE_KINDS[k];
    const suit = suitOf(kind);
    if (suit) {
      for (let j = 0; j < KIND_COUNT; j++) {
        const other = TILE_KINDS[j];
        if (j !== k && this.counts[j] > 0 && suitOf(other) === suit && Math.abs(rankOf(other)! - rankOf(kind)!) <= 2) return `it sits near your ${tileName(other)}, a run in the making`;
      }
      if (this.pool[k] <= 1) return 'few of it are left to come';
      return 'it works with nothing else on your rack';
    }
    if (kind === 'flower') return 'no live family uses flowers';
    return `a lone ${kind.startsWith('wind') ? 'wind' : 'dragon'} with no partner`;
  }

  /** "the 5 bam", "two north winds". */
  named(kinds: readonly number[]): string {
    const byKind = new Map<number, number>();
    for (const k of kinds) byKind.set(k, (byKind.get(k) ?? 0) + 1);
    return joinWords([...byKind].map(([k, n]) => (n === 1 ? `the ${tileName(TILE_KINDS[k])}` : countOf(TILE_KINDS[k], n))));
  }

  /** Tiles with their roles: "the 5 bam (it serves evens)". */
  withRoles(kinds: readonly number[]): string {
    const distinct = [...new Set(kinds)];
    return joinWords(distinct.map((k) => `${this.named(kinds.filter((x) => x === k))} (${this.role(k)})`));
  }

  reasonsFor(o: Option, i: number, ranked: readonly Option[], beforeBest: number, played: readonly PricedPattern[]): Reason[] {
    const out: Reason[] = [];
    const first = ranked[0];
    const bestName = o.odds?.patterns[0] ? (played.find((p) => p.pattern.id === o.odds!.patterns[0].id)?.pattern.name ?? null) : null;

    // The odds, against the rack as it is and against the first choice.
    if (o.odds && bestName) {
      if (i === 0) out.push({ kind: 'pro', text: `Best odds of the passes weighed: ${percent(o.best)} to finish ${bestName} after it (${percent(beforeBest)} with the rack as it is).` });
      else {
        const behind = Math.round(100 * (first.best - o.best));
        if (behind >= 1) out.push({ kind: 'con', text: `${capital(percent(o.best))} to finish ${bestName}: ${numberWord(behind)} point${behind > 1 ? 's' : ''} below the first choice.` });
        else out.push({ kind: 'pro', text: `${capital(percent(o.best))} to finish ${bestName}, as good as the first choice on odds.` });
      }
    }

    // What goes: spare tiles are a benefit, tiles a live family uses a cost.
    const spare: number[] = [];
    const costly: number[] = [];
    const byKind = new Map<number, number>();
    for (const k of o.passed) byKind.set(k, (byKind.get(k) ?? 0) + 1);
    for (const [k, n] of byKind) {
      const serving = this.serving(k, n);
      for (let j = 0; j < n; j++) (j < n - serving ? spare : costly).push(k);
    }
    const pairs = [...byKind].filter(([k]) => this.counts[k] >= 2);
    const plainSpare = spare.filter((k) => !pairs.some(([p]) => p === k) && TILE_KINDS[k] !== 'flower');
    if (plainSpare.length > 0) out.push({ kind: 'pro', text: `Passes ${this.named(plainSpare)}: no live family uses ${plainSpare.length > 1 ? 'them' : 'it'}.` });
    for (const k of new Set(costly)) {
      if (this.counts[k] >= 2 || TILE_KINDS[k] === 'flower') continue;
      const users = this.users(k);
      out.push({ kind: 'con', text: `Gives up ${this.named([k])}, a tile for ${joinWords(users.slice(0, 2).map((f) => f.lean))}.` });
    }
    for (const [k, n] of pairs) {
      const what = n >= this.counts[k] ? `Gives away your ${multipleOf(TILE_KINDS[k], this.counts[k])}` : `Breaks your ${multipleOf(TILE_KINDS[k], this.counts[k])}`;
      const users = this.users(k);
      out.push({
        kind: 'con',
        text: users.length === 0 ? `${what}, but no live family uses ${pluralName(TILE_KINDS[k])}.` : `${what}: ${pluralName(TILE_KINDS[k])} are tiles for ${joinWords(users.slice(0, 2).map((f) => f.lean))}.`,
      });
    }
    const flowers = byKind.get(TILE_KINDS.indexOf('flower')) ?? 0;
    if (flowers > 0 && this.counts[TILE_KINDS.indexOf('flower')] < 2) {
      const users = this.users(TILE_KINDS.indexOf('flower'));
      out.push({ kind: 'con', text: users.length === 0 ? 'Gives away a flower, but no live family uses flowers.' : `Gives away a flower, a tile for ${users[0].lean}.` });
    }

    // Against its neighbours in the ranking: what it keeps that they give away.
    if (i < COMPARED && ranked.length > 1) {
      if (i === 0) out.push(...this.compare(o, ranked[1], 'second', true));
      else out.push(...this.compare(o, i === 1 ? first : ranked[i - 1], ORDINALS[i === 1 ? 0 : i - 1], false));
    }

    // What it keeps together.
    const kept: string[] = [];
    for (let k = 0; k < KIND_COUNT; k++) if (k !== JOKER && this.counts[k] >= 2 && o.kept[k] === this.counts[k]) kept.push(multipleOf(TILE_KINDS[k], this.counts[k]));
    if (kept.length > 0 && pairs.length === 0) out.push({ kind: 'pro', text: `Keeps your ${joinWords(kept.slice(0, 3))}${kept.length > 3 ? ' and more' : ''}.` });
    if (this.counts[JOKER] > 0) {
      out.push(
        this.focus.deadJokers > 0
          ? { kind: 'con', text: `No live family has room for your joker${this.counts[JOKER] > 1 ? 's' : ''} yet.` }
          : { kind: 'pro', text: `Your joker${this.counts[JOKER] > 1 ? 's stay' : ' stays'} useful: the hands in view have pungs to fill.` },
      );
    }
    if (o.blind > 0) {
      out.push({
        kind: 'pro',
        text:
          o.own === 0
            ? `Forwards all ${numberWord(o.blind)} arriving tiles blind, so your rack stays as it is.`
            : `Forwards ${numberWord(o.blind)} arriving tile${o.blind > 1 ? 's' : ''} blind, so you keep more of your own.`,
      });
    }
    out.push({ kind: 'defence', text: riskSentence(o.risk) });
    return out;
  }

  /** Why `o` ranks above (`ahead`) or below `other`: the tiles one keeps that the other gives away, with what they do. */
  compare(o: Option, other: Option, otherName: string, ahead: boolean): Reason[] {
    const mine = [...o.passed];
    const theirs = [...other.passed];
    for (const k of o.passed) {
      const at = theirs.indexOf(k);
      if (at >= 0) {
        theirs.splice(at, 1);
        mine.splice(mine.indexOf(k), 1);
      }
    }
    const out: Reason[] = [];
    const choice = `the ${otherName} choice`;
    const useful = (kinds: readonly number[]) => kinds.some((k) => this.users(k).length > 0);
    if (mine.length > 0 && theirs.length > 0 && !useful(mine) && !useful(theirs) && Math.abs(o.best - other.best) < 0.005) {
      // Only loose tiles differ and the odds are level: say so rather than dress a tie as a win.
      out.push({ kind: 'pro', text: `Level with ${choice}: it passes ${this.withRoles(mine)} where ${choice} passes ${this.withRoles(theirs)}.` });
    } else if (ahead) {
      if (theirs.length > 0) out.push({ kind: 'pro', text: `Better than ${choice}: keeps ${this.withRoles(theirs)}, which ${choice} gives away.` });
      // Tiles it gives up that a live family uses are already told as drawbacks above.
      if (mine.length > 0 && !useful(mine)) out.push({ kind: 'pro', text: `Passes ${this.withRoles(mine)} where ${choice} keeps ${mine.length > 1 ? 'them' : 'it'}.` });
      if (o.blind !== other.blind) out.push({ kind: 'pro', text: o.blind > other.blind ? `Forwards ${numberWord(o.blind - other.blind)} more blind than ${choice}.` : `Sends its own tiles where ${choice} forwards blind.` });
    } else {
      if (mine.length > 0) out.push({ kind: 'con', text: `Behind ${choice}: gives away ${this.withRoles(mine)}, which ${choice} keeps.` });
      if (theirs.length > 0) {
        out.push(
          useful(theirs)
            ? { kind: 'pro', text: `Keeps ${this.withRoles(theirs)}, which ${choice} passes.` }
            : { kind: 'con', text: `Holds on to ${this.withRoles(theirs)}, which ${choice} passes.` },
        );
      }
    }
    if (Math.abs(o.risk.score - other.risk.score) >= 0.1) {
      const safer = o.risk.score < other.risk.score;
      out.push({ kind: 'defence', text: safer ? `Safer to give than ${choice}.` : `Riskier to give than ${choice}.` });
    }
    return out;
  }
}


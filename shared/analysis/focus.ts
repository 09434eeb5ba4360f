/**
 * Focus, the way a teacher speaks of a rack: which families are live ("lean to evens", "runs
 * still open from 3 to 6"), which tiles serve several live families (flexible), which serve
 * none (spare), and whether it is time to pick a hand or to keep gathering.
 *
 * It rests on the finishing odds (odds.ts) and the price of the missing tiles (price.ts):
 * - A family is live when its odds of finishing are at least LIVE.share of the best family's,
 *   or when its cheapest pattern costs at most LIVE.priceMargin more than the cheapest of all
 *   (early in a hand odds are small and close, and price tells them apart). At most LIVE.max.
 * - A family's hands are its patterns' cheapest choices of suits and numbers (the ones the
 *   odds play out); what they have in common is what the family is called in words.
 * - A tile serves a family when one of those hands uses it (a second copy only if the hand
 *   uses two). Flexible: serves two live families or more. Spare: serves none.
 * - Pick a hand when the likeliest family has odds worth the name (PICK.minOdds) and is the
 *   only one live, or has at least PICK.lead times the odds of the next; otherwise keep gathering.
 *
 * Long because each family's test of being live sits beside the words a teacher uses for it;
 * splitting them apart would separate a rule from its explanation.
 */
import type { Phase } from '../exchange/types';
import { suitOf, rankOf, TILE_KINDS, type Suit, type TileKind } from '../tiles';
import { compiled, countsOf, fitAt } from './away';
import { JOKER, KIND_COUNT, type CompiledPattern } from './compile';
import { completionOdds, type CompletionOdds } from './odds';
import { buildsWithoutCalls, type Pattern } from './pattern';
import { assignmentPrices, cheapestAssignments, DEFAULT_CALL_RATE, unseenCounts } from './price';
import { countOf, joinWords, numberWord, pluralName } from './words';

/** When a family counts as live (a teaching choice, no published source). */
export const LIVE = { share: 0.4, priceMargin: 1, max: 5 } as const;
/** When to pick a hand: the likeliest family this many times the next (later passes: `lateLead`). */
export const PICK = { lead: 2, lateLead: 1.5, minOdds: 0.05 } as const;
/** An assignment is one of a pattern's hands while its price is within this of the pattern's cheapest (as odds.ts aims). */
const AIM_MARGIN = 1;
const AIMS_PER_PATTERN = 3;

/** A pattern priced against the rack: its cheapest hands (assignments) and their needs. */
export interface PricedPattern {
  pattern: Pattern;
  c: CompiledPattern;
  order: number;
  exposable: boolean;
  price: number;
  /** Tiles in place for its cheapest hand. */
  fit: number;
  /** Assignment indexes within AIM_MARGIN of the cheapest, cheapest first. */
  cheap: number[];
  /** Tiles of groups of three or more its cheapest hand still lacks: room for jokers. */
  jokerRoom: number;
}

/** Every pattern of the list priced, cheapest first (ties: more tiles in place, then list order), as the odds choose them. */
export function pricePatterns(counts: Uint8Array, pool: Uint8Array, list: readonly Pattern[], callRate = DEFAULT_CALL_RATE): PricedPattern[] {
  const out = list.map((pattern, order): PricedPattern => {
    const c = compiled(pattern);
    const exposable = !buildsWithoutCalls(pattern);
    const prices = assignmentPrices(c, counts, pool, exposable, callRate);
    const ranked = cheapestAssignments(c, counts, prices);
    const price = ranked.length > 0 ? prices[ranked[0]] : Infinity;
    const cheap = ranked.filter((a) => prices[a] <= price + AIM_MARGIN).slice(0, AIMS_PER_PATTERN);
    return { pattern, c, order, exposable, price, fit: cheap.length > 0 ? fitAt(c, cheap[0], counts) : 0, cheap, jokerRoom: cheap.length > 0 ? jokerRoomAt(c, cheap[0], counts) : 0 };
  });
  return out.sort((x, y) => x.price - y.price || y.fit - x.fit || x.order - y.order);
}

/** Tiles of groups of three or more that naturals do not fill at assignment `a`. */
export function jokerRoomAt(c: CompiledPattern, a: number, counts: Uint8Array): number {
  let open = 0;
  for (let i = c.starts[a], end = c.starts[a + 1]; i < end; i += 3) {
    const have = counts[c.flat[i]];
    const small = c.flat[i + 1];
    const big = c.flat[i + 2];
    const used = Math.min(have, small + big);
    open += used > small ? big - (used - small) : big;
  }
  return open;
}

/** What one hand needs of each kind. */
export function needOf(c: CompiledPattern, a: number): Uint8Array {
  const need = new Uint8Array(KIND_COUNT);
  for (let i = c.starts[a], end = c.starts[a + 1]; i < end; i += 3) need[c.flat[i]] = c.flat[i + 1] + c.flat[i + 2];
  return need;
}

function hasBigGroups(c: CompiledPattern, a: number): boolean {
  for (let i = c.starts[a], end = c.starts[a + 1]; i < end; i += 3) if (c.flat[i + 2] > 0) return true;
  return false;
}

export interface FamilyFocus {
  family: string;
  /** Odds of finishing any of its simulated patterns (0 when none was simulated). */
  odds: number;
  /** Price of its cheapest pattern. */
  price: number;
  live: boolean;
  /** What its hands have in common, in plain words: "evens", "runs from 3 to 6 in dots". */
  lean: string;
  /** Whether its hands are runs (then the teacher says "runs still open from … to …"). */
  runs: boolean;
  /** Its patterns still worth aiming at, likeliest first. */
  patterns: { id: string; name: string; odds: number }[];
  /** Whether any of its hands has room for a joker. */
  takesJokers: boolean;
}

export interface RackFocus {
  /** Families with a pattern near enough to play out, likeliest first. */
  families: FamilyFocus[];
  /** The live ones, likeliest first. */
  live: FamilyFocus[];
  /** Tiles (by kind) that serve two live families or more, with the families. */
  flexible: { kind: TileKind; families: string[] }[];
  /** Tiles that serve no live family, one entry per tile (jokers never: they cannot be passed). */
  spare: TileKind[];
  /** Jokers on the rack that no live family has room for. */
  deadJokers: number;
  /** Time to pick a hand (true), or keep gathering. */
  pick: boolean;
  /** The likeliest pattern, and its odds. */
  best: { id: string; name: string; family: string; odds: number; takesJokers: boolean } | null;
  /** What a teacher would say, one sentence each, most important first. */
  words: string[];
}

export interface FocusOptions {
  /** Every tile this seat has not seen; by default the full set less the rack. */
  unseen?: readonly TileKind[];
  seed?: string;
  samples?: number;
  drawsLeft?: number;
  /** The pass being chosen: late passes pick a hand sooner. */
  phase?: Phase;
}

/** How many patterns, cheapest by price, the focus plays out. */
export const FOCUS_NEAREST = 10;

/** The focus of a rack: live families in words, flexible and spare tiles, and whether to pick a hand yet. */
export function rackFocus(rack: readonly TileKind[], list: readonly Pattern[], options: FocusOptions = {}): RackFocus {
  const counts = countsOf(rack);
  const pool = unseenCounts(counts, options.unseen);
  const priced = pricePatterns(counts, pool, list);
  const odds = completionOdds(rack, list, {
    unseen: options.unseen,
    seed: options.seed,
    samples: options.samples,
    drawsLeft: options.drawsLeft,
    nearest: FOCUS_NEAREST,
  });
  return focusOf(counts, priced.slice(0, FOCUS_NEAREST), odds, options.phase);
}

/** The focus from what the advice has already worked out: the priced patterns played out, and their odds. */
export function focusOf(counts: Uint8Array, played: readonly PricedPattern[], odds: CompletionOdds, phase?: Phase): RackFocus {
  const patternOdds = new Map(odds.patterns.map((p) => [p.id, p.odds]));
  const familyOdds = new Map(odds.families.map((f) => [f.family, f.odds]));
  const byFamily = new Map<string, PricedPattern[]>();
  for (const p of played) {
    if (!Number.isFinite(p.price) || p.cheap.length === 0) continue;
    const list = byFamily.get(p.pattern.family) ?? [];
    list.push(p);
    byFamily.set(p.pattern.family, list);
  }
  const bestPrice = Math.min(...[...byFamily.values()].map((ps) => ps[0].price));
  const bestOdds = Math.max(0, ...[...byFamily.keys()].map((f) => familyOdds.get(f) ?? 0));

  const families = [...byFamily].map(([family, members]) => {
    const fOdds = familyOdds.get(family) ?? 0;
    const price = members[0].price;
    const topOdds = Math.max(...members.map((m) => patternOdds.get(m.pattern.id) ?? 0));
    // Its hands: the patterns near its best, by odds or by price.
    const near = members.filter((m) => (patternOdds.get(m.pattern.id) ?? 0) >= LIVE.share * topOdds && (topOdds > 0 || m.price <= price + LIVE.priceMargin));
    const hands = near.flatMap((m) => m.cheap.map((a) => ({ m, a })));
    const { lean, runs } = describe(hands.map(({ m, a }) => ({ need: needOf(m.c, a), pairsOnly: !hasBigGroups(m.c, a) })), family);
    return {
      family,
      odds: fOdds,
      price,
      live: false,
      lean,
      runs,
      patterns: near
        .map((m) => ({ id: m.pattern.id, name: m.pattern.name, odds: patternOdds.get(m.pattern.id) ?? 0 }))
        .sort((x, y) => y.odds - x.odds),
      takesJokers: hands.some(({ m, a }) => jokerRoomAt(m.c, a, counts) > 0),
      hands,
    };
  });
  families.sort((x, y) => y.odds - x.odds || x.price - y.price);
  let liveCount = 0;
  for (const f of families) {
    const byOdds = bestOdds > 0 && f.odds >= LIVE.share * bestOdds;
    const byPrice = f.price <= bestPrice + LIVE.priceMargin;
    if ((byOdds || byPrice) && liveCount < LIVE.max) {
      f.live = true;
      liveCount++;
    }
  }
  const live = families.filter((f) => f.live);

  // What each live family can use of each kind on the rack.
  const served = live.map((f) => {
    const most = new Uint8Array(KIND_COUNT);
    for (const { m, a } of f.hands) {
      const need = needOf(m.c, a);
      for (let k = 0; k < KIND_COUNT; k++) if (need[k] > most[k]) most[k] = need[k];
    }
    return most;
  });
  const flexible: RackFocus['flexible'] = [];
  const spare: TileKind[] = [];
  for (let k = 0; k < KIND_COUNT; k++) {
    if (counts[k] === 0 || k === JOKER) continue;
    const users = live.filter((_, i) => served[i][k] > 0).map((f) => f.family);
    if (users.length >= 2) flexible.push({ kind: TILE_KINDS[k], families: users });
    const most = Math.max(0, ...served.map((s) => s[k]));
    for (let n = most; n < counts[k]; n++) spare.push(TILE_KINDS[k]);
  }
  const deadJokers = counts[JOKER] > 0 && !live.some((f) => f.takesJokers) ? counts[JOKER] : 0;

  const late = phase !== undefined && !phase.startsWith('first');
  const lead = late ? PICK.lateLead : PICK.lead;
  const top = live[0]?.odds ?? 0;
  const pick = top >= PICK.minOdds && (live.length === 1 || top >= lead * live[1].odds);

  const bestPattern = live[0]?.patterns[0] ?? null;
  const best = bestPattern
    ? { id: bestPattern.id, name: bestPattern.name, family: live[0].family, odds: bestPattern.odds, takesJokers: live[0].takesJokers }
    : null;
  const clean = families.map(({ hands: _hands, ...f }) => f);
  const cleanLive = clean.filter((f) => f.live);
  return { families: clean, live: cleanLive, flexible, spare, deadJokers, pick, best, words: sentences(cleanLive, flexible, spare, deadJokers, pick, counts) };
}

/** "about 12%", "under 1%". */
export function percent(odds: number): string {
  const p = Math.round(100 * odds);
  return p < 1 ? 'under 1%' : `about ${p}%`;
}

/** "lean to evens", "runs still open from 3 to 6": the family as a teacher names it. */
export function familyPhrase(f: Pick<FamilyFocus, 'lean' | 'runs'>, first: boolean): string {
  if (f.runs) return f.lean.replace(/^runs /, 'runs still open ');
  return first ? `lean to ${f.lean}` : `${f.lean} still live`;
}

function capital(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function sentences(live: FamilyFocus[], flexible: RackFocus['flexible'], spare: TileKind[], deadJokers: number, pick: boolean, counts: Uint8Array): string[] {
  const words: string[] = [];
  if (live.length === 0) return ['No hand of the list is near yet: keep what pairs up and pass what stands alone.'];
  const [first, ...others] = live;
  if (pick) {
    words.push(`Time to pick: ${familyPhrase(first, true)} (${first.family}); ${first.patterns[0]?.name ?? 'its best hand'} is likeliest, ${percent(first.odds)} to finish.`);
  } else {
    words.push(`Keep gathering: ${numberWord(live.length)} families still live, none far ahead.`);
    words.push(`${capital(familyPhrase(first, true))} (${first.family}): ${percent(first.odds)} to finish.`);
  }
  for (const f of others.slice(0, 3)) words.push(`${capital(familyPhrase(f, false))} (${f.family}): ${percent(f.odds)}.`);
  if (flexible.length > 0) {
    const shown = flexible.slice(0, 3).map((x) => `the ${tileNames(x.kind, counts)}`);
    words.push(`Flexible: ${joinWords(shown)} serve${flexible.length === 1 && counts[TILE_KINDS.indexOf(flexible[0].kind)] === 1 ? 's' : ''} more than one live family: keep ${flexible.length === 1 && counts[TILE_KINDS.indexOf(flexible[0].kind)] === 1 ? 'it' : 'them'}.`);
  }
  if (spare.length > 0) {
    const byKind = new Map<TileKind, number>();
    for (const k of spare) byKind.set(k, (byKind.get(k) ?? 0) + 1);
    const shown = [...byKind].map(([k, n]) => countOf(k, n));
    words.push(`Spare: ${joinWords(shown.slice(0, 5))}${shown.length > 5 ? ' and more' : ''} serve${spare.length === 1 ? 's' : ''} no live family: pass ${spare.length === 1 ? 'it' : 'these'} first.`);
  }
  if (deadJokers > 0) words.push(`No live family has room for your joker${deadJokers > 1 ? 's' : ''}: keep a hand with pungs in view so ${deadJokers > 1 ? 'they are' : 'it is'} not wasted.`);
  return words;
}

function tileNames(kind: TileKind, counts: Uint8Array): string {
  const n = counts[TILE_KINDS.indexOf(kind)];
  return n > 1 ? pluralName(kind) : countOf(kind, 1).replace(/^an? /, '');
}

// ───────────── what a family's hands have in common ─────────────

interface HandShape {
  need: Uint8Array;
  pairsOnly: boolean;
}

const SUIT_PLURAL: Record<Suit, string> = { bam: 'bams', crack: 'cracks', dot: 'dots' };
const NUMBER_PLURAL = ['', 'ones', 'twos', 'threes', 'fours', 'fives', 'sixes', 'sevens', 'eights', 'nines'];

/**
 * The family in words, from what all its hands share, the most telling first: one number
 * across the suits, runs, evens or odds, ones and nines; with flowers, or winds and dragons;
 * singles and pairs. A family whose hands share none of these is named by its own name.
 */
function describe(hands: HandShape[], family: string): { lean: string; runs: boolean } {
  if (hands.length === 0) return { lean: `the ${family} hands`, runs: false };
  let parities = new Set<string>();
  let allParity = true;
  let allEdges = true;
  let allNumber = true;
  let allRuns = true;
  let honours = true;
  let flowers = true;
  let pairsOnly = true;
  let low = 9;
  let high = 1;
  const numbers = new Set<number>();
  const suits = new Set<Suit>();
  for (const { need, pairsOnly: po } of hands) {
    const byRank = new Map<number, { tiles: number; suits: Set<Suit> }>();
    let suitTiles = 0;
    let honourTiles = 0;
    for (let k = 0; k < KIND_COUNT; k++) {
      if (need[k] === 0) continue;
      const kind = TILE_KINDS[k];
      const suit = suitOf(kind);
      if (suit) {
        const r = rankOf(kind)!;
        const entry = byRank.get(r) ?? { tiles: 0, suits: new Set<Suit>() };
        entry.tiles += need[k];
        entry.suits.add(suit);
        byRank.set(r, entry);
        suits.add(suit);
        suitTiles += need[k];
      } else if (kind.startsWith('wind') || kind.startsWith('dragon')) honourTiles += need[k];
    }
    const flowerTiles = need[TILE_KINDS.indexOf('flower')];
    const list = [...byRank.keys()].sort((a, b) => a - b);
    // One number held in two suits or more, carrying most of the numbers of the hand.
    let anchor = 0;
    for (const [r, e] of byRank) if (e.suits.size >= 2 && e.tiles >= 6 && (anchor === 0 || e.tiles > byRank.get(anchor)!.tiles)) anchor = r;
    if (anchor === 0 || list.length > 2) allNumber = false;
    else numbers.add(anchor);
    if (suitTiles >= 4 && list.every((r) => r % 2 === 0)) parities.add('even');
    else if (suitTiles >= 4 && list.every((r) => r % 2 === 1)) parities.add('odd');
    else allParity = false;
    if (suitTiles < 4 || list.some((r) => r !== 1 && r !== 9)) allEdges = false;
    const consecutive = list.length >= 3 && list[list.length - 1] - list[0] === list.length - 1;
    if (!consecutive) allRuns = false;
    else {
      low = Math.min(low, list[0]);
      high = Math.max(high, list[list.length - 1]);
    }
    if (honourTiles < 6) honours = false;
    if (flowerTiles < 4) flowers = false;
    if (!po) pairsOnly = false;
  }
  if (!allParity) parities = new Set();
  const extras: string[] = [];
  if (flowers) extras.push('flowers');
  if (honours) extras.push('winds and dragons');
  const inSuit = suits.size === 1 ? ` in ${SUIT_PLURAL[[...suits][0]]}` : '';
  let main: string | null = null;
  let runs = false;
  if (allNumber && numbers.size > 0) {
    const list = [...numbers].sort((a, b) => a - b);
    const named = list.slice(0, 3).map((n) => NUMBER_PLURAL[n]);
    main =
      list.length === 1
        ? `${named[0]} across the suits`
        : `one number across the suits (${named.slice(0, -1).join(', ')} or ${named[named.length - 1]}${list.length > 3 ? ' or others' : ''})`;
  } else if (allRuns && low < high) {
    main = `runs from ${low} to ${high}${inSuit}`;
    runs = true;
  } else if (allEdges) main = 'ones and nines';
  else if (parities.size === 1) main = parities.has('even') ? 'evens' : 'odds';
  else if (parities.size === 2) main = 'evens or odds';
  const pairs = pairsOnly ? ' in singles and pairs, no jokers' : '';
  if (!main && pairsOnly) main = 'singles and pairs, no jokers';
  else if (main) main += pairs;
  if (!main && extras.length > 0) return { lean: extras.join(' with '), runs: false };
  if (!main) return { lean: `the ${family} hands`, runs: false };
  if (extras.length === 0) return { lean: main, runs };
  return { lean: `${main} with ${joinWords(extras)}`, runs };
}

/** The tiles of the rack a family's hands use, most of each kind (a helper for reasons). */
export function servedBy(family: FamilyFocus, played: readonly PricedPattern[]): Uint8Array {
  const most = new Uint8Array(KIND_COUNT);
  const ids = new Set(family.patterns.map((p) => p.id));
  for (const m of played) {
    if (!ids.has(m.pattern.id)) continue;
    for (const a of m.cheap) {
      const need = needOf(m.c, a);
      for (let k = 0; k < KIND_COUNT; k++) if (need[k] > most[k]) most[k] = need[k];
    }
  }
  return most;
}


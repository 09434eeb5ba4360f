/**
 * Pass advice: every legal pass, scored by how close the kept tiles stay to the rack's nearest
 * patterns (counting what the arriving tiles may bring), minus a penalty for feeding a neighbour.
 */
import type { Phase } from '../exchange/types';
import { copiesInSet, rankOf, suitOf, TILE_KINDS, type TileKind } from '../tiles';
import { countsOf, fitAt, standings } from './away';
import { JOKER, KIND_COUNT, type CompiledPattern } from './compile';
import { HAND_SIZE, type Pattern } from './pattern';
import { countOf, joinWords, multipleOf, numberWord } from './words';

/** A Charleston pass sends three tiles. */
export const PASS_SIZE = 3;

export interface AdviceContext {
  phase: Phase;
  blindAllowed: boolean;
  /** Tiles to send; default 3 (a courtesy pass sends the agreed count). */
  count?: number;
  /** Keep in view every pattern within this many tiles of the closest; by default wider early, narrower late. */
  margin?: number;
}

export interface PassAdvice {
  /** Own tiles to send (never a joker); tiles.length + blind = the pass size. */
  tiles: TileKind[];
  /** Arriving tiles to forward unseen. */
  blind: number;
  /** Higher is better: minus the expected tiles away after the pass, weighted over the focus patterns, minus the defence penalty. */
  score: number;
  reasons: string[];
  /** The pattern the kept tiles are closest to, and how far they are from it before new tiles arrive. */
  toward: { id: string; name: string; away: number } | null;
}

/** Penalties, in tiles away, for passes that feed a neighbour (common practice, no published source). */
export const DEFENCE = {
  /** Two or more of one kind together: a pair is a gift. */
  sameKind: 0.5,
  /** Two of one suit within two ranks: the start of a run. */
  neighbours: 0.2,
  /** Each flower: many patterns use them. */
  flower: 0.15,
} as const;

/** The most patterns one piece of advice weighs at once. */
export const MAX_FOCUS = 8;

/** Early passes keep more patterns in view; late ones narrow down. */
export function defaultMargin(phase: Phase): number {
  if (phase === 'first-right' || phase === 'first-across') return 2;
  return 1;
}

interface Focus {
  pattern: Pattern;
  c: CompiledPattern;
  away: number;
  weight: number;
  /** Assignments that could still be best after losing up to `count` tiles. */
  candidates: number[];
}

/** Every multiset of `size` kinds drawn from `counts` (kind indices, ascending). */
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

function defencePenalty(passed: number[]): { penalty: number; pairs: number[]; runs: [number, number][]; flowers: number } {
  let penalty = 0;
  const pairs: number[] = [];
  const runs: [number, number][] = [];
  let flowers = 0;
  for (let i = 0; i < passed.length; i++) {
    const kind = TILE_KINDS[passed[i]];
    if (kind === 'flower') flowers++;
    if (i > 0 && passed[i - 1] === passed[i]) {
      if (!pairs.includes(passed[i])) pairs.push(passed[i]);
      continue;
    }
    for (let j = 0; j < i; j++) {
      const other = TILE_KINDS[passed[j]];
      const suit = suitOf(kind);
      if (suit && suit === suitOf(other) && passed[j] !== passed[i] && Math.abs(rankOf(kind)! - rankOf(other)!) <= 2) {
        runs.push([passed[j], passed[i]]);
      }
    }
  }
  penalty += pairs.length * DEFENCE.sameKind + runs.length * DEFENCE.neighbours + flowers * DEFENCE.flower;
  return { penalty, pairs, runs, flowers };
}

/** Share of unseen tiles that would fill an open slot of assignment `a` for these counts. */
function liveShare(c: CompiledPattern, a: number, counts: Uint8Array, pool: Uint8Array, poolSize: number): number {
  let live = 0;
  let open = 0;
  for (let i = c.starts[a], end = c.starts[a + 1]; i < end; i += 3) {
    const have = counts[c.flat[i]];
    const small = c.flat[i + 1];
    const big = c.flat[i + 2];
    if (have < small + big) live += pool[c.flat[i]];
    const used = Math.min(have, small + big);
    open += used > small ? big - (used - small) : big;
  }
  if (open > counts[JOKER]) live += pool[JOKER];
  return poolSize > 0 ? live / poolSize : 0;
}

/**
 * Rank every legal pass, best first. Options with the same kinds are one option. The kept tiles
 * are judged against every pattern within `margin` tiles of the rack's closest (at most
 * MAX_FOCUS, each further tile halving its weight); each tile still to arrive counts as worth
 * the share of unseen tiles that would fill an open slot of that pattern.
 */
export function advisePass(hand: readonly TileKind[], list: readonly Pattern[], context: AdviceContext): PassAdvice[] {
  const count = context.count ?? PASS_SIZE;
  const counts = countsOf(hand);
  const rackLimit = Math.min(hand.length, HAND_SIZE);

  const ranked = standings(counts, list);
  const best = ranked.length > 0 ? ranked[0].away : HAND_SIZE;
  const margin = Math.max(0, context.margin ?? defaultMargin(context.phase));
  const near = ranked.filter((r) => r.away <= best + margin).slice(0, MAX_FOCUS);
  // A pattern one tile further counts half as much.
  const focus: Focus[] = near.map(({ pattern, c, away }) => {
    const candidates: number[] = [];
    for (let a = 0; a < c.starts.length - 1; a++) if (HAND_SIZE - fitAt(c, a, counts) <= away + count) candidates.push(a);
    return { pattern, c, away, weight: 0.5 ** (away - best), candidates };
  });
  const weightSum = focus.reduce((sum, f) => sum + f.weight, 0) || 1;

  // How widely useful each kind is across the nearer half of the list: a small tie-breaker.
  const breadth = new Float64Array(KIND_COUNT);
  for (const { c, assignment: a } of ranked.slice(0, Math.max(near.length, Math.ceil(ranked.length / 2)))) {
    for (let i = c.starts[a]; i < c.starts[a + 1]; i += 3) breadth[c.flat[i]] += 1 / ranked.length;
  }

  const pool = new Uint8Array(KIND_COUNT);
  let poolSize = 0;
  for (let k = 0; k < KIND_COUNT; k++) {
    pool[k] = Math.max(0, copiesInSet(TILE_KINDS[k]) - counts[k]);
    poolSize += pool[k];
  }

  const out: PassAdvice[] = [];
  const maxBlind = context.blindAllowed ? count : 0;
  for (let blind = 0; blind <= maxBlind; blind++) {
    const own = count - blind;
    for (const passed of passChoices(counts, own)) {
      for (const k of passed) counts[k]--;
      let expected = 0;
      const aways: number[] = [];
      for (const f of focus) {
        let fit = -1;
        let at = 0;
        for (const a of f.candidates) {
          const x = fitAt(f.c, a, counts);
          if (x > fit) {
            fit = x;
            at = a;
          }
        }
        const away = HAND_SIZE - fit;
        const gain = Math.min(Math.max(0, away - (HAND_SIZE - rackLimit)), own * liveShare(f.c, at, counts, pool, poolSize));
        aways.push(away);
        expected += f.weight * (away - gain);
      }
      for (const k of passed) counts[k]++;
      const defence = defencePenalty(passed);
      const spread = passed.reduce((sum, k) => sum + breadth[k], 0) * 0.05;
      out.push({
        tiles: passed.map((k) => TILE_KINDS[k]),
        blind,
        score: -(expected / weightSum) - defence.penalty - spread,
        reasons: reasonsFor(counts, passed, blind, focus, aways, defence),
        toward: focus.length > 0 ? towardOf(focus[closestAfter(focus, aways)].pattern, aways[closestAfter(focus, aways)]) : null,
      });
    }
  }
  out.sort((a, b) => b.score - a.score || a.blind - b.blind || keyOf(a).localeCompare(keyOf(b)));
  return out;
}

/** The focus pattern the kept tiles are closest to; ties go to the one the pass costs least, then to the closer before. */
function closestAfter(focus: Focus[], aways: number[]): number {
  let at = 0;
  for (let i = 1; i < aways.length; i++) {
    if (aways[i] < aways[at] || (aways[i] === aways[at] && aways[i] - focus[i].away < aways[at] - focus[at].away)) at = i;
  }
  return at;
}

function towardOf(pattern: Pattern, away: number): PassAdvice['toward'] {
  return { id: pattern.id, name: pattern.name, away };
}

function keyOf(advice: PassAdvice): string {
  return advice.tiles.map((k) => String(TILE_KINDS.indexOf(k)).padStart(2, '0')).join(',');
}

function reasonsFor(
  counts: Uint8Array,
  passed: number[],
  blind: number,
  focus: Focus[],
  aways: number[],
  defence: ReturnType<typeof defencePenalty>,
): string[] {
  const reasons: string[] = [];
  if (focus.length > 0) {
    const closest = closestAfter(focus, aways);
    const lostAt = (i: number) => aways[i] - focus[i].away;
    const say = (i: number) => {
      const { pattern, away } = focus[i];
      const lost = lostAt(i);
      return lost === 0
        ? `keeps every tile "${pattern.name}" uses (${away} away)`
        : `gives up ${numberWord(lost)} tile${lost > 1 ? 's' : ''} "${pattern.name}" uses (${away} → ${aways[i]} away)`;
    };
    reasons.push(say(closest));
    if (closest !== 0 && lostAt(0) > 0) reasons.push(say(0));
  }

  const kept: string[] = [];
  let touched = false;
  let multiples = 0;
  for (let k = 0; k < KIND_COUNT; k++) {
    if (k === JOKER || counts[k] < 2) continue;
    multiples++;
    const kind = TILE_KINDS[k];
    const gone = passed.filter((p) => p === k).length;
    if (gone === 0) kept.push(multipleOf(kind, counts[k]));
    else if (gone === counts[k]) {
      touched = true;
      reasons.push(`gives away ${countOf(kind, gone)}`);
    } else {
      touched = true;
      reasons.push(`breaks your ${multipleOf(kind, counts[k])}`);
    }
  }
  if (multiples > 0 && !touched) reasons.push('breaks no pair');
  if (kept.length > 0) reasons.push(`keeps your ${joinWords(kept.slice(0, 3))}`);

  for (const [a, b] of defence.runs.slice(0, 1)) {
    reasons.push(`passes ${countOf(TILE_KINDS[a], 1)} and ${countOf(TILE_KINDS[b], 1)} together, a start on a run for a neighbour`);
  }
  if (defence.flowers > 0 && !defence.pairs.includes(TILE_KINDS.indexOf('flower'))) reasons.push(`gives away ${countOf('flower', defence.flowers)}`);
  if (blind > 0) {
    reasons.push(
      blind === passed.length + blind
        ? `forwards all ${numberWord(blind)} arriving tiles blind, so your rack stays as it is`
        : `forwards ${numberWord(blind)} arriving tile${blind > 1 ? 's' : ''} blind, so you keep more of your own`,
    );
  }
  return reasons;
}

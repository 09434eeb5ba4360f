/**
 * Turns a pattern into every concrete hand it allows: each assignment of its suit letters
 * (distinct suits) and rank variables (distinct numbers, every rank within 1–9) fixes the kind
 * of every group. Judging a rack then only counts tiles against those fixed needs.
 */
import { copiesInSet, JOKER_COUNT, MATCHING_DRAGON, RANKS, SUITS, suitKind, TILE_KINDS, tileName, type Suit, type TileKind } from '../tiles';
import { joinWords } from './words';
import { isSuitLetter, JOKER_MIN_GROUP, type Group, type Pattern, type PatternIssue, type SuitLetter } from './pattern';

export interface Assignment {
  suits: Partial<Record<SuitLetter, Suit>>;
  ranks: Record<string, number>;
}

/** One kind a concrete hand needs: how many for singles and pairs (naturals only) and for bigger groups. */
export interface Need {
  kind: number;
  small: number;
  big: number;
}

export interface CompiledPattern {
  pattern: Pattern;
  assignments: Assignment[];
  /** Triples (kind index, small need, big need) of every assignment, back to back. */
  flat: Int16Array;
  /** Assignment i owns flat[starts[i] .. starts[i + 1]). */
  starts: Int32Array;
}

export const KIND_COUNT = TILE_KINDS.length;
export const JOKER = TILE_KINDS.indexOf('joker');
const KIND_INDEX = new Map<TileKind, number>(TILE_KINDS.map((kind, index) => [kind, index]));

export function kindIndex(kind: TileKind): number {
  const index = KIND_INDEX.get(kind);
  if (index === undefined) throw new Error(`Unknown tile kind "${kind}".`);
  return index;
}

export function groupKind(group: Group, assignment: Assignment): TileKind {
  if ('tile' in group) return group.tile;
  const suit = isSuitLetter(group.suit) ? assignment.suits[group.suit] : group.suit;
  if (!suit) throw new Error(`Suit letter ${group.suit} has no suit in this assignment.`);
  if ('dragon' in group) return MATCHING_DRAGON[suit];
  const rank = typeof group.rank === 'number' ? group.rank : assignment.ranks[group.rank.var] + group.rank.offset;
  return suitKind(suit, rank);
}

function lettersOf(pattern: Pattern): SuitLetter[] {
  const letters = new Set<SuitLetter>();
  for (const group of pattern.groups) if ('suit' in group && isSuitLetter(group.suit)) letters.add(group.suit);
  return [...letters].sort();
}

/** Each rank variable with the values that keep all of its offsets within 1–9. */
function rankChoices(pattern: Pattern): [string, number[]][] {
  const offsets = new Map<string, number[]>();
  for (const group of pattern.groups) {
    if ('rank' in group && typeof group.rank === 'object') {
      offsets.set(group.rank.var, [...(offsets.get(group.rank.var) ?? []), group.rank.offset]);
    }
  }
  return [...offsets.keys()].sort().map((name) => {
    const list = offsets.get(name)!;
    return [name, RANKS.filter((value) => list.every((offset) => value + offset >= 1 && value + offset <= 9))];
  });
}

function* injective<T>(choices: T[][], taken: T[] = []): Generator<T[]> {
  if (taken.length === choices.length) {
    yield taken;
    return;
  }
  for (const value of choices[taken.length]) {
    if (!taken.includes(value)) yield* injective(choices, [...taken, value]);
  }
}

/** Every assignment of the pattern, without validating it first. */
export function enumerateAssignments(pattern: Pattern): Assignment[] {
  const letters = lettersOf(pattern);
  const ranks = rankChoices(pattern);
  const out: Assignment[] = [];
  for (const suits of injective(letters.map(() => [...SUITS]))) {
    for (const values of injective(ranks.map(([, list]) => list))) {
      out.push({
        suits: Object.fromEntries(letters.map((letter, i) => [letter, suits[i]])),
        ranks: Object.fromEntries(ranks.map(([name], i) => [name, values[i]])),
      });
    }
  }
  return out;
}

/** What one assignment asks for, merged by kind and sorted by kind index. */
export function needsOf(pattern: Pattern, assignment: Assignment): Need[] {
  const byKind = new Map<number, Need>();
  for (const group of pattern.groups) {
    const kind = kindIndex(groupKind(group, assignment));
    const need = byKind.get(kind) ?? { kind, small: 0, big: 0 };
    if (group.size >= JOKER_MIN_GROUP) need.big += group.size;
    else need.small += group.size;
    byKind.set(kind, need);
  }
  return [...byKind.values()].sort((a, b) => a.kind - b.kind);
}

/** Compile without validating: assignments that ask for the same tiles are kept once. */
export function compileUnchecked(pattern: Pattern): CompiledPattern {
  const assignments: Assignment[] = [];
  const chunks: Need[][] = [];
  const seen = new Set<string>();
  for (const assignment of enumerateAssignments(pattern)) {
    const needs = needsOf(pattern, assignment);
    const key = needs.map((n) => `${n.kind}:${n.small}:${n.big}`).join(',');
    if (seen.has(key)) continue;
    seen.add(key);
    assignments.push(assignment);
    chunks.push(needs);
  }
  const starts = new Int32Array(chunks.length + 1);
  const flat = new Int16Array(chunks.reduce((sum, c) => sum + c.length * 3, 0));
  let at = 0;
  chunks.forEach((needs, i) => {
    starts[i] = at;
    for (const need of needs) {
      flat[at++] = need.kind;
      flat[at++] = need.small;
      flat[at++] = need.big;
    }
  });
  starts[chunks.length] = at;
  return { pattern, assignments, flat, starts };
}

/**
 * Could real tiles plus jokers ever fill this pattern? Singles and pairs need naturals (4 of a
 * kind, 8 flowers); bigger groups take jokers, of which a set has 8.
 */
export function feasibilityIssues(pattern: Pattern): PatternIssue[] {
  const assignments = enumerateAssignments(pattern);
  if (assignments.length === 0) {
    return [{ message: 'No choice of suits and numbers fits: the rank variables must take different numbers, each within 1–9.' }];
  }
  const problems = (assignment: Assignment): PatternIssue[] => {
    const found: PatternIssue[] = [];
    let jokers = 0;
    for (const need of needsOf(pattern, assignment)) {
      const kind = TILE_KINDS[need.kind];
      const copies = copiesInSet(kind);
      if (need.small > copies) {
        const groups = pattern.groups.map((g, i) => ({ g, i })).filter(({ g }) => g.size < JOKER_MIN_GROUP && groupKind(g, assignment) === kind);
        const numbers = groups.map(({ i }) => String(i + 1));
        const where = numbers.length === 1 ? `This group needs` : `Groups ${joinWords(numbers)} need`;
        found.push({
          group: groups[groups.length - 1].i,
          message: `${where} ${need.small} natural ${tileName(kind)} tiles${numbers.length === 1 ? '' : ' between them'}, but a set has ${copies}, and jokers can't fill singles or pairs.`,
        });
      }
      jokers += Math.max(0, need.big - Math.max(0, copies - need.small));
    }
    if (jokers > JOKER_COUNT) {
      const biggest = pattern.groups.reduce((best, g, i) => (g.size > pattern.groups[best].size ? i : best), 0);
      found.push({ group: biggest, message: `The pattern needs at least ${jokers} jokers, and a set has ${JOKER_COUNT}.` });
    }
    return found;
  };
  let first: PatternIssue[] | null = null;
  for (const assignment of assignments) {
    const found = problems(assignment);
    if (found.length === 0) return [];
    first ??= found;
  }
  return first ?? [];
}


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

const SUIT_INDEX: Suit[] = [...SUITS];
/** KIND_OF_SUIT[suit][rank] and DRAGON_OF_SUIT[suit], as kind indexes. */
const KIND_OF_SUIT = SUIT_INDEX.map((suit) => [0, ...RANKS.map((rank) => kindIndex(suitKind(suit, rank)))]);
const DRAGON_OF_SUIT = SUIT_INDEX.map((suit) => kindIndex(MATCHING_DRAGON[suit]));

/**
 * A group reduced to numbers: a fixed kind, or a suit (a letter's slot, or a fixed suit) with a
 * rank (a variable's slot plus an offset, or a fixed rank), or a suit's dragon.
 */
interface Slot {
  size: number;
  kind: number;
  letter: number;
  suit: number;
  variable: number;
  rank: number;
  dragon: boolean;
}

/**
 * Calls `visit` once per choice of distinct suits for the pattern's letters and distinct numbers
 * for its rank variables, in a fixed order (suits first, then numbers, each in ascending order),
 * with the chosen suit indexes and numbers, until `visit` returns true. The arrays are reused:
 * copy what you keep.
 */
function forEachChoice(letters: number, ranks: number[][], visit: (suits: number[], values: number[]) => boolean | void) {
  const suits: number[] = new Array<number>(letters).fill(-1);
  const values: number[] = new Array<number>(ranks.length).fill(0);
  let stopped = false;
  const pickValue = (at: number) => {
    if (at === ranks.length) {
      if (visit(suits, values)) stopped = true;
      return;
    }
    for (const value of ranks[at]) {
      let taken = false;
      for (let j = 0; j < at; j++) if (values[j] === value) taken = true;
      if (taken) continue;
      values[at] = value;
      pickValue(at + 1);
      if (stopped) return;
    }
  };
  const pickSuit = (at: number) => {
    if (at === letters) return pickValue(0);
    for (let suit = 0; suit < SUIT_INDEX.length; suit++) {
      let taken = false;
      for (let j = 0; j < at; j++) if (suits[j] === suit) taken = true;
      if (taken) continue;
      suits[at] = suit;
      pickSuit(at + 1);
      if (stopped) return;
    }
  };
  pickSuit(0);
}

/** What one choice asks for: `count` kinds in `kinds` (ascending), with the small and big needs of each kind. */
interface NeedsView {
  kinds: Int32Array;
  count: number;
  small: Int16Array;
  big: Int16Array;
  suits: number[];
  values: number[];
}

/**
 * Walks the needs of every choice of the pattern, in enumeration order, until `visit` returns
 * true. Numbers throughout; the view is reused between calls.
 */
function forEachNeeds(plan: Plan, visit: (view: NeedsView) => boolean | void) {
  const { slots } = plan;
  const view: NeedsView = { kinds: new Int32Array(slots.length), count: 0, small: new Int16Array(KIND_COUNT), big: new Int16Array(KIND_COUNT), suits: [], values: [] };
  const { kinds, small, big } = view;
  forEachChoice(
    plan.letters.length,
    plan.ranks.map(([, list]) => list),
    (suits, values) => {
      let count = 0;
      for (let s = 0; s < slots.length; s++) {
        const slot = slots[s];
        let kind = slot.kind;
        if (kind < 0) {
          const suit = slot.letter >= 0 ? suits[slot.letter] : slot.suit;
          kind = slot.dragon ? DRAGON_OF_SUIT[suit] : KIND_OF_SUIT[suit]?.[slot.variable >= 0 ? values[slot.variable] + slot.rank : slot.rank];
          if (kind === undefined) throw new Error('A group of this pattern has no tile kind: check its suit and rank.');
        }
        if (small[kind] === 0 && big[kind] === 0) {
          // Insertion keeps the kinds sorted: a hand has at most 14 of them.
          let at = count++;
          while (at > 0 && kinds[at - 1] > kind) kinds[at] = kinds[--at];
          kinds[at] = kind;
        }
        if (slot.size >= JOKER_MIN_GROUP) big[kind] += slot.size;
        else small[kind] += slot.size;
      }
      view.count = count;
      view.suits = suits;
      view.values = values;
      const stop = visit(view);
      for (let t = 0; t < count; t++) small[kinds[t]] = big[kinds[t]] = 0;
      return stop;
    },
  );
}

interface Plan {
  letters: SuitLetter[];
  ranks: [string, number[]][];
  slots: Slot[];
}

function planOf(pattern: Pattern): Plan {
  const letters = lettersOf(pattern);
  const ranks = rankChoices(pattern);
  const names = ranks.map(([name]) => name);
  const slots = pattern.groups.map((group): Slot => {
    const slot: Slot = { size: group.size, kind: -1, letter: -1, suit: -1, variable: -1, rank: 0, dragon: false };
    if ('tile' in group) {
      slot.kind = kindIndex(group.tile);
      return slot;
    }
    if (isSuitLetter(group.suit)) slot.letter = letters.indexOf(group.suit);
    else slot.suit = SUIT_INDEX.indexOf(group.suit);
    if ('dragon' in group) slot.dragon = true;
    else if (typeof group.rank === 'number') slot.rank = group.rank;
    else {
      slot.variable = names.indexOf(group.rank.var);
      slot.rank = group.rank.offset;
    }
    return slot;
  });
  return { letters, ranks, slots };
}

function assignmentOf(plan: Plan, suits: number[], values: number[]): Assignment {
  const out: Assignment = { suits: {}, ranks: {} };
  plan.letters.forEach((letter, i) => (out.suits[letter] = SUIT_INDEX[suits[i]]));
  plan.ranks.forEach(([name], i) => (out.ranks[name] = values[i]));
  return out;
}

/** Every assignment of the pattern, without validating it first. */
export function enumerateAssignments(pattern: Pattern): Assignment[] {
  const plan = planOf(pattern);
  const out: Assignment[] = [];
  forEachChoice(
    plan.letters.length,
    plan.ranks.map(([, list]) => list),
    (suits, values) => void out.push(assignmentOf(plan, suits, values)),
  );
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

/**
 * Compile without validating: assignments that ask for the same tiles are kept once, the first
 * of them in enumeration order. Works on numbers throughout; an Assignment object is made only
 * for each distinct set of needs.
 */
export function compileUnchecked(pattern: Pattern): CompiledPattern {
  const plan = planOf(pattern);
  const assignments: Assignment[] = [];
  const flat: number[] = [];
  const starts: number[] = [];
  const seen = new Set<string>();
  forEachNeeds(plan, ({ kinds, count, small, big, suits, values }) => {
    let key = '';
    for (let t = 0; t < count; t++) key += String.fromCharCode(kinds[t], small[kinds[t]], big[kinds[t]]);
    if (seen.has(key)) return;
    seen.add(key);
    starts.push(flat.length);
    for (let t = 0; t < count; t++) flat.push(kinds[t], small[kinds[t]], big[kinds[t]]);
    assignments.push(assignmentOf(plan, suits, values));
  });
  starts.push(flat.length);
  return { pattern, assignments, flat: Int16Array.from(flat), starts: Int32Array.from(starts) };
}

/**
 * Could real tiles plus jokers ever fill this pattern? Singles and pairs need naturals (4 of a
 * kind, 8 flowers); bigger groups take jokers, of which a set has 8.
 */
export function feasibilityIssues(pattern: Pattern): PatternIssue[] {
  const plan = planOf(pattern);
  // The first choice that real tiles and jokers could fill settles it; otherwise the first
  // choice's problems are the ones told.
  let fits = false;
  let first: Assignment | null = null;
  forEachNeeds(plan, ({ kinds, count, small, big, suits, values }) => {
    let jokers = 0;
    let ok = true;
    for (let t = 0; t < count; t++) {
      const copies = COPIES[kinds[t]];
      if (small[kinds[t]] > copies) ok = false;
      jokers += Math.max(0, big[kinds[t]] - Math.max(0, copies - small[kinds[t]]));
    }
    if (ok && jokers <= JOKER_COUNT) return (fits = true);
    first ??= assignmentOf(plan, suits, values);
  });
  if (fits) return [];
  if (!first) return [{ message: 'No choice of suits and numbers fits: the rank variables must take different numbers, each within 1–9.' }];
  return problemsAt(pattern, first);
}

/** Copies of each kind in a set, by kind index. */
const COPIES = TILE_KINDS.map((kind) => copiesInSet(kind));

/** Why real tiles plus jokers can't fill one assignment, in words, naming the groups at fault. */
function problemsAt(pattern: Pattern, assignment: Assignment): PatternIssue[] {
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
}

/** Rackside's pattern format: a hand to aim for, as data, with its zod schema. */
import { z } from 'zod';
import { SUITS, TILE_KINDS, type Suit, type TileKind } from '../tiles';

/** Total tiles in a finished hand. */
export const HAND_SIZE = 14;
/** Group sizes run from a single (1) to a sextet (6). */
export const MIN_GROUP_SIZE = 1;
export const MAX_GROUP_SIZE = 6;
/** Jokers stand in only for tiles of groups at least this big (pungs and up). */
export const JOKER_MIN_GROUP = 3;

/** A, B and C name distinct suits, chosen freely when the hand is judged. */
export const SUIT_LETTERS = ['A', 'B', 'C'] as const;
export type SuitLetter = (typeof SUIT_LETTERS)[number];
export type SuitRef = SuitLetter | Suit;

/** A fixed rank, or a rank variable plus an offset: runs and matching numbers are one rule. */
export type RankRef = number | { var: string; offset: number };

export type Group =
  | { size: number; tile: TileKind }
  | { size: number; suit: SuitRef; rank: RankRef }
  | { size: number; dragon: 'match'; suit: SuitRef };

export interface Pattern {
  id: string;
  name: string;
  family: string;
  /** What finishing the hand is worth; Rackside's own list derives it from measured odds (rarer is worth more). */
  value: number;
  /** Sealed: built from the player's own draws alone, with no called discards. */
  sealed: boolean;
  groups: Group[];
}

/** Whether the hand must be built without calling discards (every tile from the player's own draws). */
export function buildsWithoutCalls(p: Pattern): boolean {
  return p.sealed;
}

/** What finishing the hand is worth on Rackside's scale. */
export function patternValue(p: Pattern): number {
  return p.value;
}

/**
 * A pattern in today's field names. Lists stored, and files written, before `value` and
 * `sealed` name them `points` and `concealed`; those are renamed (a field already under its new
 * name wins), in the order today's format writes. Anything that is not an object passes through
 * for the schema to refuse.
 */
export function withCurrentFields(raw: unknown): unknown {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return raw;
  const old = raw as Record<string, unknown>;
  if (!('points' in old) && !('concealed' in old)) return raw;
  const { points, concealed, ...rest } = old;
  const { id, name, family, groups, ...others } = rest;
  const out: Record<string, unknown> = { id, name, family, value: 'value' in rest ? rest.value : points, sealed: 'sealed' in rest ? rest.sealed : concealed, groups, ...others };
  for (const key of Object.keys(out)) if (out[key] === undefined) delete out[key];
  return out;
}

const size = z.number().int().min(MIN_GROUP_SIZE, 'A group holds at least 1 tile.').max(MAX_GROUP_SIZE, 'A group holds at most 6 tiles (a sextet).');
const suitRef = z.enum([...SUIT_LETTERS, ...SUITS], { error: 'A suit is a letter A, B or C, or one of bam, crack, dot.' });
const rankRef = z.union(
  [
    z.number().int().min(1).max(9),
    z.strictObject({
      var: z.string().regex(/^[a-z]$/, 'A rank variable is one lower-case letter.'),
      offset: z.number().int().min(-8).max(8),
    }),
  ],
  { error: 'A rank is a number 1–9 or { var, offset }.' },
);

const tileGroup = z.strictObject({ size, tile: z.enum(TILE_KINDS as [TileKind, ...TileKind[]], { error: 'Unknown tile kind.' }) });
const suitGroup = z.strictObject({ size, suit: suitRef, rank: rankRef });
const dragonGroup = z.strictObject({ size, dragon: z.literal('match'), suit: suitRef });
const groupSchema = z.union([tileGroup, suitGroup, dragonGroup], {
  error: 'A group has a size and either a tile, a suit with a rank, or { dragon: "match", suit }.',
});

/** Structure only; `patternSchema` (schema.ts) adds the rules that need the whole pattern. */
export const patternShape = z.strictObject({
  id: z.string().regex(/^[a-z0-9][a-z0-9-]{0,39}$/, 'An id is lower-case letters, digits and dashes, up to 40.'),
  name: z.string().trim().min(1, 'Give the pattern a name.').max(60, 'A name has at most 60 characters.'),
  family: z.string().trim().min(1, 'Give the pattern a family.').max(30),
  value: z.number({ error: 'A value is a whole number from 0 to 1000.' }).int('A value is a whole number from 0 to 1000.').min(0, 'A value is a whole number from 0 to 1000.').max(1000, 'A value is a whole number from 0 to 1000.'),
  sealed: z.boolean({ error: 'Sealed is true or false: true when the hand is built from your own draws, with no calls.' }),
  groups: z.array(groupSchema).min(1).max(HAND_SIZE),
});

/**
 * How much choosing a pattern may ask for. Checking a pattern and building it for a table try
 * every choice of its suit letters and number letters, on the server's one thread, so both are
 * bounded before anything is tried: the number letters, the choices one pattern allows (three
 * free numbers in three suits, 6 × 9 × 9 × 9, is the most), and the choices a whole list allows.
 */
export const PATTERN_WORK_LIMITS = { rankVariables: 4, assignments: 6 * 9 ** 3, listAssignments: 100_000 } as const;

/** The pattern's number letters (rank variables), sorted. */
export function rankVariables(pattern: Pattern): string[] {
  const names = new Set<string>();
  for (const group of pattern.groups) if ('rank' in group && typeof group.rank === 'object') names.add(group.rank.var);
  return [...names].sort();
}

/** How many numbers 1–9 each number letter may take, keeping every rank of its offsets within 1–9. */
export function rankRanges(pattern: Pattern): Map<string, number> {
  const spans = new Map<string, { low: number; high: number }>();
  for (const group of pattern.groups) {
    if (!('rank' in group) || typeof group.rank !== 'object') continue;
    const { var: name, offset } = group.rank;
    const span = spans.get(name);
    spans.set(name, span ? { low: Math.min(span.low, offset), high: Math.max(span.high, offset) } : { low: offset, high: offset });
  }
  const out = new Map<string, number>();
  for (const [name, { low, high }] of spans) out.set(name, Math.max(0, Math.min(9, 9 - high) - Math.max(1, 1 - low) + 1));
  return out;
}

/**
 * At most how many choices of suits and numbers the pattern allows: the ordered picks of
 * distinct suits for its suit letters times each number letter's range. Counted from the
 * pattern alone, without trying any choice; never below what compiling tries.
 */
export function assignmentBound(pattern: Pattern): number {
  const letters = new Set<string>();
  for (const group of pattern.groups) if ('suit' in group && isSuitLetter(group.suit)) letters.add(group.suit);
  let bound = 1;
  for (let i = 0; i < letters.size; i++) bound *= 3 - i;
  for (const range of rankRanges(pattern).values()) bound *= range;
  return bound;
}

/** 12345 → "12,345". */
export function grouped(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** Whether checking the pattern stays cheap: too many number letters, or too many choices, and it is refused unchecked. */
export function workIssues(pattern: Pattern): PatternIssue[] {
  const names = rankVariables(pattern);
  if (names.length > PATTERN_WORK_LIMITS.rankVariables) {
    return [
      {
        message: `This pattern uses ${names.length} number letters (${names.join(', ')}); at most ${PATTERN_WORK_LIMITS.rankVariables} are allowed, so Rackside can check it quickly. Tie numbers together with offsets (n, n+1) or use fixed numbers.`,
      },
    ];
  }
  const bound = assignmentBound(pattern);
  if (bound > PATTERN_WORK_LIMITS.assignments) {
    return [
      {
        message: `This pattern has up to ${grouped(bound)} ways to choose its suits and numbers; at most ${grouped(PATTERN_WORK_LIMITS.assignments)} are allowed, so Rackside can check it quickly. Use fewer number letters, tie them together with offsets (n, n+1), or fix some suits or numbers.`,
      },
    ];
  }
  return [];
}

/**
 * The same bound over a whole list: refused as a whole when its patterns together allow too
 * many choices. A pattern over its own limits is left out here: it is refused on its own.
 */
export function listWorkIssue(patterns: readonly Pattern[]): string | null {
  const total = patterns.reduce((sum, p) => sum + (workIssues(p).length === 0 ? assignmentBound(p) : 0), 0);
  if (total <= PATTERN_WORK_LIMITS.listAssignments) return null;
  return `Together these patterns have up to ${grouped(total)} ways to choose suits and numbers; a list may have at most ${grouped(PATTERN_WORK_LIMITS.listAssignments)}, so tables can judge racks quickly. Split the list, or use fewer number letters in its costliest patterns.`;
}

/** One problem with a pattern; `group` is the 0-based index into `groups` when one group is at fault. */
export interface PatternIssue {
  group?: number;
  message: string;
}

/** Plain words for a group's place: "group 3 of 5". */
export function groupLabel(index: number, count: number): string {
  return `group ${index + 1} of ${count}`;
}

export function isSuitLetter(suit: SuitRef): suit is SuitLetter {
  return (SUIT_LETTERS as readonly string[]).includes(suit);
}

/** Rules a schema of single fields can't see. Exported for the compiler's own checks. */
export function semanticIssues(pattern: Pattern): PatternIssue[] {
  const issues: PatternIssue[] = [];
  const total = pattern.groups.reduce((sum, g) => sum + g.size, 0);
  if (total !== HAND_SIZE) issues.push({ message: `The groups add up to ${total} tiles; a hand has ${HAND_SIZE}.` });

  issues.push(...workIssues(pattern));
  const offsets = new Map<string, number[]>();
  pattern.groups.forEach((group, index) => {
    if ('tile' in group && group.tile === 'joker') {
      issues.push({ group: index, message: 'A group can\'t be made of jokers: jokers only stand in for the tiles of a pung or bigger.' });
    }
    if ('rank' in group && typeof group.rank === 'object') {
      const list = offsets.get(group.rank.var) ?? [];
      list.push(group.rank.offset);
      offsets.set(group.rank.var, list);
    }
  });
  for (const [name, list] of offsets) {
    const span = Math.max(...list) - Math.min(...list);
    if (span > 8) {
      const index = pattern.groups.findIndex((g) => 'rank' in g && typeof g.rank === 'object' && g.rank.var === name && g.rank.offset === Math.max(...list));
      issues.push({ group: index, message: `The offsets of rank "${name}" span ${span}, so no number keeps every rank within 1–9.` });
    }
  }
  return issues;
}

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
  points: number;
  concealed: boolean;
  groups: Group[];
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
  points: z.number().int().min(0).max(1000),
  concealed: z.boolean(),
  groups: z.array(groupSchema).min(1).max(HAND_SIZE),
});

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

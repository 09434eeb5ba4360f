/** One concrete hand to draw a pattern with, even while it is half built: suit letters and rank variables get example values. */
import type { Group, Pattern } from '../../../shared/analysis/pattern';
import { MATCHING_DRAGON, SUITS, suitKind, tileName, type Suit, type TileKind } from '../../../shared/tiles';

export const GROUP_NAMES: Record<number, string> = { 1: 'single', 2: 'pair', 3: 'pung', 4: 'kong', 5: 'quint', 6: 'sextet' };
const LETTER_SUIT: Record<string, Suit> = { A: 'bam', B: 'crack', C: 'dot' };

export interface Example {
  suits: Record<string, Suit>;
  ranks: Record<string, number>;
}

export function exampleFor(groups: readonly Group[]): Example {
  const offsets = new Map<string, number[]>();
  for (const g of groups) if ('rank' in g && typeof g.rank === 'object') offsets.set(g.rank.var, [...(offsets.get(g.rank.var) ?? []), g.rank.offset]);
  const ranks: Record<string, number> = {};
  const taken = new Set<number>();
  for (const [name, list] of [...offsets].sort(([a], [b]) => a.localeCompare(b))) {
    const fits = [1, 2, 3, 4, 5, 6, 7, 8, 9].filter((v) => list.every((o) => v + o >= 1 && v + o <= 9));
    const value = fits.find((v) => !taken.has(v)) ?? fits[0] ?? 1;
    taken.add(value);
    ranks[name] = value;
  }
  return { suits: LETTER_SUIT, ranks };
}

function suitOfRef(ref: string, example: Example): Suit | null {
  if ((SUITS as readonly string[]).includes(ref)) return ref as Suit;
  return example.suits[ref] ?? null;
}

/** The kind a group is drawn with, or null when the example can't make one (a rank out of 1–9). */
export function exampleKind(group: Group, example: Example): TileKind | null {
  if ('tile' in group) return group.tile;
  const suit = suitOfRef(group.suit, example);
  if (!suit) return null;
  if ('dragon' in group) return MATCHING_DRAGON[suit];
  const rank = typeof group.rank === 'number' ? group.rank : (example.ranks[group.rank.var] ?? 1) + group.rank.offset;
  return rank >= 1 && rank <= 9 ? suitKind(suit, rank) : null;
}

export function rankWords(rank: number | { var: string; offset: number }): string {
  if (typeof rank === 'number') return String(rank);
  return rank.offset === 0 ? rank.var : `${rank.var}${rank.offset > 0 ? '+' : ''}${rank.offset}`;
}

/** The rule of a group in words: "kong of suit A, rank n+1". */
export function groupWords(group: Group): string {
  const name = GROUP_NAMES[group.size] ?? `${group.size} tiles`;
  if ('tile' in group) return `${name} of ${tileName(group.tile)}`;
  const suit = group.suit.length === 1 ? `suit ${group.suit}` : `${group.suit}s`;
  if ('dragon' in group) return `${name} of the dragon matching ${suit}`;
  return `${name} of ${suit}, rank ${rankWords(group.rank)}`;
}

/** What the example means, for a caption: "Shown with A = bam, B = crack, n = 2". */
export function exampleWords(pattern: Pick<Pattern, 'groups'>, example: Example): string {
  const letters = [...new Set(pattern.groups.flatMap((g) => ('suit' in g && g.suit.length === 1 ? [g.suit] : [])))].sort();
  const parts = [...letters.map((l) => `${l} = ${example.suits[l]}`), ...Object.entries(example.ranks).map(([v, n]) => `${v} = ${n}`)];
  return parts.length ? `Shown with ${parts.join(', ')}` : '';
}

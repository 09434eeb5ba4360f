/** Plain words about tiles, the way a teacher says them. */
import { tileName, type TileKind } from '../tiles';

const NUMBER_WORDS = ['no', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight'];

export function numberWord(n: number): string {
  return NUMBER_WORDS[n] ?? String(n);
}

/** "4 dots", "north winds", "flowers". */
export function pluralName(kind: TileKind): string {
  return `${tileName(kind)}s`;
}

/** "a flower", "an 8 bam", "two north winds". */
export function countOf(kind: TileKind, n: number): string {
  if (n === 1) return `${/^[8aeiou]/.test(tileName(kind)) ? 'an' : 'a'} ${tileName(kind)}`;
  return `${numberWord(n)} ${pluralName(kind)}`;
}

const SET_WORDS: Record<number, string> = { 2: 'pair', 3: 'pung', 4: 'kong', 5: 'quint', 6: 'sextet' };

/** "pair of 4 dots", "pung of north winds". */
export function multipleOf(kind: TileKind, n: number): string {
  return `${SET_WORDS[Math.min(n, 6)] ?? 'set'} of ${pluralName(kind)}`;
}

/** "a", "a and b", "a, b and c". */
export function joinWords(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

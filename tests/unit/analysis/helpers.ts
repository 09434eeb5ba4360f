/** Test helpers: small builders and a deliberately naive tiles-away to check the fast one against. */
import type { Group, Pattern } from '../../../shared/analysis';
import { MATCHING_DRAGON, SUITS, suitKind, type Suit, type TileKind } from '../../../shared/tiles';

export function times(kind: TileKind, n: number): TileKind[] {
  return Array.from({ length: n }, () => kind);
}

export function rack(...parts: [TileKind, number][]): TileKind[] {
  return parts.flatMap(([kind, n]) => times(kind, n));
}

export function testPattern(id: string, groups: Group[], extra: Partial<Pattern> = {}): Pattern {
  return { id, name: `Test ${id}`, family: 'test', value: 25, sealed: false, groups, ...extra };
}

/**
 * Naive tiles-away: every function from letters to suits and from variables to 1–9, keeping
 * only those with distinct suits, distinct numbers and every rank in range; then for each, a
 * maximum bipartite matching of hand tiles to the 14 slots (a joker may take any slot of a
 * group of three or more).
 */
export function naiveAway(hand: readonly TileKind[], pattern: Pattern): number {
  const letters = [...new Set(pattern.groups.flatMap((g) => ('suit' in g && /^[ABC]$/.test(g.suit) ? [g.suit] : [])))];
  const vars = [...new Set(pattern.groups.flatMap((g) => ('rank' in g && typeof g.rank === 'object' ? [g.rank.var] : [])))];
  let best = 0;
  for (let s = 0; s < SUITS.length ** letters.length; s++) {
    const suitOf: Record<string, Suit> = {};
    letters.forEach((letter, i) => (suitOf[letter] = SUITS[Math.floor(s / SUITS.length ** i) % SUITS.length]));
    if (new Set(Object.values(suitOf)).size !== letters.length) continue;
    for (let r = 0; r < 9 ** vars.length; r++) {
      const value: Record<string, number> = {};
      vars.forEach((v, i) => (value[v] = 1 + (Math.floor(r / 9 ** i) % 9)));
      if (new Set(Object.values(value)).size !== vars.length) continue;
      const slots: { kind: TileKind; joker: boolean }[] = [];
      let inRange = true;
      for (const g of pattern.groups) {
        let kind: TileKind;
        if ('tile' in g) kind = g.tile;
        else {
          const suit = /^[ABC]$/.test(g.suit) ? suitOf[g.suit] : (g.suit as Suit);
          if ('dragon' in g) kind = MATCHING_DRAGON[suit];
          else {
            const rank = typeof g.rank === 'number' ? g.rank : value[g.rank.var] + g.rank.offset;
            if (rank < 1 || rank > 9) inRange = false;
            kind = suitKind(suit, rank);
          }
        }
        for (let i = 0; i < g.size; i++) slots.push({ kind, joker: g.size >= 3 });
      }
      if (!inRange) continue;
      best = Math.max(best, matching(hand, slots));
    }
  }
  return 14 - best;
}

/** Kuhn's augmenting paths: the most hand tiles that each take a slot they may fill. */
function matching(hand: readonly TileKind[], slots: { kind: TileKind; joker: boolean }[]): number {
  const owner = new Array<number>(slots.length).fill(-1);
  const fits = (t: number, s: number) => (hand[t] === 'joker' ? slots[s].joker : hand[t] === slots[s].kind);
  const tryTile = (t: number, seen: boolean[]): boolean => {
    for (let s = 0; s < slots.length; s++) {
      if (seen[s] || !fits(t, s)) continue;
      seen[s] = true;
      if (owner[s] < 0 || tryTile(owner[s], seen)) {
        owner[s] = t;
        return true;
      }
    }
    return false;
  };
  let matched = 0;
  for (let t = 0; t < hand.length; t++) if (tryTile(t, new Array<boolean>(slots.length).fill(false))) matched++;
  return matched;
}

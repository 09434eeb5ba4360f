import { expect, test } from 'vitest';
import { starterPatterns, summarizeRack, tilesAway } from '../../../shared/analysis';
import type { TileKind } from '../../../shared/tiles';
import { rack } from './helpers';

const hand: TileKind[] = [
  ...rack(['dot2', 2], ['dot4', 3], ['dot5', 1], ['dot7', 1], ['bam3', 2], ['crack8', 1]),
  ...rack(['wind-n', 1], ['dragon-white', 1], ['flower', 1], ['joker', 1]),
];

test('a rack summary counts pairs, pungs, suits, numbers and specials', () => {
  const s = summarizeRack(hand, starterPatterns);
  expect(s.size).toBe(14);
  expect(s.pairs).toEqual(['bam3', 'dot2']);
  expect(s.pungs).toEqual(['dot4']);
  expect(s.bySuit).toEqual({ bam: 2, crack: 1, dot: 7 });
  expect(s.leadingSuit).toBe('dot');
  expect(s.evens).toBe(2 + 3 + 1); // dot2 ×2, dot4 ×3, crack8
  expect(s.odds).toBe(1 + 1 + 2); // dot5, dot7, bam3 ×2
  expect([s.winds, s.dragons, s.flowers, s.jokers]).toEqual([1, 1, 1, 1]);
});

test('the summary names the nearest three patterns, closest first, with their true distance', () => {
  const { nearest } = summarizeRack(hand, starterPatterns);
  expect(nearest).toHaveLength(3);
  const closest = Math.min(...starterPatterns.map((p) => tilesAway(hand, p)));
  expect(nearest[0].away).toBe(closest);
  for (const n of nearest) expect(n.away).toBe(tilesAway(hand, n.pattern));
  expect(nearest[1].away).toBeGreaterThanOrEqual(nearest[0].away);
  expect(nearest[2].away).toBeGreaterThanOrEqual(nearest[1].away);
});

test('a jokers-only pair is not a pair, and a suit tie goes to the suit with more multiples', () => {
  const s = summarizeRack(rack(['joker', 2], ['bam1', 1], ['bam2', 1], ['crack5', 2]), []);
  expect(s.pairs).toEqual(['crack5']);
  expect(s.leadingSuit).toBe('crack');
  expect(s.nearest).toEqual([]);
});

test('a rack with no suit tiles has no leading suit', () => {
  expect(summarizeRack(rack(['wind-e', 3], ['flower', 2]), starterPatterns).leadingSuit).toBeNull();
});

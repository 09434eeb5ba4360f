import { expect, test } from 'vitest';
import { fitDetail, JOKER_MIN_GROUP, rankPatterns, starterPatterns, tilesAway, type Pattern } from '../../../shared/analysis';
import { rack, testPattern } from './helpers';

// The engine's cases use patterns of their own, so they hold whatever the starter list becomes.
// Kong 2, pung 4, pung 6, kong 8, all in one suit.
const evenClimb: Pattern = testPattern('even-climb', [
  { size: 4, suit: 'A', rank: 2 },
  { size: 3, suit: 'A', rank: 4 },
  { size: 3, suit: 'A', rank: 6 },
  { size: 4, suit: 'A', rank: 8 },
]);
const evenClimbInDots = rack(['dot2', 4], ['dot4', 3], ['dot6', 3], ['dot8', 4]);

test('a complete hand is 0 away', () => {
  expect(tilesAway(evenClimbInDots, evenClimb)).toBe(0);
});

test('the suit letter takes any suit', () => {
  expect(tilesAway(rack(['crack2', 4], ['crack4', 3], ['crack6', 3], ['crack8', 4]), evenClimb)).toBe(0);
});

test('one wrong tile is 1 away, two wrong tiles 2 away', () => {
  expect(tilesAway([...evenClimbInDots.slice(1), 'wind-n'], evenClimb)).toBe(1);
  expect(tilesAway([...evenClimbInDots.slice(2), 'wind-n', 'bam2'], evenClimb)).toBe(2);
});

test('a 13-tile rack that fits 13 slots is 1 away', () => {
  expect(tilesAway(evenClimbInDots.slice(1), evenClimb)).toBe(1);
});

test('an empty rack is 14 away', () => {
  expect(tilesAway([], evenClimb)).toBe(14);
});

// Kongs n, n+1, n+2 in suit A and a pair of A's dragon.
const dragonLadder: Pattern = testPattern('dragon-ladder', [
  { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
  { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
  { size: 4, suit: 'A', rank: { var: 'n', offset: 2 } },
  { size: 2, dragon: 'match', suit: 'A' },
]);

test('jokers do not count in a pair', () => {
  const withJokerPair = rack(['bam1', 4], ['bam2', 4], ['bam3', 4], ['joker', 2]);
  expect(tilesAway(withJokerPair, dragonLadder)).toBe(2);
});

test('jokers do count in a kong', () => {
  const jokersInKongs = rack(['bam1', 3], ['joker', 1], ['bam2', 2], ['joker', 2], ['bam3', 4], ['dragon-green', 2]);
  expect(tilesAway(jokersInKongs, dragonLadder)).toBe(0);
});

test('the matching dragon follows its suit', () => {
  expect(tilesAway(rack(['bam1', 4], ['bam2', 4], ['bam3', 4], ['dragon-green', 2]), dragonLadder)).toBe(0);
  expect(tilesAway(rack(['bam1', 4], ['bam2', 4], ['bam3', 4], ['dragon-red', 2]), dragonLadder)).toBe(2);
  expect(tilesAway(rack(['crack1', 4], ['crack2', 4], ['crack3', 4], ['dragon-red', 2]), dragonLadder)).toBe(0);
  expect(tilesAway(rack(['dot7', 4], ['dot8', 4], ['dot9', 4], ['dragon-white', 2]), dragonLadder)).toBe(0);
});

// Pung n, pung n+1, kong n+2, kong n+3 in one suit.
const fourRungs: Pattern = testPattern('four-rungs', [
  { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
  { size: 3, suit: 'A', rank: { var: 'n', offset: 1 } },
  { size: 4, suit: 'A', rank: { var: 'n', offset: 2 } },
  { size: 4, suit: 'A', rank: { var: 'n', offset: 3 } },
]);

test('a run shifts as a whole', () => {
  expect(tilesAway(rack(['dot1', 3], ['dot2', 3], ['dot3', 4], ['dot4', 4]), fourRungs)).toBe(0);
  expect(tilesAway(rack(['dot6', 3], ['dot7', 3], ['dot8', 4], ['dot9', 4]), fourRungs)).toBe(0);
  // 1-2 at the bottom and 8-9 at the top can't both belong to one run: the best is n = 6 (the kongs of 8 and 9).
  expect(tilesAway(rack(['dot1', 3], ['dot2', 3], ['dot8', 4], ['dot9', 4]), fourRungs)).toBe(6);
  expect(fitDetail(rack(['dot1', 3], ['dot2', 3], ['dot8', 4], ['dot9', 4]), fourRungs).assignment.ranks).toEqual({ n: 6 });
});

test('a run never runs past 9', () => {
  // Pungs of 7 and 8 and a kong of 9 would be n = 7, whose top rung would be 10. The best is
  // n = 6: no 6s, three 7s for the second pung, three 8s toward the first kong, four 9s.
  const top = rack(['dot7', 3], ['dot8', 3], ['dot9', 4], ['wind-n', 4]);
  expect(tilesAway(top, fourRungs)).toBe(14 - (3 + 3 + 4));
  expect(fitDetail(top, fourRungs).assignment.ranks).toEqual({ n: 6 });
});

test('suit letters must differ', () => {
  // Kongs of 1 in A, 2 in B, 3 in C and a pair of flowers: all in bams would fit only if letters could share a suit.
  const stairs = testPattern('stairs', [
    { size: 4, suit: 'A', rank: 1 },
    { size: 4, suit: 'B', rank: 2 },
    { size: 4, suit: 'C', rank: 3 },
    { size: 2, tile: 'flower' },
  ]);
  expect(tilesAway(rack(['bam1', 4], ['bam2', 4], ['bam3', 4], ['flower', 2]), stairs)).toBe(8);
  expect(tilesAway(rack(['bam1', 4], ['crack2', 4], ['dot3', 4], ['flower', 2]), stairs)).toBe(0);
});

// A kong of flowers and quints of one number in two suits.
const twinQuints: Pattern = testPattern('twin-quints', [
  { size: 4, tile: 'flower' },
  { size: 5, suit: 'A', rank: { var: 'n', offset: 0 } },
  { size: 5, suit: 'B', rank: { var: 'n', offset: 0 } },
]);

test('a quint needs a joker', () => {
  const noJokers = rack(['flower', 4], ['bam5', 4], ['crack5', 4], ['dot1', 1], ['dot2', 1]);
  expect(tilesAway(noJokers, twinQuints)).toBe(2);
  expect(tilesAway(rack(['flower', 4], ['bam5', 4], ['crack5', 4], ['joker', 2]), twinQuints)).toBe(0);
});

test('jokers fill groups of three or more, never singles or pairs', () => {
  // Common practice, no published source: jokers may fill groups of three or more, never singles or pairs.
  expect(JOKER_MIN_GROUP).toBe(3);
  const allPairs = testPattern(
    'seven-pairs',
    [0, 1, 2, 3, 4, 5, 6].map((offset) => ({ size: 2, suit: 'A' as const, rank: { var: 'n', offset } })),
  );
  expect(tilesAway(rack(['joker', 8], ['bam1', 2], ['bam2', 2], ['bam3', 2]), allPairs)).toBe(8);
  const pung = testPattern('pung', [{ size: 3, tile: 'wind-n' }, { size: 1, tile: 'wind-e' }, { size: 4, tile: 'flower' }, { size: 6, tile: 'dot9' }]);
  expect(tilesAway(rack(['joker', 3], ['flower', 4], ['dot9', 4], ['joker', 2], ['wind-s', 1]), pung)).toBe(1);
});

test('naturals fill a pair before a joker-able group of the same kind', () => {
  // A pair of 5 dots and a pung of 5 dots: two naturals and a joker fill the pung only if the pair gets naturals first.
  const p = testPattern('fives', [{ size: 2, tile: 'dot5' }, { size: 3, tile: 'dot5' }, { size: 4, tile: 'flower' }, { size: 5, tile: 'bam1' }]);
  expect(tilesAway(rack(['dot5', 4], ['joker', 4], ['flower', 4], ['bam1', 2]), p)).toBe(0);
});

test('the fit keeps what counts and lists what is missing', () => {
  const hand = rack(['dot2', 4], ['dot4', 2], ['joker', 1], ['dot6', 3], ['dot8', 2], ['wind-n', 2]);
  const detail = fitDetail(hand, evenClimb);
  expect(detail.away).toBe(2);
  expect(detail.keep).toEqual(rack(['dot2', 4], ['dot4', 2], ['dot6', 3], ['dot8', 2], ['joker', 1]));
  expect(detail.need).toEqual(rack(['dot8', 2]));
  expect(detail.assignment.suits).toEqual({ A: 'dot' });
});

test('rankPatterns puts the closest first and respects the limit', () => {
  const list = [...starterPatterns, evenClimb];
  const ranked = rankPatterns(evenClimbInDots, list, 4);
  expect(ranked).toHaveLength(4);
  expect(ranked[0].pattern.id).toBe('even-climb');
  expect(ranked[0].away).toBe(0);
  expect(ranked[0].keep).toHaveLength(14);
  for (let i = 1; i < ranked.length; i++) expect(ranked[i].away).toBeGreaterThanOrEqual(ranked[i - 1].away);
  expect(rankPatterns(evenClimbInDots, list, 0)).toEqual([]);
});

test('rankPatterns prefers a fit built on naturals when two patterns are equally close', () => {
  const pairs = testPattern('pairs', [1, 2, 3, 4, 5, 6, 7].map((rank) => ({ size: 2, suit: 'bam' as const, rank })));
  const kongs = testPattern('kongs', [{ size: 4, tile: 'bam1' }, { size: 4, tile: 'bam2' }, { size: 6, tile: 'flower' }]);
  const hand = rack(['bam1', 2], ['bam2', 2], ['bam3', 2], ['joker', 2], ['dragon-red', 4], ['wind-n', 2]);
  // Both fit 6 tiles: the pairs with six naturals, the kongs with four naturals and two jokers.
  expect(rankPatterns(hand, [kongs, pairs], 2).map((r) => [r.pattern.id, r.away])).toEqual([
    ['pairs', 8],
    ['kongs', 8],
  ]);
});

test('an invalid pattern is refused with its errors, not judged', () => {
  expect(() => tilesAway([], testPattern('oops', [{ size: 2, tile: 'joker' }, { size: 12, tile: 'flower' }]))).toThrow(/Pattern "oops"/);
});

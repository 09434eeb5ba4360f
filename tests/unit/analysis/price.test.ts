import { expect, test } from 'vitest';
import { missingPrice, rankByPrice, tilesAway, type Pattern } from '../../../shared/analysis';
import type { TileKind } from '../../../shared/tiles';
import { rack, testPattern, times } from './helpers';

/** 13 tiles in place and one single north wind missing. */
const withSingle = testPattern('one-single', [
  { size: 4, tile: 'bam1' },
  { size: 4, tile: 'bam2' },
  { size: 3, tile: 'bam3' },
  { size: 2, tile: 'bam4' },
  { size: 1, tile: 'wind-n' },
]);
const singleRack = rack(['bam1', 4], ['bam2', 4], ['bam3', 3], ['bam4', 2]);

/** The same north wind as the last tile of a pung. */
const withPung = testPattern('one-pung', [
  { size: 4, tile: 'bam1' },
  { size: 4, tile: 'bam2' },
  { size: 3, tile: 'bam3' },
  { size: 3, tile: 'wind-n' },
]);
const pungRack = rack(['bam1', 4], ['bam2', 4], ['bam3', 3], ['wind-n', 2]);

/** An unseen pool: `north` north winds, `jokers` jokers, and tiles none of these patterns use. */
function pool(north: number, jokers = 0): TileKind[] {
  const fillers: TileKind[] = ['dot5', 'dot6', 'dot7', 'crack5', 'crack6', 'crack7'];
  return [...times('wind-n', north), ...times('joker', jokers), ...fillers.flatMap((kind) => times(kind, 4))];
}

test('a missing single with no copy left unseen is impossible', () => {
  const { price, missing } = missingPrice(singleRack, withSingle, pool(0, 8));
  expect(price).toBe(Infinity);
  expect(missing).toEqual([{ kind: 'wind-n', groupSize: 1, jokerable: false, copiesLeft: 0, cost: Infinity }]);
});

test('a missing single costs more as its copies run out', () => {
  const cost = (north: number) => missingPrice(singleRack, withSingle, pool(north)).price;
  expect(cost(4)).toBe(1);
  expect(cost(3)).toBeGreaterThan(cost(4));
  expect(cost(2)).toBeGreaterThan(cost(3));
  expect(cost(1)).toBeGreaterThan(cost(2));
});

test('a missing pung tile costs more as its copies run out, and with jokers gone stays possible only while a copy is left', () => {
  const cost = (north: number, jokers: number) => missingPrice(pungRack, withPung, pool(north, jokers)).price;
  expect(cost(1, 4)).toBeGreaterThan(cost(2, 4));
  expect(cost(0, 4)).toBeGreaterThan(cost(1, 4));
  expect(cost(0, 4)).toBeLessThan(Infinity);
  expect(cost(0, 0)).toBe(Infinity);
});

test('a missing tile of a pung is cheaper than the same tile as a single', () => {
  const single = missingPrice(singleRack, withSingle, pool(2, 4));
  const pung = missingPrice(pungRack, withPung, pool(2, 4));
  expect(single.missing).toMatchObject([{ kind: 'wind-n', groupSize: 1, jokerable: false, copiesLeft: 2 }]);
  expect(pung.missing).toMatchObject([{ kind: 'wind-n', groupSize: 3, jokerable: true, copiesLeft: 2 }]);
  expect(pung.price).toBeLessThan(single.price);
  // Built without calls, the pung tile is still cheaper: a joker can stand in for it.
  const sealed = missingPrice(pungRack, { ...withPung, sealed: true }, pool(2, 4));
  expect(sealed.price).toBeLessThan(single.price);
  expect(sealed.price).toBeGreaterThan(pung.price);
  // With no joker unseen and no calls, the two are the same exact tile.
  expect(missingPrice(pungRack, withPung, pool(2, 0), 0).price).toBe(single.price);
});

test('a second missing tile of a pair counts one copy fewer', () => {
  const pair = testPattern('pair', [
    { size: 4, tile: 'bam1' },
    { size: 4, tile: 'bam2' },
    { size: 4, tile: 'bam3' },
    { size: 2, tile: 'wind-n' },
  ]);
  const { price, missing } = missingPrice(rack(['bam1', 4], ['bam2', 4], ['bam3', 4]), pair, pool(3));
  expect(missing.map((m) => m.cost)).toEqual([4 / 3, 4 / 2]);
  expect(price).toBeCloseTo(4 / 3 + 2);
});

test('a joker on the rack fills a pung tile, never a single', () => {
  const jokerRack = [...singleRack.slice(0, 12), 'joker' as TileKind];
  // bam4 pair now lacks one tile, and the single still lacks its wind: the joker fills neither.
  const { missing } = missingPrice(jokerRack, withSingle, pool(4, 4));
  expect(missing.map((m) => [m.kind, m.jokerable])).toEqual([
    ['bam4', false],
    ['wind-n', false],
  ]);
  const pungWithJoker = [...pungRack.slice(0, 12), 'joker' as TileKind];
  // One wind and the joker: the joker takes the dearer of the two missing winds.
  const before = missingPrice(pungRack.slice(0, 12), withPung, pool(2, 4));
  const after = missingPrice(pungWithJoker, withPung, pool(2, 4));
  expect(before.missing).toHaveLength(2);
  expect(after.missing).toHaveLength(1);
  expect(after.price).toBeLessThan(before.price);
});

test('a finished hand costs nothing', () => {
  expect(missingPrice([...singleRack, 'wind-n'], withSingle)).toEqual({ price: 0, missing: [] });
});

test('the price is the sum of the missing tiles, one per tile away', () => {
  const pattern = testPattern('mixed', [
    { size: 2, tile: 'flower' },
    { size: 3, suit: 'A', rank: 2 },
    { size: 3, suit: 'B', rank: 4 },
    { size: 3, suit: 'C', rank: 6 },
    { size: 3, suit: 'A', rank: 8 },
  ]);
  const hand = rack(['flower', 1], ['bam2', 2], ['crack4', 1], ['dot6', 3], ['bam8', 1], ['wind-e', 3], ['joker', 1], ['dot1', 2]);
  const { price, missing } = missingPrice(hand, pattern);
  expect(missing).toHaveLength(tilesAway(hand, pattern));
  expect(price).toBeCloseTo(missing.reduce((sum, m) => sum + m.cost, 0));
  for (const m of missing) expect(m.jokerable).toBe(m.groupSize >= 3);
});

/** Seven singles and pairs (no jokers, no calls) against seven missing pung tiles. */
const exact: Pattern = testPattern(
  'exact',
  [
    { size: 2, tile: 'wind-n' },
    { size: 2, tile: 'wind-e' },
    { size: 2, tile: 'wind-s' },
    { size: 2, tile: 'wind-w' },
    { size: 2, tile: 'dragon-red' },
    { size: 2, tile: 'dragon-green' },
    { size: 2, tile: 'dragon-white' },
  ],
  { sealed: true },
);
const pungs: Pattern = testPattern('pungs', [
  { size: 3, tile: 'bam1' },
  { size: 3, tile: 'bam3' },
  { size: 4, tile: 'bam5' },
  { size: 4, tile: 'bam7' },
]);

test('seven away in singles and pairs costs more than seven away in pungs, and ranks below it', () => {
  const hand = rack(['wind-n', 1], ['wind-e', 1], ['wind-s', 1], ['wind-w', 1], ['dragon-red', 1], ['dragon-green', 1], ['dragon-white', 1], ['bam1', 2], ['bam3', 2], ['bam5', 2], ['bam7', 1]);
  expect(tilesAway(hand, exact)).toBe(7);
  expect(tilesAway(hand, pungs)).toBe(7);
  const ranked = rankByPrice(hand, [exact, pungs], 2);
  expect(ranked.map((r) => r.pattern.id)).toEqual(['pungs', 'exact']);
  expect(ranked[1].price).toBeGreaterThan(ranked[0].price);
  expect(ranked.map((r) => r.away)).toEqual([7, 7]);
  expect(ranked[0].jokerRoom).toBe(7);
  expect(ranked[1].jokerRoom).toBe(0);
  expect(ranked[0].need).toHaveLength(7);
});

test('rankByPrice breaks a tie in price toward the hand that can use more jokers', () => {
  const pairHand = testPattern('pair-hand', [
    { size: 4, tile: 'bam1' },
    { size: 4, tile: 'bam2' },
    { size: 3, tile: 'bam3' },
    { size: 2, tile: 'wind-n' },
    { size: 1, tile: 'dot9' },
  ]);
  const pungHand = testPattern('pung-hand', [
    { size: 4, tile: 'bam1' },
    { size: 4, tile: 'bam2' },
    { size: 3, tile: 'bam3' },
    { size: 3, tile: 'wind-e' },
  ]);
  const hand = rack(['bam1', 4], ['bam2', 4], ['bam3', 3], ['wind-e', 1], ['dot9', 1]);
  // Each lacks two tiles of a kind with three copies unseen; no joker unseen and no calls, so the prices are equal.
  const unseen = rack(['wind-n', 3], ['wind-e', 3], ['dot5', 4]);
  const ranked = rankByPrice(hand, [pairHand, pungHand], 2, unseen, 0);
  expect(ranked[0].price).toBe(ranked[1].price);
  expect(ranked.map((r) => r.away)).toEqual([2, 2]);
  expect(ranked.map((r) => [r.pattern.id, r.jokerRoom])).toEqual([
    ['pung-hand', 2],
    ['pair-hand', 0],
  ]);
});

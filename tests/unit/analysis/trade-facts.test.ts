/**
 * The facts about the game that rack analysis (tiles away, prices, finishing odds) takes for
 * granted, checked where the analysis uses them.
 */
import { expect, test } from 'vitest';
import { HAND_SIZE, JOKER_MIN_GROUP, missingPrice, tilesAway, validatePattern } from '../../../shared/analysis';
import { createExchange } from '../../../shared/exchange';
import { dealtRackSize, SEATS } from '../../../shared/seats';
import { copiesInSet, DRAGON_KINDS, fullSet, SET_SIZE, SUIT_KINDS, TILE_KINDS, WIND_KINDS, type TileKind } from '../../../shared/tiles';
import { rack, testPattern } from './helpers';

const count = (kinds: readonly TileKind[], kind: TileKind) => kinds.filter((k) => k === kind).length;

test('a set has 152 tiles', () => {
  expect(SET_SIZE).toBe(152); // common practice, no published source
  expect(fullSet()).toHaveLength(152); // common practice, no published source
});

test('each suit tile, wind and dragon comes four times, and a seat that has seen none counts four unseen', () => {
  for (const kind of [...SUIT_KINDS, ...WIND_KINDS, ...DRAGON_KINDS]) {
    expect(copiesInSet(kind)).toBe(4); // common practice, no published source
    expect(count(fullSet(), kind)).toBe(4); // common practice, no published source
  }
  // Three suits of nine, four winds, three dragons (common practice, no published source).
  expect([SUIT_KINDS.length, WIND_KINDS.length, DRAGON_KINDS.length]).toEqual([27, 4, 3]);
  const single = testPattern('one-of-each', [
    { size: 4, tile: 'bam1' },
    { size: 4, tile: 'bam2' },
    { size: 4, tile: 'bam3' },
    { size: 1, tile: 'wind-n' },
    { size: 1, tile: 'dragon-red' },
  ]);
  const { missing } = missingPrice(rack(['bam1', 4], ['bam2', 4], ['bam3', 4]), single);
  expect(missing.map((m) => [m.kind, m.copiesLeft])).toEqual([
    ['wind-n', 4],
    ['dragon-red', 4],
  ]);
});

test('a set has eight flowers and eight jokers', () => {
  expect(copiesInSet('flower')).toBe(8); // common practice, no published source
  expect(copiesInSet('joker')).toBe(8); // common practice, no published source
  expect(count(fullSet(), 'flower')).toBe(8); // common practice, no published source
  expect(count(fullSet(), 'joker')).toBe(8); // common practice, no published source
  expect(TILE_KINDS).toHaveLength(27 + 4 + 3 + 2);
});

test('jokers stand in only for tiles of groups of three or more, never for a single or a pair', () => {
  expect(JOKER_MIN_GROUP).toBe(3); // common practice, no published source
  const pattern = testPattern('sizes', [
    { size: 1, tile: 'wind-n' },
    { size: 2, tile: 'wind-e' },
    { size: 3, tile: 'bam1' },
    { size: 4, tile: 'bam2' },
    { size: 4, tile: 'bam3' },
  ]);
  const base = rack(['bam1', 2], ['bam2', 4], ['bam3', 4]);
  // A joker counts for the pung's third tile (common practice, no published source)…
  expect(tilesAway([...base, 'joker'], pattern)).toBe(tilesAway(base, pattern) - 1);
  // …and not for the single or the pair once the pung is full (common practice, no published source).
  const full = rack(['bam1', 3], ['bam2', 4], ['bam3', 4]);
  expect(tilesAway([...full, 'joker'], pattern)).toBe(tilesAway(full, pattern));
  const { missing } = missingPrice(rack(['bam2', 4], ['bam3', 4]), pattern);
  for (const m of missing) expect(m.jokerable).toBe(m.groupSize >= 3); // common practice, no published source
  expect(missing.map((m) => m.groupSize).sort()).toEqual([1, 2, 2, 3, 3, 3]);
  // A group can't be made of jokers (common practice, no published source).
  expect(validatePattern(testPattern('joker-pung', [{ size: 3, tile: 'joker' }, ...pattern.groups.slice(2)]))).not.toEqual([]);
});

test('east is dealt 14 tiles and every other seat 13; a finished hand has 14', () => {
  expect(HAND_SIZE).toBe(14); // common practice, no published source
  expect(dealtRackSize('east')).toBe(14); // common practice, no published source
  for (const seat of SEATS.filter((s) => s !== 'east')) expect(dealtRackSize(seat)).toBe(13); // common practice, no published source
  const { racks } = createExchange({ seed: 'trade-facts' });
  expect(SEATS.map((seat) => racks[seat].length)).toEqual([14, 13, 13, 13]); // common practice, no published source
});

import { expect, test } from 'vitest';
import { createExchange, phaseOf, rackOf, validateOptions } from '../../../shared/exchange';
import { SEATS } from '../../../shared/seats';
import { fullSet } from '../../../shared/tiles';
import { allIds, allKinds } from './helpers';

const seed = 'harbor-lane-week-01';

test('east is dealt 14 and the others 13', () => {
  const state = createExchange({ seed });
  expect(SEATS.map((seat) => state.racks[seat].length)).toEqual([14, 13, 13, 13]); // common practice, from memory
});

test('the rest of the set stays in the wall', () => {
  const state = createExchange({ seed });
  expect(state.wall).toHaveLength(152 - 53);
  expect(allKinds(state)).toEqual(fullSet().sort());
  expect(new Set(allIds(state)).size).toBe(152);
});

test('the same seed deals the same racks', () => {
  expect(createExchange({ seed })).toEqual(createExchange({ seed }));
});

test('another seed deals other racks', () => {
  expect(createExchange({ seed }).racks.east).not.toEqual(createExchange({ seed: 'harbor-lane-week-02' }).racks.east);
});

test('a deal without jokers uses the 144-tile set', () => {
  const state = createExchange({ seed, jokers: false });
  expect(allKinds(state)).toEqual(fullSet(false).sort());
  expect(allKinds(state)).not.toContain('joker');
});

test('an exchange starts with the first pass right', () => {
  expect(phaseOf(createExchange({ seed }))).toBe('first-right');
});

test('options get their defaults', () => {
  expect(createExchange({ seed }).options).toEqual({ seed, jokers: true, secondCharleston: true, courtesy: true });
});

test('a preset rack is dealt as given', () => {
  const east = fullSet().filter((kind) => kind !== 'joker').slice(0, 14);
  const state = createExchange({ seed, racks: { east } });
  expect(rackOf(state, 'east').map((tile) => tile.kind)).toEqual(east);
  expect(allKinds(state)).toEqual(fullSet().sort());
});

test('preset racks take their tiles out of what the others are dealt', () => {
  const jokers = Array.from({ length: 8 }, () => 'joker' as const);
  const state = createExchange({ seed, racks: { south: [...jokers, 'bam1', 'bam1', 'bam1', 'bam1', 'flower'] } });
  for (const seat of ['east', 'west', 'north'] as const) expect(state.racks[seat].some((tile) => tile.kind === 'joker')).toBe(false);
  expect(state.wall.filter((tile) => tile.kind === 'bam1')).toHaveLength(0);
});

test('a partial preset rack is filled up from the wall', () => {
  const state = createExchange({ seed, racks: { west: ['dot5', 'dot5'] } });
  expect(state.racks.west).toHaveLength(13);
  expect(state.racks.west.slice(0, 2).map((tile) => tile.kind)).toEqual(['dot5', 'dot5']);
});

test('the deal is plain JSON', () => {
  const state = createExchange({ seed, racks: { north: ['flower'] } });
  expect(JSON.parse(JSON.stringify(state))).toStrictEqual(state);
});

test('a 15-tile preset rack is refused', () => {
  const racks = { east: fullSet().slice(0, 15) };
  expect(validateOptions({ seed, racks })).toBe("East's preset rack has 15 tiles; east holds 14. Remove 1 tile.");
  expect(() => createExchange({ seed, racks })).toThrow("East's preset rack has 15 tiles");
});

test('a 14-tile preset rack for a seat that holds 13 is refused', () => {
  expect(validateOptions({ seed, racks: { south: fullSet().slice(0, 14) } })).toMatch(/South's preset rack has 14 tiles; south holds 13/);
});

test('a fifth bam 3 is refused', () => {
  const options = { seed, racks: { east: ['bam3' as const, 'bam3' as const, 'bam3' as const], west: ['bam3' as const, 'bam3' as const] } };
  expect(validateOptions(options)).toBe('The preset racks hold 5 × 3 bam, but the set has only 4.');
  expect(() => createExchange(options)).toThrow('5 × 3 bam');
});

test('a ninth joker is refused', () => {
  expect(validateOptions({ seed, racks: { east: Array.from({ length: 9 }, () => 'joker' as const) } })).toBe(
    'The preset racks hold 9 × joker, but the set has only 8.',
  );
});

test('a joker in a joker-free deal is refused', () => {
  const options = { seed, jokers: false, racks: { north: ['joker' as const] } };
  expect(validateOptions(options)).toBe("This exchange is dealt without jokers, but north's preset rack holds one. Remove it or turn jokers on.");
  expect(() => createExchange(options)).toThrow('without jokers');
});

test('an unknown tile in a preset is refused', () => {
  expect(validateOptions({ seed, racks: { east: ['bam0'] } })).toBe('East\'s preset rack lists "bam0", which is not a tile.');
});

test('an unknown seat in a preset is refused', () => {
  expect(validateOptions({ seed, racks: { centre: ['bam1'] } })).toBe('"centre" is not a seat. Use east, south, west or north.');
});

test('a missing seed is refused', () => {
  expect(validateOptions({ seed: '' })).toBe('Give the exchange a seed (any text).');
  expect(validateOptions({})).toBe('Give the exchange a seed (any text).');
  expect(validateOptions(null)).toBe('Options are missing.');
});

test('a flag that is not true or false is refused', () => {
  expect(validateOptions({ seed, courtesy: 'yes' })).toBe('The option "courtesy" must be true or false.');
});

test('good options pass validation', () => {
  expect(validateOptions({ seed })).toBeNull();
  expect(validateOptions({ seed, jokers: false, secondCharleston: false, courtesy: false, racks: { east: ['bam1'] } })).toBeNull();
});

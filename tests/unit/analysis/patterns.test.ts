import { expect, test } from 'vitest';
import {
  enumerateAssignments,
  HAND_SIZE,
  JOKER_MIN_GROUP,
  patternSchema,
  starterPatterns,
  STARTER_FAMILIES,
  validatePattern,
  validatePatternList,
  type Pattern,
} from '../../../shared/analysis';
import { testPattern } from './helpers';

test('every starter pattern passes the schema', () => {
  expect(validatePatternList(starterPatterns)).toEqual([]);
  for (const pattern of starterPatterns) expect(patternSchema.safeParse(pattern).success).toBe(true);
});

test('the starter list has 40 or more patterns with unique ids and names', () => {
  expect(starterPatterns.length).toBeGreaterThanOrEqual(40);
  expect(new Set(starterPatterns.map((p) => p.id)).size).toBe(starterPatterns.length);
  expect(new Set(starterPatterns.map((p) => p.name)).size).toBe(starterPatterns.length);
});

test('every starter family is described, has two or more patterns, and its patterns sit together in the list', () => {
  const families = [...new Set(starterPatterns.map((p) => p.family))];
  expect(families).toEqual(Object.keys(STARTER_FAMILIES));
  for (const family of families) expect(starterPatterns.filter((p) => p.family === family).length).toBeGreaterThanOrEqual(2);
  const order = starterPatterns.map((p) => families.indexOf(p.family));
  expect(order).toEqual([...order].sort((a, b) => a - b));
});

test('each starter id is its family and its place in the family', () => {
  for (const family of Object.keys(STARTER_FAMILIES)) {
    expect(starterPatterns.filter((p) => p.family === family).map((p) => p.id)).toEqual(
      starterPatterns.filter((p) => p.family === family).map((_, i) => `${family}-${i + 1}`),
    );
  }
});

/** Each capability the starter list keeps, as a test of its groups. */
const runs = (p: Pattern) => p.groups.some((g) => 'rank' in g && typeof g.rank === 'object' && g.rank.offset > 0);
const suitLetters = (p: Pattern) => new Set(p.groups.flatMap((g) => ('suit' in g && !('dragon' in g) ? [g.suit] : [])));
const matching = (p: Pattern) =>
  p.groups.some((g, i) => 'rank' in g && p.groups.some((h, j) => j !== i && 'rank' in h && JSON.stringify(h.rank) === JSON.stringify(g.rank) && h.suit !== g.suit));
const honours = (p: Pattern) => p.groups.filter((g) => 'dragon' in g || ('tile' in g && /^(wind|dragon)-/.test(g.tile))).reduce((n, g) => n + g.size, 0);
const flowersIn = (p: Pattern) => p.groups.filter((g) => 'tile' in g && g.tile === 'flower').reduce((n, g) => n + g.size, 0);

test('the starter list keeps runs, numbers matched across suits, winds and dragons, flowers, quints, singles and pairs, and sealed hands', () => {
  const count = (test: (p: Pattern) => boolean) => starterPatterns.filter(test).length;
  expect(count((p) => runs(p) && suitLetters(p).size === 1)).toBeGreaterThanOrEqual(3);
  expect(count((p) => runs(p) && suitLetters(p).size >= 2)).toBeGreaterThanOrEqual(3);
  expect(count(matching)).toBeGreaterThanOrEqual(3);
  expect(count((p) => honours(p) >= 10)).toBeGreaterThanOrEqual(3);
  expect(count((p) => flowersIn(p) >= 4)).toBeGreaterThanOrEqual(4);
  expect(count((p) => p.groups.every((g) => g.size < JOKER_MIN_GROUP))).toBeGreaterThanOrEqual(3);
  expect(count((p) => p.sealed)).toBeGreaterThanOrEqual(4);
  expect(count((p) => p.sealed && p.groups.some((g) => g.size >= JOKER_MIN_GROUP))).toBeGreaterThanOrEqual(1);
});

test('the cargo family really needs jokers: each has a group of five or more of one number, dragon or wind (a set holds four of each; jokers fill groups of three or more: common practice, no published source)', () => {
  const cargo = starterPatterns.filter((p) => p.family === 'cargo');
  expect(cargo.length).toBeGreaterThan(0);
  for (const p of cargo) {
    expect(p.groups.some((g) => g.size >= 5 && !('tile' in g && g.tile === 'flower'))).toBe(true);
  }
});

test('the pebbles family is sealed and made only of singles and pairs', () => {
  const pebbles = starterPatterns.filter((p) => p.family === 'pebbles');
  expect(pebbles.length).toBeGreaterThan(0);
  for (const p of pebbles) {
    expect(p.sealed).toBe(true);
    expect(p.groups.every((g) => g.size < JOKER_MIN_GROUP)).toBe(true);
  }
});

test('starter values are on Rackside\'s own scale: 10 to 100 in steps of 5, the sealed hands of pairs worth more than any hand of pungs that takes calls', () => {
  for (const p of starterPatterns) {
    expect(p.value).toBeGreaterThanOrEqual(10);
    expect(p.value).toBeLessThanOrEqual(100);
    expect(p.value % 5).toBe(0);
  }
  const pebbles = starterPatterns.filter((p) => p.family === 'pebbles').map((p) => p.value);
  const open = starterPatterns.filter((p) => !p.sealed && p.groups.every((g) => g.size >= 2 && g.size <= 4)).map((p) => p.value);
  expect(Math.min(...pebbles)).toBeGreaterThan(Math.min(...open));
});

const base = (groups: Pattern['groups']): Pattern => testPattern('bad-01', groups);
const flowers = (size: number) => ({ size, tile: 'flower' as const });

test('a pair of jokers is rejected, naming the pattern and the group', () => {
  const errors = validatePattern(base([{ size: 2, tile: 'joker' }, flowers(4), { size: 4, suit: 'A', rank: 1 }, { size: 4, suit: 'B', rank: 1 }]));
  expect(errors).toHaveLength(1);
  expect(errors[0]).toMatch(/^Pattern "bad-01", group 1 of 4: /);
  expect(errors[0]).toMatch(/jokers/);
});

test('five natural 3 bams (two pairs and a single) are rejected, naming the groups', () => {
  const errors = validatePattern(
    base([{ size: 2, tile: 'bam3' }, { size: 2, tile: 'bam3' }, { size: 1, tile: 'bam3' }, flowers(4), { size: 5, suit: 'dot', rank: 9 }]),
  );
  expect(errors).toHaveLength(1);
  expect(errors[0]).toMatch(/^Pattern "bad-01", group 3 of 5: Groups 1, 2 and 3 need 5 natural 3 bam tiles between them/);
});

test('five of one kind through one suit letter and one rank variable is caught too', () => {
  const errors = validatePattern(
    base([
      { size: 2, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 1, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, tile: 'flower' },
      { size: 5, tile: 'wind-e' },
    ]),
  );
  expect(errors.join('\n')).toMatch(/group 3 of 5: Groups 1, 2 and 3 need 5 natural/);
});

test('a quint of one tile is allowed: jokers fill it', () => {
  expect(validatePattern(base([{ size: 5, tile: 'bam3' }, { size: 5, tile: 'dot3' }, flowers(4)]))).toEqual([]);
});

test('a pattern needing more than eight jokers is rejected', () => {
  // Fourteen 3 bams: a set has four, so ten would have to be jokers.
  const errors = validatePattern(base([{ size: 5, tile: 'bam3' }, { size: 5, tile: 'bam3' }, { size: 4, tile: 'bam3' }]));
  expect(errors.join('\n')).toMatch(/needs at least 10 jokers, and a set has 8/);
});

test('sizes must add up to 14', () => {
  const errors = validatePattern(base([flowers(4), { size: 4, suit: 'A', rank: 1 }]));
  expect(errors).toEqual([`Pattern "bad-01": The groups add up to 8 tiles; a hand has ${HAND_SIZE}.`]);
});

test('group sizes run from 1 to 6', () => {
  expect(validatePattern(base([flowers(7), flowers(7)]))[0]).toMatch(/group 1 of 2: A group holds at most 6 tiles/);
  expect(validatePattern(base([flowers(0), flowers(6), flowers(6), flowers(2)]))[0]).toMatch(/group 1 of 4: A group holds at least 1 tile/);
});

test('rank offsets must leave every rank within 1–9 for some number', () => {
  const errors = validatePattern(
    base([
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 9 } },
      flowers(6),
    ]),
  );
  expect(errors.join('\n')).toMatch(/group 2 of 3/);
});

test('fixed ranks outside 1–9 and unknown suits or tiles are refused', () => {
  expect(validatePattern(base([{ size: 4, suit: 'A', rank: 10 }, flowers(6), flowers(4)]))[0]).toMatch(/group 1 of 3/);
  expect(validatePattern(base([{ size: 4, suit: 'D' as never, rank: 1 }, flowers(6), flowers(4)]))[0]).toMatch(/group 1 of 3/);
  expect(validatePattern(base([{ size: 4, tile: 'bam10' as never }, flowers(6), flowers(4)]))[0]).toMatch(/group 1 of 3/);
});

test('two rank variables must take different numbers', () => {
  const p = base([
    { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
    { size: 4, suit: 'B', rank: { var: 'm', offset: 0 } },
    flowers(6),
  ]);
  const assignments = enumerateAssignments(p);
  expect(assignments.every((a) => a.ranks.n !== a.ranks.m)).toBe(true);
  expect(assignments).toHaveLength(6 * 9 * 8); // ordered pairs of distinct suits × ordered pairs of distinct numbers
});

test('two variables pinned to the same only number leave no assignment and are rejected', () => {
  const errors = validatePattern(
    base([
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 8 } },
      { size: 3, suit: 'B', rank: { var: 'm', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'm', offset: 8 } },
    ]),
  );
  expect(errors.join('\n')).toMatch(/No choice of suits and numbers fits/);
});

test('ill-formed input gets readable errors instead of a crash', () => {
  expect(validatePattern(null)[0]).toMatch(/^Pattern "\(no id\)"/);
  expect(validatePattern({ id: 'x-1' })[0]).toMatch(/^Pattern "x-1", name/);
  expect(validatePattern({ ...base([flowers(14)]), extra: true }).length).toBeGreaterThan(0);
});

test('duplicate ids in a list are reported', () => {
  const p = starterPatterns[0];
  expect(validatePatternList([p, { ...p }])).toEqual([`Pattern "${p.id}": another pattern in this list has the same id.`]);
});

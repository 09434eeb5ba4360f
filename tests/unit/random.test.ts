import jStat from 'jstat';
import seedrandom from 'seedrandom';
import { expect, test } from 'vitest';
import { createExchange } from '../../shared/exchange';
import { opaqueIds, pickSome, randomInt, rngFor, shuffle } from '../../shared/random';
import { SEATS } from '../../shared/seats';

test("seedrandom gives the first value its README promises for 'hello.'", () => {
  expect(seedrandom('hello.')()).toBe(0.9282578795792454); // seedrandom README (node_modules/seedrandom/README.md)
});

test('the same seed and purpose give the same stream', () => {
  const a = rngFor('harbor-lane-week-01', 'deal');
  const b = rngFor('harbor-lane-week-01', 'deal');
  expect([a(), a(), a()]).toEqual([b(), b(), b()]);
});

test('different purposes give different streams', () => {
  expect(rngFor('s', 'deal')()).not.toBe(rngFor('s', 'tile-ids')());
  expect(rngFor('s', 'blind', 12)()).not.toBe(rngFor('s', 'blind', 13)());
});

test('purposes are joined without ambiguity', () => {
  expect(rngFor('ab', 'c')()).not.toBe(rngFor('a', 'bc')());
});

test('randomInt stays in range', () => {
  const rng = rngFor('range');
  for (let i = 0; i < 1000; i++) {
    const n = randomInt(rng, 7);
    expect(n).toBeGreaterThanOrEqual(0);
    expect(n).toBeLessThan(7);
  }
});

test('shuffle returns a permutation and leaves its input alone', () => {
  const items = Array.from({ length: 152 }, (_, i) => i);
  const shuffled = shuffle(items, rngFor('perm'));
  expect(items).toEqual(Array.from({ length: 152 }, (_, i) => i));
  expect([...shuffled].sort((a, b) => a - b)).toEqual(items);
  expect(shuffled).not.toEqual(items);
});

test('shuffle is deterministic for a seed', () => {
  const items = ['a', 'b', 'c', 'd', 'e'];
  expect(shuffle(items, rngFor('again'))).toEqual(shuffle(items, rngFor('again')));
});

test('shuffle makes each order of three equally likely', () => {
  const rng = rngFor('uniform');
  const seen = new Map<string, number>();
  const runs = 6000;
  for (let i = 0; i < runs; i++) {
    const key = shuffle(['a', 'b', 'c'], rng).join('');
    seen.set(key, (seen.get(key) ?? 0) + 1);
  }
  expect(seen.size).toBe(6);
  const expected = runs / 6;
  const chi = [...seen.values()].reduce((sum, n) => sum + (n - expected) ** 2 / expected, 0);
  expect(chi).toBeLessThan(jStat.chisquare.inv(0.999, 5)); // jstat chisquare.inv: 99.9% point, 5 degrees of freedom
});

test('pickSome chooses distinct items and returns the rest in order', () => {
  const items = ['a', 'b', 'c', 'd', 'e'];
  const { chosen, rest } = pickSome(items, 2, rngFor('pick'));
  expect(chosen).toHaveLength(2);
  expect(new Set(chosen).size).toBe(2);
  expect(rest).toEqual(items.filter((item) => !chosen.includes(item)));
});

test('opaque ids are unique labels t1…tN', () => {
  const ids = opaqueIds('ids', 152);
  expect(new Set(ids).size).toBe(152);
  expect([...ids].sort()).toEqual(Array.from({ length: 152 }, (_, i) => `t${i + 1}`).sort());
});

test('an id does not tell the kind of its tile', () => {
  const kindsOfT1 = new Set<string>();
  for (let i = 0; i < 300; i++) {
    const state = createExchange({ seed: `ids-${i}` });
    const tile = [...SEATS.flatMap((seat) => state.racks[seat]), ...state.wall].find((t) => t.id === 't1')!;
    kindsOfT1.add(tile.kind);
  }
  expect(kindsOfT1.size).toBeGreaterThan(25);
});

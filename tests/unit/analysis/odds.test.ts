import fc from 'fast-check';
import jStat from 'jstat';
import { expect, test } from 'vitest';
import { completionOdds, enumerateAssignments, groupKind, starterPatterns, type Pattern } from '../../../shared/analysis';
import { createExchange } from '../../../shared/exchange';
import { copiesInSet, fullSet, type TileKind } from '../../../shared/tiles';
import { rack, testPattern, times } from './helpers';

const SEED = 20240611;

/** Thirteen tiles in place; the hand lacks one single north wind, which only that exact tile can fill. */
const oneSingle = testPattern('one-single', [
  { size: 4, tile: 'bam1' },
  { size: 4, tile: 'bam2' },
  { size: 3, tile: 'bam3' },
  { size: 2, tile: 'bam4' },
  { size: 1, tile: 'wind-n' },
]);
const oneSingleRack = rack(['bam1', 4], ['bam2', 4], ['bam3', 3], ['bam4', 2]);

/** An unseen pool of `size` tiles holding `copies` of `kind`; the rest are tiles the test patterns never use (and no joker). */
function poolOf(kind: TileKind, copies: number, size: number): TileKind[] {
  const fillers: TileKind[] = ['dot1', 'dot2', 'dot3', 'dot4', 'dot5', 'dot6', 'dot7', 'dot8', 'dot9', 'crack1', 'crack2', 'crack3', 'crack4', 'crack5', 'crack6', 'crack7', 'crack8', 'crack9'];
  const rest = fillers.flatMap((k) => times(k, 4)).slice(0, size - copies);
  return [...times(kind, copies), ...rest];
}

/** Four standard errors of a share estimated from `samples` draws, at the share `p`: a false alarm about once in 16,000 runs. */
function tolerance(p: number, samples: number): number {
  return 4 * Math.sqrt((p * (1 - p)) / samples) + 1e-9;
}

const SAMPLES = 4000;

test.each([
  { copies: 1, unseen: 60, draws: 5 },
  { copies: 2, unseen: 60, draws: 10 },
  { copies: 3, unseen: 60, draws: 15 },
  { copies: 4, unseen: 72, draws: 12 },
])('one tile short, $copies copies left among $unseen unseen, $draws draws, no calls: odds match the hypergeometric figure', ({ copies, unseen, draws }) => {
  const odds = completionOdds(oneSingleRack, [oneSingle], { unseen: poolOf('wind-n', copies, unseen), drawsLeft: draws, samples: SAMPLES, callRate: 0, seed: 'hypergeometric' });
  // jStat documentation: jStat.hypgeom.pdf(k, N, m, n) is the chance of k successes in n draws
  // without replacement from N items of which m are successes. Finishing = at least one copy drawn.
  const exact = 1 - jStat.hypgeom.pdf(0, unseen, copies, draws);
  const found = odds.patterns.find((p) => p.id === 'one-single')!.odds;
  expect(Math.abs(found - exact)).toBeLessThanOrEqual(tolerance(exact, SAMPLES));
  expect(odds.families).toEqual([{ family: 'test', odds: found }]);
});

test('two tiles short of a pair, no calls: odds match the chance of drawing at least two of the copies', () => {
  const pair = testPattern('one-pair', [
    { size: 4, tile: 'bam1' },
    { size: 4, tile: 'bam2' },
    { size: 4, tile: 'bam3' },
    { size: 2, tile: 'wind-n' },
  ]);
  // Twelve tiles in place and one tile no pattern uses.
  const hand = rack(['bam1', 4], ['bam2', 4], ['bam3', 4], ['dragon-red', 1]);
  const [copies, unseen, draws] = [4, 60, 15];
  const found = completionOdds(hand, [pair], { unseen: poolOf('wind-n', copies, unseen), drawsLeft: draws, samples: SAMPLES, callRate: 0, seed: 'pair' }).patterns[0].odds;
  // jStat documentation: jStat.hypgeom.pdf(k, N, m, n), as above; at least two copies among the draws.
  const exact = 1 - jStat.hypgeom.pdf(0, unseen, copies, draws) - jStat.hypgeom.pdf(1, unseen, copies, draws);
  expect(Math.abs(found - exact)).toBeLessThanOrEqual(tolerance(exact, SAMPLES));
});

test('a joker never fills the missing single: a pool of jokers alone gives no chance', () => {
  const odds = completionOdds(oneSingleRack, [oneSingle], { unseen: times('joker', 8), drawsLeft: 2, samples: 50, callRate: 0 });
  expect(odds).toEqual({ patterns: [{ id: 'one-single', odds: 0 }], families: [{ family: 'test', odds: 0 }] });
  // With one copy among the eight, only that copy helps: it is among the two draws a quarter of the time.
  const withOneCopy = completionOdds(oneSingleRack, [oneSingle], { unseen: [...times('joker', 7), 'wind-n'], drawsLeft: 2, samples: 1000, callRate: 0 });
  // jStat documentation: jStat.hypgeom.pdf(k, N, m, n); here 1 - C(7,2)/C(8,2) = 0.25.
  const exact = 1 - jStat.hypgeom.pdf(0, 8, 1, 2);
  expect(Math.abs(withOneCopy.patterns[0].odds - exact)).toBeLessThanOrEqual(tolerance(exact, 1000));
});

test('a joker drawn fills the missing tile of a pung', () => {
  const pung = testPattern('one-pung', [
    { size: 4, tile: 'bam1' },
    { size: 4, tile: 'bam2' },
    { size: 3, tile: 'bam3' },
    { size: 3, tile: 'wind-n' },
  ]);
  const hand = rack(['bam1', 4], ['bam2', 4], ['bam3', 3], ['wind-n', 2]);
  const odds = completionOdds(hand, [pung], { unseen: times('joker', 8), drawsLeft: 1, samples: 20, callRate: 0 });
  expect(odds.patterns).toEqual([{ id: 'one-pung', odds: 1 }]);
});

test('claimed discards help a hand that may be exposed, and less a hand built without calls', () => {
  const pungs = testPattern('pungs', [
    { size: 3, tile: 'bam1' },
    { size: 3, tile: 'bam3' },
    { size: 4, tile: 'bam5' },
    { size: 4, tile: 'bam7' },
  ]);
  const hand = rack(['bam1', 2], ['bam3', 2], ['bam5', 3], ['bam7', 3], ['dot1', 1], ['dot4', 1], ['crack8', 1]);
  const run = (pattern: Pattern, callRate: number) => completionOdds(hand, [pattern], { samples: 600, callRate, seed: 'claims' }).patterns[0].odds;
  const open = run(pungs, 0.6);
  const sealed = run({ ...pungs, sealed: true }, 0.6);
  const none = run(pungs, 0);
  expect(open).toBeGreaterThan(none + 0.1);
  expect(open).toBeGreaterThan(sealed + 0.1);
  // Without calls the two are the same hand: same samples, same figure.
  expect(run({ ...pungs, sealed: true }, 0)).toBe(none);
});

/** A finished hand for a pattern, from one of its assignments, with jokers where the set runs out of naturals. */
function finishedHand(pattern: Pattern, which: number): TileKind[] {
  const assignments = enumerateAssignments(pattern);
  const assignment = assignments[which % assignments.length];
  const used = new Map<TileKind, number>();
  const hand: TileKind[] = [];
  for (const group of pattern.groups) {
    const kind = groupKind(group, assignment);
    for (let i = 0; i < group.size; i++) {
      const natural = (used.get(kind) ?? 0) < copiesInSet(kind);
      hand.push(natural ? kind : 'joker');
      if (natural) used.set(kind, (used.get(kind) ?? 0) + 1);
    }
  }
  return hand;
}

/** A real rack: 13 or 14 distinct tiles of the 152. */
const set = fullSet();
const anyRack = fc
  .shuffledSubarray(
    set.map((_, i) => i),
    { minLength: 13, maxLength: 14 },
  )
  .map((indexes) => indexes.map((i) => set[i]));

test('property: a finished hand gives 1 for its pattern and its family', () => {
  fc.assert(
    fc.property(fc.constantFrom(...starterPatterns), fc.nat(1000), fc.string({ maxLength: 6 }), (pattern, which, seed) => {
      const hand = finishedHand(pattern, which);
      const odds = completionOdds(hand, starterPatterns, { samples: 8, seed, drawsLeft: 3 });
      expect(odds.patterns.find((p) => p.id === pattern.id)?.odds).toBe(1);
      expect(odds.families.find((f) => f.family === pattern.family)?.odds).toBe(1);
    }),
    { seed: SEED, numRuns: 40 },
  );
});

test('property: odds lie in [0, 1], come back the same for the same seed, and more draws never lower them', () => {
  fc.assert(
    fc.property(anyRack, fc.integer({ min: 0, max: 20 }), fc.integer({ min: 1, max: 5 }), fc.string({ maxLength: 6 }), (hand, draws, more, seed) => {
      // Up to ROUND_CAP (25) draws every sample keeps its order, so the comparison holds sample by sample.
      const options = { samples: 24, seed, drawsLeft: draws };
      const fewer = completionOdds(hand, starterPatterns, options);
      expect(completionOdds(hand, starterPatterns, options)).toEqual(fewer);
      const longer = completionOdds(hand, starterPatterns, { ...options, drawsLeft: draws + more });
      for (const p of [...fewer.patterns, ...fewer.families.map((f) => ({ id: f.family, odds: f.odds }))]) {
        expect(p.odds).toBeGreaterThanOrEqual(0);
        expect(p.odds).toBeLessThanOrEqual(1);
      }
      // The same patterns and families are played out: the nearest by price do not depend on draws.
      expect(longer.patterns.map((p) => p.id).sort()).toEqual(fewer.patterns.map((p) => p.id).sort());
      for (const { id, odds } of fewer.patterns) expect(longer.patterns.find((p) => p.id === id)!.odds).toBeGreaterThanOrEqual(odds);
      for (const { family, odds } of fewer.families) expect(longer.families.find((f) => f.family === family)!.odds).toBeGreaterThanOrEqual(odds);
    }),
    { seed: SEED, numRuns: 25 },
  );
});

test('no draws left: only a finished hand has a chance', () => {
  const hand = createExchange({ seed: 'odds-no-draws' }).racks.east.map((t) => t.kind);
  const odds = completionOdds(hand, starterPatterns, { drawsLeft: 0, samples: 10 });
  expect(odds.patterns.length).toBeGreaterThan(0);
  for (const p of odds.patterns) expect(p.odds).toBe(0);
});

test('a dealt rack gets the nearest patterns by price, likeliest first, and their families', () => {
  const hand = createExchange({ seed: 'odds-dealt' }).racks.east.map((t) => t.kind);
  const odds = completionOdds(hand, starterPatterns, { nearest: 6 });
  expect(odds.patterns).toHaveLength(6);
  const values = odds.patterns.map((p) => p.odds);
  expect(values).toEqual([...values].sort((a, b) => b - a));
  const families = new Set(odds.patterns.map((p) => starterPatterns.find((s) => s.id === p.id)!.family));
  expect(new Set(odds.families.map((f) => f.family))).toEqual(families);
  expect(odds.patterns.some((p) => p.odds > 0)).toBe(true);
});

/**
 * How much work one pattern, and one list, may ask of the checker and the compiler: the limits
 * are worked out from the pattern's letters and offsets before anything is enumerated.
 */
import fc from 'fast-check';
import { expect, test } from 'vitest';
import { enumerateAssignments, starterPatterns, validatePattern, validatePatternList, type Group } from '../../../shared/analysis';
import { compileUnchecked } from '../../../shared/analysis/compile';
import { assignmentBound, PATTERN_WORK_LIMITS, rankVariables } from '../../../shared/analysis/pattern';
import { patternFieldErrors } from '../../../shared/pattern-lists';
import { testPattern } from './helpers';
import { eightLetters, worstAllowed, worstAllowedList } from './limit-patterns';

const SEED = Number(process.env.FC_SEED ?? 20240611);
const LETTERS = ['A', 'B', 'C'] as const;

test('a pattern with eight number letters is refused at once, saying why', () => {
  const errors = validatePattern(eightLetters());
  expect(errors).toHaveLength(1);
  expect(errors[0]).toMatch(
    new RegExp(`^Pattern "spread-08": This pattern uses 8 number letters \\(a, b, c, d, e, f, g, h\\); at most ${PATTERN_WORK_LIMITS.rankVariables} are allowed, so Rackside can check it quickly\\.`),
  );
});

test('the refusal reaches the list editor as a field error on the pattern', () => {
  const fields = patternFieldErrors([starterPatterns[0], eightLetters()]);
  expect(Object.keys(fields)).toEqual(['patterns.1.groups']);
  expect(fields['patterns.1.groups']).toMatch(/8 number letters/);
});

test('few letters with wide ranges are refused by the count of choices, before any is tried', () => {
  // Four free numbers in three suits: 6 × 9 × 9 × 9 × 9 choices to try.
  const p = testPattern('wide-04', [
    { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
    { size: 3, suit: 'B', rank: { var: 'm', offset: 0 } },
    { size: 3, suit: 'C', rank: { var: 'k', offset: 0 } },
    { size: 3, suit: 'A', rank: { var: 'j', offset: 0 } },
    { size: 2, tile: 'flower' },
  ]);
  expect(assignmentBound(p)).toBe(6 * 9 ** 4);
  const errors = validatePattern(p);
  expect(errors).toHaveLength(1);
  expect(errors[0]).toMatch(new RegExp(`up to ${(6 * 9 ** 4).toLocaleString('en-US')} ways to choose its suits and numbers; at most ${PATTERN_WORK_LIMITS.assignments.toLocaleString('en-US')}`));

  // Four letters, each tied to itself plus four (n, n+4), keep five numbers each: 3 × 5⁴ choices fit.
  const tied = testPattern('tied-04', [
    { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
    { size: 3, suit: 'A', rank: { var: 'n', offset: 4 } },
    { size: 2, suit: 'bam', rank: { var: 'm', offset: 0 } },
    { size: 2, suit: 'bam', rank: { var: 'm', offset: 4 } },
    { size: 1, suit: 'dot', rank: { var: 'k', offset: 0 } },
    { size: 1, suit: 'dot', rank: { var: 'k', offset: 4 } },
    { size: 1, suit: 'crack', rank: { var: 'j', offset: 0 } },
    { size: 1, suit: 'crack', rank: { var: 'j', offset: 4 } },
  ]);
  expect(rankVariables(tied)).toEqual(['j', 'k', 'm', 'n']);
  expect(assignmentBound(tied)).toBe(3 * 5 ** 4);
  expect(validatePattern(tied)).toEqual([]);
});

test('the costliest allowed pattern is allowed, and sits right at the limit', () => {
  expect(assignmentBound(worstAllowed())).toBe(PATTERN_WORK_LIMITS.assignments);
  expect(validatePattern(worstAllowed())).toEqual([]);
  expect(compileUnchecked(worstAllowed()).assignments.length).toBeLessThanOrEqual(PATTERN_WORK_LIMITS.assignments);
});

test('every starter pattern is well within the limits', () => {
  for (const p of starterPatterns) expect(assignmentBound(p)).toBeLessThanOrEqual(PATTERN_WORK_LIMITS.assignments / 4);
  expect(starterPatterns.reduce((sum, p) => sum + assignmentBound(p), 0)).toBeLessThan(PATTERN_WORK_LIMITS.listAssignments / 10);
});

test('a list of patterns that are each allowed is refused when together they ask too much', () => {
  const count = Math.floor(PATTERN_WORK_LIMITS.listAssignments / PATTERN_WORK_LIMITS.assignments) + 1;
  const list = Array.from({ length: count }, (_, i) => worstAllowed(`worst-${i}`));
  const fields = patternFieldErrors(list);
  expect(Object.keys(fields)).toEqual(['patterns']);
  expect(fields.patterns).toMatch(/^Together these patterns have up to [\d,]+ ways to choose suits and numbers; a list may have at most [\d,]+, so tables can judge racks quickly\./);
  expect(validatePatternList(list)).toEqual([fields.patterns]);
  // One fewer fits.
  expect(patternFieldErrors(list.slice(1))).toEqual({});
});

// Random patterns of up to five number letters, any offsets, suit letters or fixed suits.
const group = fc.oneof(
  fc.record({ size: fc.integer({ min: 1, max: 4 }), tile: fc.constantFrom('flower' as const, 'wind-n' as const, 'dragon-red' as const) }),
  fc.record({
    size: fc.integer({ min: 1, max: 4 }),
    suit: fc.constantFrom('A' as const, 'B' as const, 'C' as const, 'bam' as const),
    rank: fc.oneof(fc.integer({ min: 1, max: 9 }), fc.record({ var: fc.constantFrom('a', 'b', 'c', 'd', 'e'), offset: fc.integer({ min: -3, max: 3 }) })),
  }),
);
const anyPattern = fc.array(group, { minLength: 1, maxLength: 8 }).map((groups) => testPattern('random-01', groups as Group[]));

test('the bound is never below the number of choices, and a pattern within the limits compiles within it', () => {
  fc.assert(
    fc.property(anyPattern, (p) => {
      const bound = assignmentBound(p);
      if (rankVariables(p).length > PATTERN_WORK_LIMITS.rankVariables || bound > PATTERN_WORK_LIMITS.assignments) {
        // Refused, whatever else is wrong with it.
        expect(validatePattern(p).join('\n')).toMatch(/number letters|ways to choose/);
        return;
      }
      const all = enumerateAssignments(p);
      expect(all.length).toBeLessThanOrEqual(bound);
      expect(compileUnchecked(p).assignments.length).toBeLessThanOrEqual(all.length);
      expect(bound).toBeLessThanOrEqual(PATTERN_WORK_LIMITS.assignments);
    }),
    { seed: SEED, numRuns: 400 },
  );
});

test('every shape of letters within the limits: the bound holds for each count of suit letters and number letters', () => {
  // Exhaustive over 0–3 suit letters and 0–4 number letters, each number letter free (the widest range).
  for (let letters = 0; letters <= 3; letters++) {
    for (let vars = 0; vars <= PATTERN_WORK_LIMITS.rankVariables; vars++) {
      const groups: Group[] = [];
      for (let i = 0; i < Math.max(letters, vars); i++) {
        const suit = i < letters ? LETTERS[i] : 'dot';
        groups.push(i < vars ? { size: 1, suit, rank: { var: 'nmkj'[i], offset: 0 } } : { size: 1, suit, rank: 5 });
      }
      const p = testPattern('shape-01', groups);
      const bound = assignmentBound(p);
      expect(bound).toBe((letters === 3 ? 6 : letters === 2 ? 6 : letters === 1 ? 3 : 1) * 9 ** vars);
      if (bound <= PATTERN_WORK_LIMITS.assignments) expect(compileUnchecked(p).assignments.length).toBeLessThanOrEqual(bound);
    }
  }
});

test('the costliest allowed list passes the checks, and its patterns sum to no more than the list budget', () => {
  const list = worstAllowedList();
  expect(list).toHaveLength(200);
  expect(list.reduce((sum, p) => sum + assignmentBound(p), 0)).toBeLessThanOrEqual(PATTERN_WORK_LIMITS.listAssignments);
  expect(patternFieldErrors(list)).toEqual({});
});

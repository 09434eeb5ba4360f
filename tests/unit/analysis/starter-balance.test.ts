/**
 * The starter list is balanced: over 2,000 seeded deals (one rack each, the seat going round),
 * no pattern is the nearest hand too often, and hands of singles and pairs alone, which jokers
 * and calls never help, are not what most racks point at.
 */
import { expect, test } from 'vitest';
import { rankPatterns } from '../../../shared/analysis/away';
import { assignmentBound, PATTERN_WORK_LIMITS, workIssues } from '../../../shared/analysis/pattern';
import { validatePatternList } from '../../../shared/analysis/schema';
import { starterPatterns } from '../../../shared/analysis/starter-patterns';
import { BALANCE_GOALS, dealtRacks, measureBalance, onlySinglesAndPairs } from '../../bench/balance-measure';

const racks = dealtRacks(2000, 'starter-balance', 'one-seat');
const balance = measureBalance(starterPatterns, racks);

test('the measure ranks as rankPatterns does: its nearest hand is rankPatterns\' first', () => {
  for (const rack of racks.slice(0, 50)) {
    const first = rankPatterns(rack, starterPatterns, 1)[0].pattern.id;
    const shares = measureBalance(starterPatterns, [rack]).patterns;
    expect(shares.find((p) => p.nearest === 1)!.id).toBe(first);
  }
});

test('no starter pattern is the nearest hand in more than 8% of 2,000 seeded deals', () => {
  expect(balance.racks).toBe(2000);
  const over = balance.patterns.filter((p) => p.nearest > BALANCE_GOALS.maxNearestShare).map((p) => `${p.id} ${(100 * p.nearest).toFixed(1)}%`);
  expect(over).toEqual([]);
  // Every family is somebody's nearest hand now and then: the list is not carried by a few.
  const families = new Set(balance.patterns.filter((p) => p.nearest > 0).map((p) => p.family));
  expect(families.size).toBeGreaterThanOrEqual(8);
});

test('hands of singles and pairs alone are the nearest hand in at most 25% of those deals, together', () => {
  const ids = starterPatterns.filter(onlySinglesAndPairs).map((p) => p.id);
  expect(ids.length).toBeGreaterThanOrEqual(3);
  expect(balance.singlesAndPairsNearest).toBeLessThanOrEqual(BALANCE_GOALS.maxSinglesAndPairsShare);
});

test('the starter list is valid under the schema and well within the work limits', () => {
  expect(validatePatternList(starterPatterns)).toEqual([]);
  for (const p of starterPatterns) {
    expect(workIssues(p)).toEqual([]);
    expect(assignmentBound(p)).toBeLessThanOrEqual(PATTERN_WORK_LIMITS.assignments / 4);
  }
  expect(starterPatterns.reduce((sum, p) => sum + assignmentBound(p), 0)).toBeLessThan(PATTERN_WORK_LIMITS.listAssignments / 10);
});

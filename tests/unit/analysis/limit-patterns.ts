/** Patterns at and past the work limits, shared by the unit and server tests of those limits. */
import type { Group, Pattern } from '../../../shared/analysis';
import { assignmentBound, PATTERN_WORK_LIMITS } from '../../../shared/analysis/pattern';
import { PATTERN_LIST_LIMITS } from '../../../shared/pattern-lists';
import { testPattern } from './helpers';

const LETTERS = ['A', 'B', 'C'] as const;

/** Eight singles, each with a number letter of its own, over the suit letters; two pungs of winds make 14. */
export function eightLetters(id = 'spread-08'): Pattern {
  const groups: Group[] = 'abcdefgh'.split('').map((v, i) => ({ size: 1, suit: LETTERS[i % 3], rank: { var: v, offset: 0 } }));
  return testPattern(id, [...groups, { size: 3, tile: 'wind-n' }, { size: 3, tile: 'wind-e' }]);
}

/** The costliest pattern the limits allow: three free numbers in three suits. */
export function worstAllowed(id = 'worst-01'): Pattern {
  return testPattern(id, [
    { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
    { size: 4, suit: 'B', rank: { var: 'm', offset: 0 } },
    { size: 3, suit: 'C', rank: { var: 'k', offset: 0 } },
    { size: 3, tile: 'wind-s' },
  ]);
}

/** Cheaper patterns, costliest first, to spend what is left of a list's budget. */
const cheaper: ((id: string) => Pattern)[] = [
  // Two free numbers in three suits: 6 × 9 × 9.
  (id) => testPattern(id, [{ size: 4, suit: 'A', rank: { var: 'n', offset: 0 } }, { size: 4, suit: 'B', rank: { var: 'm', offset: 0 } }, { size: 3, dragon: 'match', suit: 'C' }, { size: 3, tile: 'wind-s' }]),
  // One free number in two suits: 6 × 9.
  (id) => testPattern(id, [{ size: 4, suit: 'A', rank: { var: 'n', offset: 0 } }, { size: 4, suit: 'B', rank: { var: 'n', offset: 0 } }, { size: 3, tile: 'wind-n' }, { size: 3, tile: 'wind-s' }]),
  // Nothing to choose.
  (id) => testPattern(id, [{ size: 4, suit: 'bam', rank: 2 }, { size: 4, suit: 'dot', rank: 4 }, { size: 3, tile: 'wind-n' }, { size: 3, tile: 'wind-s' }]),
];

/**
 * The costliest list the limits allow: as many patterns as a list may hold, each the costliest
 * the list's budget still leaves room for (every one of them the worst allowed pattern, when
 * the budget covers that many).
 */
export function worstAllowedList(count: number = PATTERN_LIST_LIMITS.patternsMax): Pattern[] {
  let left = PATTERN_WORK_LIMITS.listAssignments;
  const out: Pattern[] = [];
  for (let i = 0; i < count; i++) {
    const id = `costly-${String(i).padStart(3, '0')}`;
    const share = left - (count - i - 1); // leave at least 1 for each pattern still to come
    const pattern = [worstAllowed, ...cheaper].map((make) => make(id)).find((p) => assignmentBound(p) <= share);
    if (!pattern) throw new Error('The list budget is too small for a full list of patterns.');
    left -= assignmentBound(pattern);
    out.push(pattern);
  }
  return out;
}

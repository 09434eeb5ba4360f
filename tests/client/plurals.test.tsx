/** Counts on screen take the singular for one: "1 pattern", "1 pass", "1 of 1 seat taken". */
import { expect, test } from 'vitest';
import { countWord, patternsWord, tilesWord } from '../../src/lib/phase-words';
import { seatWords } from '../../src/features/lessons/components/LessonList';

test('countWord and its named forms say one thing, or many', () => {
  expect([0, 1, 2].map(patternsWord)).toEqual(['0 patterns', '1 pattern', '2 patterns']);
  expect([1, 13].map(tilesWord)).toEqual(['1 tile', '13 tiles']);
  expect([1, 3].map((n) => countWord(n, 'pass', 'passes'))).toEqual(['1 pass', '3 passes']);
});

test('a lesson with one seat counts it in the singular', () => {
  const lesson = { seats: 1, seatsTaken: 1, seatsHeld: 0, holdEndsAt: null, priceCents: 0 };
  expect(seatWords(lesson)).toBe('1 of 1 seat taken');
  expect(seatWords({ ...lesson, priceCents: 2000 })).toBe('1 of 1 seat paid');
  expect(seatWords({ ...lesson, seats: 4 })).toBe('1 of 4 seats taken');
});

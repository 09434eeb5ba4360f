/** Seats held by an open checkout are shown apart from paid seats, with when the hold ends. */
import { screen } from '@testing-library/react';
import { expect, test } from 'vitest';
import { seatWords } from '../../src/features/lessons/components/LessonList';
import { fakeApi, renderAt, signedInAs } from './render';

const holdEndsAt = '2030-05-14T22:40:00.000Z';
// The viewer's own clock time, as the page writes it (the test runs in whatever zone the machine has).
const until = new Intl.DateTimeFormat(undefined, { timeStyle: 'short' }).format(new Date(holdEndsAt));

const lesson = {
  id: 3,
  title: 'Harbor Lane week 1',
  description: '',
  teacherId: 1,
  teacherName: 'Ines Okafor',
  startsAt: '2030-05-14T23:00:00.000Z',
  timeZone: 'America/New_York',
  durationMinutes: 60,
  seats: 4,
  seatsTaken: 2,
  seatsHeld: 1,
  holdEndsAt,
  priceCents: 1500,
  currency: 'usd',
  drillIds: [],
  seed: null,
  myStatus: 'enrolled',
  isTeacher: false,
};

test('the words for seats: paid and held apart in a priced lesson, taken in a free one', () => {
  const now = new Date('2030-05-14T22:00:00.000Z');
  expect(seatWords({ ...lesson, seatsTaken: 1, seatsHeld: 0, holdEndsAt: null }, now)).toBe('1 of 4 seats paid');
  expect(seatWords(lesson, now)).toBe(`1 of 4 seats paid · 1 held until ${until} while a student pays`);
  expect(seatWords({ ...lesson, seatsTaken: 3, seatsHeld: 2 }, now)).toBe(`1 of 4 seats paid · 2 held while students pay, until ${until} at the latest`);
  expect(seatWords({ ...lesson, priceCents: 0, seatsTaken: 2, seatsHeld: 0, holdEndsAt: null }, now)).toBe('2 of 4 seats taken');
  // A hold that ends on another day names the day too.
  const dayBefore = new Date('2030-05-12T22:00:00.000Z');
  expect(seatWords(lesson, dayBefore)).toContain(new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(holdEndsAt)));
});

test('the lesson page and the lesson list show a held seat apart from the paid ones', async () => {
  fakeApi({ ...signedInAs('player'), 'GET /api/lessons/3': { status: 200, body: { lesson } }, 'GET /api/lessons': { status: 200, body: { teaching: [], attending: [lesson] } } });
  const { router } = renderAt('/lessons/3');
  expect(await screen.findByText(/1 of 4 seats paid · 1 held until .* while a student pays/)).toBeTruthy();
  expect(screen.queryByText(/2 of 4 seats taken/)).toBeNull();
  await router.navigate('/lessons');
  expect(await screen.findByText(/1 of 4 seats paid · 1 held until .* while a student pays/)).toBeTruthy();
});

import { screen, within } from '@testing-library/react';
import { expect, test } from 'vitest';
import type { ComparedSeatDto, ComparisonDto } from '../../shared/comparisons';
import { fakeApi, renderAt, signedInAs } from './render';

const seat = (s: ComparedSeatDto['seat'], player: string, awayBefore: number, awayAfter: number): ComparedSeatDto => ({
  seat: s, player, kind: 'user', awayBefore, awayAfter, nearest: 'Harbor steps',
  passes: [
    { phase: 'first-right', sent: ['wind-n', 'wind-s', 'crack5'], blind: 0 },
    { phase: 'first-left', sent: ['crack4'], blind: 2 },
  ],
});

const comparison: ComparisonDto = {
  title: 'Harbor Lane week 1: passing right',
  withheld: [],
  deals: [
    {
      key: 'deal-1', title: 'Drill: Harbor Lane week 1 drill', drillName: 'Harbor Lane week 1 drill', seed: null, patternListName: 'Harbor Lane steps list', stillPlaying: 1,
      tables: [
        { exchangeId: 'a', tableId: 'ta', tableName: 'Week 1 · table 1', finishedAt: null, place: 1, bestAfter: 3, meanAfter: 10.5, seats: [seat('east', 'Theo Brandt', 8, 3), seat('south', 'Mina Castellanos', 8, 11), seat('west', 'Coach (bot)', 12, 14), seat('north', 'Coach (bot)', 14, 14)] },
        { exchangeId: 'b', tableId: 'tb', tableName: 'Week 1 · table 2', finishedAt: null, place: 2, bestAfter: 5, meanAfter: 10.5, seats: [seat('east', 'Sol Varga', 8, 9), seat('south', 'Ruth Adeyemi', 8, 5), seat('west', 'Coach (bot)', 12, 14), seat('north', 'Coach (bot)', 14, 14)] },
      ],
      standings: [
        { place: 1, exchangeId: 'a', tableName: 'Week 1 · table 1', seat: 'east', player: 'Theo Brandt', awayBefore: 8, awayAfter: 3, nearest: 'Harbor steps' },
        { place: 2, exchangeId: 'b', tableName: 'Week 1 · table 2', seat: 'south', player: 'Ruth Adeyemi', awayBefore: 8, awayAfter: 5, nearest: 'Harbor steps' },
      ],
    },
  ],
};

test('the lesson comparison ranks the tables, lists every seat nearest first and shows each seat’s passes side by side', async () => {
  fakeApi({ ...signedInAs('player'), 'GET /api/comparisons/lessons/4': { status: 200, body: { comparison } } });
  renderAt('/compare/lessons/4');
  await screen.findByRole('heading', { name: 'Same deal, compared' });
  expect(screen.getByRole('heading', { name: 'Drill: Harbor Lane week 1 drill' })).toBeTruthy();
  expect(screen.getByText(/One more table is still passing/)).toBeTruthy();
  const ranks = screen.getByRole('heading', { name: 'Tables, best first' }).nextElementSibling!;
  expect(within(ranks as HTMLElement).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
    '1st Week 1 · table 1: its nearest seat ended 3 away; the four seats 10.5 on average.',
    '2nd Week 1 · table 2: its nearest seat ended 5 away; the four seats 10.5 on average.',
  ]);
  const standings = within(screen.getByRole('table')).getAllByRole('row').slice(1);
  expect(within(standings[0]).getAllByRole('cell').map((c) => c.textContent)).toEqual(['1st', 'Theo Brandt', 'Week 1 · table 1', 'East', '8', '3', 'Harbor steps']);
  const east = screen.getByRole('region', { name: 'East at every table' });
  const cards = within(east).getAllByRole('listitem').filter((li) => li.parentElement!.parentElement === east);
  expect(cards.map((c) => c.querySelector('p')!.textContent)).toEqual(['Week 1 · table 1 · Theo Brandt', 'Week 1 · table 2 · Sol Varga']);
  expect(within(cards[0]).getByRole('img', { name: 'north wind, south wind, 5 crack' })).toBeTruthy();
  expect(within(cards[0]).getByRole('img', { name: /4 crack, 2 tiles passed on unseen/ })).toBeTruthy();
});

test('a deal still ahead of the viewer is held back with the reason', async () => {
  fakeApi({
    ...signedInAs('player'),
    'GET /api/comparisons/exchanges/x9': { status: 200, body: { comparison: { title: 'Tables that played the deal of Week 1 · table 3', deals: [], withheld: [{ title: 'Deal 1', reason: 'You are still to play this deal at another table. It opens once that table finishes.' }] } } },
  });
  renderAt('/compare/exchanges/x9');
  expect(await screen.findByText(/Deal 1: You are still to play this deal/)).toBeTruthy();
});

test('someone outside the lesson sees the refusal in words', async () => {
  fakeApi({ ...signedInAs('player'), 'GET /api/comparisons/lessons/4': { status: 403, body: { error: { code: 'NOT_IN_LESSON', message: 'This lesson is only for its teacher and the students invited to it.' } } } });
  renderAt('/compare/lessons/4');
  expect(await screen.findByRole('heading', { name: 'This comparison is not open to you' })).toBeTruthy();
  expect(screen.getByRole('alert').textContent).toMatch(/only for its teacher/);
});

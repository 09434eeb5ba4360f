/** A deal only one table has played offers no comparison of that table with itself. */
import { screen, within } from '@testing-library/react';
import { expect, test } from 'vitest';
import type { ComparedSeatDto, ComparisonDto } from '../../shared/comparisons';
import type { ExchangeSummaryDto } from '../../shared/protocol';
import { fakeApi, renderAt, signedInAs } from './render';

const summary = (id: string, tableName: string, sameDeal?: number): ExchangeSummaryDto => ({
  id,
  tableId: `t-${id}`,
  tableName,
  seat: 'east',
  status: 'done',
  startedAt: '2026-11-10T18:00:00Z',
  finishedAt: '2026-11-10T18:30:00Z',
  awayBefore: 8,
  awayAfter: 5,
  nearestPattern: 'Harbor steps',
  ...(sameDeal === undefined ? {} : { sameDeal }),
});

test('history offers Compare only where another table played the same deal', async () => {
  fakeApi({ ...signedInAs('player'), 'GET /api/exchanges': { status: 200, body: { exchanges: [summary('x1', 'Kitchen table', 1), summary('x2', 'Week 1 · table 1', 3)] } } });
  renderAt('/history');
  const lone = (await screen.findByRole('link', { name: /^Replay Kitchen table/ })).closest('tr')!;
  expect(within(lone).queryByRole('link', { name: /^Compare/ })).toBeNull();
  expect(within(lone).getByText(/No other table has played this deal yet/)).toBeTruthy();
  const shared = screen.getByRole('link', { name: /^Replay Week 1/ }).closest('tr')!;
  expect(within(shared).getByRole('link', { name: /^Compare Week 1/ }).getAttribute('href')).toBe('/compare/exchanges/x2');
});

const seat = (s: ComparedSeatDto['seat'], player: string): ComparedSeatDto => ({ seat: s, player, kind: 'user', awayBefore: 8, awayAfter: 5, nearest: 'Harbor steps', passes: [] });

test('a comparison of one table says there is nothing to compare it with yet, and ranks nothing', async () => {
  const comparison: ComparisonDto = {
    title: 'Tables that played the deal of Kitchen table',
    withheld: [],
    deals: [
      {
        key: 'deal-1', title: 'Deal 1', drillName: null, seed: null, patternListName: 'Starter list', stillPlaying: 0,
        tables: [{ exchangeId: 'x1', tableId: 't1', tableName: 'Kitchen table', finishedAt: null, place: 1, bestAfter: 5, meanAfter: 5, seats: [seat('east', 'Theo Brandt'), seat('south', 'Mina'), seat('west', 'Sol'), seat('north', 'Ruth')] }],
        standings: [{ place: 1, exchangeId: 'x1', tableName: 'Kitchen table', seat: 'east', player: 'Theo Brandt', awayBefore: 8, awayAfter: 5, nearest: 'Harbor steps' }],
      },
    ],
  };
  fakeApi({ ...signedInAs('player'), 'GET /api/comparisons/exchanges/x1': { status: 200, body: { comparison } } });
  renderAt('/compare/exchanges/x1');
  expect(await screen.findByText(/Only Kitchen table has played this deal so far: there is no other table to compare it with yet/)).toBeTruthy();
  expect(screen.queryByRole('heading', { name: 'Tables, best first' })).toBeNull();
  expect(screen.getByRole('link', { name: 'Replay Kitchen table' }).getAttribute('href')).toBe('/replays/x1');
});

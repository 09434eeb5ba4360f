import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { expect, test } from 'vitest';
import type { ExchangeSummaryDto } from '../../shared/protocol';
import { fakeApi, renderAt, signedInAs } from './render';
const summaries: ExchangeSummaryDto[] = Array.from({ length: 12 }, (_, i) => ({
  id: i === 0 ? 'x1' : `p${i}`,
  tableId: 't1',
  tableName: `Table ${String.fromCharCode(65 + i)}`,
  seat: 'east',
  status: i === 0 ? 'done' : 'playing',
  startedAt: `2026-11-${String(10 + i).padStart(2, '0')}T18:00:00Z`,
  finishedAt: i === 0 ? '2026-11-10T18:30:00Z' : null,
  ...(i === 0 ? { awayBefore: 8, awayAfter: 5, nearestPattern: 'Harbor steps' } : { awayBefore: null, awayAfter: null, nearestPattern: null }),
}));
const answers = { ...signedInAs('player'), 'GET /api/exchanges': { status: 200, body: { exchanges: summaries } } };
const tableNames = () => within(screen.getByRole('table')).getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell')[1].textContent);

test('history pages ten at a time, newest first, and sorts by any column', async () => {
  fakeApi(answers);
  renderAt('/history');
  await screen.findByRole('heading', { name: 'My exchanges' });
  expect(tableNames()).toHaveLength(10);
  expect(tableNames()[0]).toBe('Table L');
  expect(screen.getByText('Page 1 of 2')).toBeTruthy();
  await userEvent.click(screen.getByRole('button', { name: 'Next page' }));
  expect(tableNames()).toEqual(['Table B', 'Table A']);
  await userEvent.click(screen.getByRole('button', { name: /^Table/ }));
  expect(screen.getByRole('columnheader', { name: /^Table/ }).getAttribute('aria-sort')).toBe('ascending');
  expect(tableNames().slice(0, 2)).toEqual(['Table A', 'Table B']);
  await userEvent.click(screen.getByRole('button', { name: /^Table/ }));
  expect(tableNames()[0]).toBe('Table L');
});

test('a finished exchange shows tiles away before and after and the pattern it ended nearest from the list itself, with replay and compare links', async () => {
  const calls = fakeApi(answers);
  renderAt('/history');
  await screen.findByRole('heading', { name: 'My exchanges' });
  await userEvent.click(screen.getByRole('button', { name: 'Next page' }));
  const row = screen.getByRole('link', { name: /^Replay Table A/ }).closest('tr')!;
  const cells = within(row).getAllByRole('cell');
  expect(cells.slice(3, 6).map((c) => c.textContent)).toEqual(['8', '5', 'Harbor steps']);
  expect(within(row).getByRole('link', { name: /^Compare Table A/ }).getAttribute('href')).toBe('/compare/exchanges/x1');
  // No replay is fetched to work the figures out.
  expect(calls.filter((c) => c.key.includes('/replay'))).toEqual([]);
});

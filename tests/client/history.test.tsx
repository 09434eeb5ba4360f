import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { expect, test } from 'vitest';
import type { ExchangeSummaryDto } from '../../shared/protocol';
import { fakeApi, renderAt, signedInAs } from './render';
import { finishedReplay } from './fakeTable';

const dto = { ...finishedReplay(), final: undefined };
const summaries: ExchangeSummaryDto[] = Array.from({ length: 12 }, (_, i) => ({
  id: i === 0 ? 'x1' : `p${i}`,
  tableId: 't1',
  tableName: `Table ${String.fromCharCode(65 + i)}`,
  seat: 'east',
  status: i === 0 ? 'done' : 'playing',
  startedAt: `2026-11-${String(10 + i).padStart(2, '0')}T18:00:00Z`,
  finishedAt: null,
}));
const answers = { ...signedInAs('player'), 'GET /api/exchanges': { status: 200, body: { exchanges: summaries } }, 'GET /api/exchanges/x1/replay': { status: 200, body: { replay: dto } } };
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

test('a finished exchange shows tiles away before and after and the pattern it ended nearest, with a replay link', async () => {
  fakeApi(answers);
  renderAt('/history');
  await screen.findByRole('heading', { name: 'My exchanges' });
  await userEvent.click(screen.getByRole('button', { name: 'Next page' }));
  const row = screen.getByRole('link', { name: /^Replay Table A/ }).closest('tr')!;
  const cells = within(row).getAllByRole('cell');
  await screen.findAllByText(/^\d+$/);
  expect(Number(cells[3].textContent)).toBeGreaterThan(0);
  expect(Number(cells[4].textContent)).toBeGreaterThanOrEqual(0);
  expect(cells[5].textContent).not.toBe('—');
});

import { screen, within } from '@testing-library/react';
import { expect, test } from 'vitest';
import type { ProgressDto } from '../../shared/progress';
import { fakeApi, renderAt, signedInAs } from './render';

const progress: ProgressDto = {
  user: { id: 1, displayName: 'Ruth Adeyemi' },
  totals: { exchanges: 2, passes: 6, meanGained: 1.5, asAdvisedRate: 0.5, brokePairRate: 1 / 6, passedFlowerRate: 0 },
  points: [
    { exchangeId: 'x1', tableName: 'Harbor Lane Tuesday', finishedAt: '2026-11-10T19:00:00Z', seat: 'east', awayBefore: 8, awayAfter: 7, gained: 1, passes: 3, asAdvised: 1, brokePair: 1, passedFlower: 0 },
    { exchangeId: 'x2', tableName: 'Harbor Lane Thursday', finishedAt: '2026-11-12T19:00:00Z', seat: 'south', awayBefore: 9, awayAfter: 7, gained: 2, passes: 3, asAdvised: 2, brokePair: 0, passedFlower: 0 },
  ],
  truncated: false,
};

test('my progress shows the totals and every exchange in a table beside the charts', async () => {
  fakeApi({ ...signedInAs('player'), 'GET /api/progress/me': { status: 200, body: { progress } } });
  renderAt('/progress');
  await screen.findByRole('heading', { name: 'My progress' });
  expect(screen.getByText('Exchanges played').nextElementSibling!.textContent).toBe('2');
  expect(screen.getByText('Tiles away gained on average').nextElementSibling!.textContent).toBe('1.5');
  expect(screen.getByText('Passes as advised', { selector: 'dt' }).nextElementSibling!.textContent).toBe('50%');
  expect(screen.getByText('Passes that broke a pair the advice kept', { selector: 'dt' }).nextElementSibling!.textContent).toBe('17%');
  const rows = within(screen.getByRole('table')).getAllByRole('row').slice(1);
  expect(rows).toHaveLength(2);
  expect(within(rows[1]).getAllByRole('cell').map((c) => c.textContent)).toEqual(['2', new Date('2026-11-12T19:00:00Z').toLocaleDateString(), 'Harbor Lane Thursday', 'south', '9', '7', '+2', '2 of 3', '0 of 3', '0 of 3']);
  expect(screen.getByText(/Tiles away from the nearest pattern, after the deal/)).toBeTruthy();
});

test('a teacher opens a student’s progress by id; a refusal is shown in words', async () => {
  fakeApi({ ...signedInAs('teacher'), 'GET /api/progress/7': { status: 200, body: { progress: { ...progress, user: { id: 7, displayName: 'Theo Brandt' } } } } });
  renderAt('/progress/7');
  expect(await screen.findByRole('heading', { name: 'Progress of Theo Brandt' })).toBeTruthy();
});

test('a student asking for another student’s progress is told why not', async () => {
  fakeApi({
    ...signedInAs('player'),
    'GET /api/progress/8': { status: 403, body: { error: { code: 'FORBIDDEN', message: 'You can see your own progress, and a teacher can see the progress of the students in their lessons.' } } },
  });
  renderAt('/progress/8');
  expect(await screen.findByRole('heading', { name: 'This progress is not open to you' })).toBeTruthy();
  expect(screen.getByRole('alert').textContent).toMatch(/your own progress/);
  expect(screen.getByRole('link', { name: 'See your own progress' })).toBeTruthy();
});

test('with no finished exchange the page says how to get some', async () => {
  fakeApi({ ...signedInAs('player'), 'GET /api/progress/me': { status: 200, body: { progress: { ...progress, points: [], totals: { ...progress.totals, exchanges: 0 } } } } });
  renderAt('/progress');
  expect(await screen.findByText(/No finished exchanges yet/)).toBeTruthy();
});

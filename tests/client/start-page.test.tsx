import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { expect, test, vi } from 'vitest';
import { fakeApi, renderAt, signedInAs, signedOut } from './render';

vi.mock('../../src/features/table/api/socket', () => ({ send: vi.fn(async () => ({ ok: true })), joinTable: vi.fn(async () => ({ ok: true })), leaveTable: vi.fn() }));

test('a signed-out visitor is told what Rackside and a Charleston are, sees a table, then can sign in or register', async () => {
  fakeApi(signedOut);
  const { router } = renderAt('/');
  const main = document.getElementById('main')!;
  expect(await within(main).findByRole('heading', { level: 1, name: /Rackside/ })).toBeTruthy();
  expect(router.state.location.pathname).toBe('/');
  expect(within(main).getByRole('heading', { name: 'What is a Charleston?' })).toBeTruthy();
  const text = main.textContent ?? '';
  expect(text).toMatch(/right.*across.*left/s);
  // One picture of a table, drawn from our own tiles, named for people who cannot see it.
  const picture = within(main).getByRole('img', { name: /table seen from above/i });
  expect(picture.querySelectorAll('svg[data-kind]').length).toBeGreaterThanOrEqual(5);
  expect(within(main).getByRole('link', { name: 'Sign in' }).getAttribute('href')).toBe('/sign-in');
  expect(within(main).getByRole('link', { name: 'Make an account' }).getAttribute('href')).toBe('/register');
  // The sign-in form itself is a click away, not the first thing a visitor meets.
  expect(within(main).queryByLabelText('Password')).toBeNull();
});

test('a signed-in player opens a table with three bots in one click', async () => {
  const calls = fakeApi({
    ...signedInAs('player'),
    'GET /api/tables': { status: 200, body: { mine: [], open: [] } },
    'POST /api/tables/practice': { status: 201, body: { table: { id: 'p1' } } },
  });
  const { router } = renderAt('/');
  await userEvent.click(await screen.findByRole('button', { name: 'Try it alone with three bots' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/tables/p1'));
  expect(calls.filter((c) => c.key === 'POST /api/tables/practice')).toHaveLength(1);
});

test('a practice table that cannot be opened says so beside the button', async () => {
  fakeApi({
    ...signedInAs('player'),
    'GET /api/tables': { status: 200, body: { mine: [], open: [] } },
    'POST /api/tables/practice': { status: 503, body: { error: { code: 'UNAVAILABLE', message: 'Rackside is busy. Try again in a minute.' } } },
  });
  renderAt('/');
  await userEvent.click(await screen.findByRole('button', { name: 'Try it alone with three bots' }));
  expect((await screen.findByRole('alert')).textContent).toContain('Try again in a minute');
});

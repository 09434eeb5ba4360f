import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { expect, test, vi } from 'vitest';
import type { TableDto } from '../../shared/protocol';
import { fakeApi, renderAt, signedInAs } from './render';
import { OPTIONS } from './fake-table';

vi.mock('../../src/features/table/api/socket', () => ({ send: vi.fn(async () => ({ ok: true })), joinTable: vi.fn(async () => ({ ok: true })), leaveTable: vi.fn() }));

const table = (id: string, name: string, extra: Partial<TableDto> = {}): TableDto => ({
  id,
  name,
  hostId: 1,
  hostName: 'Ines Okafor',
  private: false,
  status: 'lobby',
  options: OPTIONS,
  seats: { east: { kind: 'user', userId: 1, displayName: 'Ines Okafor', connected: true }, south: null, west: null, north: null },
  currentExchangeId: null,
  createdAt: '',
  ...extra,
});

const lists = { 'GET /api/tables': { status: 200, body: { mine: [table('t1', 'Tuesday lesson', { private: true, inviteCode: 'abc' })], open: [table('t2', 'Open practice')] } } };

test('the lobby lists my tables and open tables with their seats', async () => {
  fakeApi({ ...signedInAs('teacher'), ...lists });
  renderAt('/');
  const mine = (await screen.findByRole('heading', { name: 'My tables' })).parentElement!;
  expect(within(mine).getByRole('link', { name: 'Tuesday lesson' }).getAttribute('href')).toBe('/tables/t1?invite=abc');
  expect(within(mine).getByText(/1 of 4 seats filled · private/)).toBeTruthy();
  const open = screen.getByRole('heading', { name: 'Open tables' }).parentElement!;
  expect(within(open).getByRole('link', { name: 'Open practice' })).toBeTruthy();
});

test('the create form checks the name before sending and shows the error beside the field', async () => {
  const calls = fakeApi({ ...signedInAs('player'), ...lists });
  renderAt('/');
  await userEvent.click(await screen.findByRole('button', { name: 'Open the table' }));
  const name = screen.getByLabelText('Table name');
  expect(name.getAttribute('aria-invalid')).toBe('true');
  expect(document.getElementById(name.getAttribute('aria-describedby')!)!.textContent).toContain('Give the table a name.');
  expect(calls.some((c) => c.key === 'POST /api/tables')).toBe(false);
});

test('the create form sends every option, shows server field errors, and opens the new table', async () => {
  let attempt = 0;
  const calls = fakeApi({
    ...signedInAs('teacher'),
    ...lists,
    'POST /api/tables': (body) =>
      ++attempt === 1
        ? { status: 400, body: { error: { code: 'BAD_INPUT', message: 'Some fields need another look.', fields: { 'options.seed': 'That seed is taken by a drill.' } } } }
        : { status: 201, body: { table: table('t9', (body as { name: string }).name, { private: true, inviteCode: 'xyz' }) } },
  });
  const { router } = renderAt('/');
  await userEvent.type(await screen.findByLabelText('Table name'), 'Harbor Lane drills');
  await userEvent.type(screen.getByLabelText(/Deal seed/), 'harbor-lane-week-01');
  await userEvent.click(screen.getByLabelText(/Private table/));
  await userEvent.click(screen.getByLabelText(/Hold every pass/));
  await userEvent.click(screen.getByLabelText(/Hide the advice/));
  await userEvent.click(screen.getByLabelText(/Offer the courtesy pass/));
  await userEvent.click(screen.getByRole('button', { name: 'Open the table' }));
  const seed = screen.getByLabelText(/Deal seed/);
  await waitFor(() => expect(seed.getAttribute('aria-invalid')).toBe('true'));
  expect(screen.getByText('That seed is taken by a drill.')).toBeTruthy();
  expect(calls.find((c) => c.key === 'POST /api/tables')!.body).toEqual({
    name: 'Harbor Lane drills',
    private: true,
    options: { seed: 'harbor-lane-week-01', jokers: true, secondCharleston: true, courtesy: false, huddleEveryPass: true, teaching: false, hideAdvice: true, botsPlaySecond: false },
  });
  await userEvent.click(screen.getByRole('button', { name: 'Open the table' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/tables/t9'));
  expect(router.state.location.search).toBe('?invite=xyz');
});

test('an invite link pasted in opens that table; anything else is refused with a hint', async () => {
  fakeApi({ ...signedInAs('player'), ...lists });
  const { router } = renderAt('/');
  const field = await screen.findByLabelText('Invite link');
  await userEvent.type(field, 'not a link at all');
  await userEvent.click(screen.getByRole('button', { name: 'Join the table' }));
  expect(screen.getByText(/That is not a table link/)).toBeTruthy();
  await userEvent.clear(field);
  await userEvent.type(field, 'https://rackside.test/tables/t7?invite=CODE1');
  await userEvent.click(screen.getByRole('button', { name: 'Join the table' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/tables/t7'));
  expect(router.state.location.search).toBe('?invite=CODE1');
});

test('only a teacher is offered a teaching table, and a teaching table says in the lobby that the host sees every rack', async () => {
  const teachingLists = { 'GET /api/tables': { status: 200, body: { mine: [], open: [table('t3', 'Ines teaches', { options: { ...OPTIONS, teaching: true } })] } } };
  fakeApi({ ...signedInAs('player'), ...teachingLists });
  const { unmount } = renderAt('/');
  await screen.findByRole('button', { name: 'Open the table' });
  expect(screen.queryByLabelText(/Teaching table/)).toBeNull();
  expect(await screen.findByText(/teaching table: the host sees every rack/)).toBeTruthy();
  unmount();

  fakeApi({ ...signedInAs('teacher'), ...teachingLists });
  renderAt('/');
  expect(await screen.findByLabelText(/Teaching table/)).toBeTruthy();
});

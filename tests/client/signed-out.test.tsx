/**
 * A session that ends elsewhere (signing out in another tab, a session that ran out): any page says
 * "You were signed out" with a way back, and signing in returns to the same page.
 */
import { act, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, expect, test, vi } from 'vitest';
import { useSignedOutNotice } from '../../src/lib/session-end';
import { useTableStore } from '../../src/features/table/api/table-store';
import { safeReturnPath } from '../../src/lib/return-path';
import { tableState } from './fake-table';
import { fakeApi, renderAt, signedInAs, signedOut } from './render';

/** A stand-in for the Socket.IO client: the test fires what the server would send. */
const fake = vi.hoisted(() => {
  const handlers = new Map<string, ((...args: unknown[]) => void)[]>();
  const on = (event: string, fn: (...args: unknown[]) => void) => handlers.set(event, [...(handlers.get(event) ?? []), fn]);
  const fire = (event: string, ...args: unknown[]) => (handlers.get(event) ?? []).forEach((fn) => fn(...args));
  const socket = {
    connected: true,
    on: (event: string, fn: (...args: unknown[]) => void) => {
      on(event, fn);
      return socket;
    },
    io: { on: (event: string, fn: (...args: unknown[]) => void) => on(`manager:${event}`, fn) },
    emit: (..._args: unknown[]) => socket,
    timeout: () => ({
      emit: (event: string, _payload: unknown, cb: (err: Error | null, ack: unknown) => void) => {
        joins.push(event);
        cb(null, { ok: true });
      },
    }),
    connect: () => {
      connects.push(1);
      return socket;
    },
    disconnect: () => socket,
  };
  const joins: string[] = [];
  const connects: number[] = [];
  return { socket, fire, joins, connects };
});
vi.mock('socket.io-client', () => ({ io: () => fake.socket }));

beforeEach(() => {
  useTableStore.getState().reset();
  useSignedOutNotice.getState().clear();
});

const unauthenticated = { status: 401, body: { error: { code: 'UNAUTHENTICATED', message: 'Please sign in first.' } } };

test('signing out in another tab: the table says "You were signed out" and links to sign in, back to the same table', async () => {
  fakeApi(signedInAs('player'));
  renderAt('/tables/t1');
  await waitFor(() => expect(fake.joins).toContain('table:join'));
  act(() => fake.fire('table:state', tableState(null, 'east')));
  await screen.findByRole('heading', { name: 'Harbor Lane Tuesday' });

  // The server ends the session's sockets on sign-out; the client asks again and the handshake is refused.
  const before = fake.connects.length;
  act(() => fake.fire('disconnect', 'io server disconnect'));
  expect(fake.connects.length).toBe(before + 1);
  act(() => fake.fire('connect_error', Object.assign(new Error('Please sign in first.'), { data: { code: 'UNAUTHENTICATED' } })));

  expect(await screen.findByRole('heading', { name: 'You were signed out' })).toBeTruthy();
  expect(screen.queryByText(/connection dropped/)).toBeNull();
  expect(screen.queryByText(/did not answer/)).toBeNull();
  const link = screen.getByRole('link', { name: 'Sign in again' });
  expect(link.getAttribute('href')).toBe('/sign-in?next=%2Ftables%2Ft1');
  expect(useTableStore.getState().connection).toBe('signed-out');
});

test('a 401 from any API call on any page says "You were signed out"; signing in comes back to that page', async () => {
  let session = true;
  const lessons = { status: 200, body: { teaching: [], attending: [] } };
  fakeApi({
    'GET /api/auth/me': () => (session ? signedInAs('player')['GET /api/auth/me'] : signedOut['GET /api/auth/me']),
    'GET /api/lessons': () => (session ? lessons : unauthenticated),
    'POST /api/auth/login': () => {
      session = true;
      return signedInAs('player')['GET /api/auth/me'];
    },
  });
  const { router, queryClient } = renderAt('/lessons');
  await screen.findByRole('heading', { name: 'Lessons' });

  // Another tab signs out; the next request of this page is refused.
  session = false;
  await act(() => queryClient.invalidateQueries({ queryKey: ['lessons'] }));
  expect(await screen.findByRole('heading', { name: 'You were signed out' })).toBeTruthy();
  // The header no longer offers to sign out a session that is gone.
  await waitFor(() => expect(screen.queryByRole('button', { name: 'Sign out' })).toBeNull());

  await userEvent.click(screen.getByRole('link', { name: 'Sign in again' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
  expect(router.state.location.search).toBe('?next=%2Flessons');
  await userEvent.type(screen.getByLabelText('E-mail'), 'ruth@harborlane.test');
  await userEvent.type(screen.getByLabelText('Password'), 'harbor-lane-demo');
  await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/lessons'));
  expect(await screen.findByRole('heading', { name: 'Lessons' })).toBeTruthy();
  expect(screen.queryByRole('heading', { name: 'You were signed out' })).toBeNull();
});

test('a visitor who was never signed in is not told they were signed out', async () => {
  fakeApi({ ...signedOut });
  renderAt('/');
  await screen.findByRole('link', { name: 'Sign in' });
  expect(screen.queryByRole('heading', { name: 'You were signed out' })).toBeNull();
});

test('the sign-in page goes back to a same-site path only', async () => {
  // Paths on this site only: "//host" and "/\host" are read by browsers as another site (WHATWG URL standard, special schemes).
  expect(safeReturnPath('/tables/abc')).toBe('/tables/abc');
  expect(safeReturnPath('/compare?seed=harbor-lane')).toBe('/compare?seed=harbor-lane');
  for (const bad of ['//evil.test/x', '/\\evil.test', 'https://evil.test/', 'tables/abc', '', null, '/sign-in?next=/x', 'javascript:alert(1)', '/tab\nles']) {
    expect(safeReturnPath(bad), String(bad)).toBe('/');
  }

  fakeApi({ ...signedOut, 'POST /api/auth/login': signedInAs('player')['GET /api/auth/me'] });
  const { router } = renderAt('/sign-in?next=%2F%2Fevil.test%2Fx');
  await userEvent.type(await screen.findByLabelText('E-mail'), 'ruth@harborlane.test');
  await userEvent.type(screen.getByLabelText('Password'), 'harbor-lane-demo');
  await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/'));
});

test('the header sign-in link carries the page a visitor is on', async () => {
  fakeApi({ ...signedOut, 'GET /api/invitations/tok': { status: 410, body: { error: { code: 'INVITATION_USED', message: 'Used.' } } } });
  renderAt('/invitations/tok');
  const link = await screen.findByRole('link', { name: 'Sign in' });
  expect(link.getAttribute('href')).toBe('/sign-in?next=%2Finvitations%2Ftok');
});

test('a signed-out visitor sent to sign in from a page that needs an account comes back to it', async () => {
  fakeApi({ ...signedOut });
  const { router } = renderAt('/compare/exchanges/x1');
  await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
  expect(router.state.location.search).toBe('?next=%2Fcompare%2Fexchanges%2Fx1');
});

test('a table link opened while signed out goes to sign-in and comes back to that table', async () => {
  fakeApi({ 'GET /api/auth/me': { status: 401, body: { error: { code: 'UNAUTHENTICATED', message: 'Please sign in first.' } } } });
  const { router } = renderAt('/tables/t1?invite=abc');
  await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
  expect(new URLSearchParams(router.state.location.search).get('next')).toBe('/tables/t1?invite=abc');
});

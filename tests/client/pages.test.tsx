import { fireEvent, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { RouteObject } from 'react-router-dom';
import { expect, test, vi } from 'vitest';
import { fakeApi, renderAt, signedInAs, signedOut } from './render';

test('the home page shows the signed-in user and their role', async () => {
  fakeApi(signedInAs('teacher'));
  renderAt('/');
  expect(await screen.findByRole('heading', { name: 'Welcome, Ruth Adeyemi' })).toBeTruthy();
  expect(screen.getByTestId('role').textContent).toBe('Teacher');
});

test('sign-in shows the server message for a wrong password', async () => {
  fakeApi({
    ...signedOut,
    'POST /api/auth/login': { status: 401, body: { error: { code: 'BAD_CREDENTIALS', message: 'That e-mail and password do not match.' } } },
  });
  renderAt('/sign-in');
  await userEvent.type(screen.getByLabelText('E-mail'), 'ruth@harborlane.test');
  await userEvent.type(screen.getByLabelText('Password'), 'wrong');
  await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
  expect((await screen.findByRole('alert')).textContent).toContain('do not match');
});

test('register shows each field error from the server beside its field', async () => {
  const calls = fakeApi({
    ...signedOut,
    'POST /api/auth/register': {
      status: 409,
      body: { error: { code: 'EMAIL_TAKEN', message: 'An account with this e-mail already exists.', fields: { email: 'This e-mail already has an account.' } } },
    },
  });
  renderAt('/register');
  await userEvent.type(screen.getByLabelText('Name at the table'), 'Sol Varga');
  await userEvent.type(screen.getByLabelText('E-mail'), 'sol@harborlane.test');
  await userEvent.type(screen.getByLabelText(/^Password/), 'tiles-and-tea');
  await userEvent.click(screen.getByRole('button', { name: 'Make my account' }));
  const email = screen.getByLabelText('E-mail');
  await waitFor(() => expect(email.getAttribute('aria-invalid')).toBe('true'));
  expect(document.getElementById(email.getAttribute('aria-describedby')!)!.textContent).toContain('already has an account');
  expect(calls.find((c) => c.key === 'POST /api/auth/register')!.body).toEqual({ displayName: 'Sol Varga', email: 'sol@harborlane.test', password: 'tiles-and-tea' });
});

test('a successful sign-in lands on the home page with the role', async () => {
  let signedIn = false;
  fakeApi({
    'GET /api/auth/me': () => (signedIn ? signedInAs('player')['GET /api/auth/me'] : signedOut['GET /api/auth/me']),
    'POST /api/auth/login': () => {
      signedIn = true;
      return signedInAs('player')['GET /api/auth/me'];
    },
  });
  const { router } = renderAt('/sign-in');
  fireEvent.change(screen.getByLabelText('E-mail'), { target: { value: 'ruth@harborlane.test' } });
  fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'harbor-lane-demo' } });
  fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/'));
  expect((await screen.findByTestId('role')).textContent).toBe('Player');
});

test('the admin page tells a non-admin it is for organisers and asks for no user list', async () => {
  const calls = fakeApi(signedInAs('player'));
  renderAt('/admin/users');
  expect(await screen.findByRole('heading', { name: /Only organisers/ })).toBeTruthy();
  expect(calls.some((c) => c.key.includes('/api/admin/'))).toBe(false);
});

test('the admin page lists people and changes a role', async () => {
  const users = [
    { id: 1, email: 'ruth@harborlane.test', displayName: 'Ruth Adeyemi', role: 'admin', createdAt: '' },
    { id: 2, email: 'theo@harborlane.test', displayName: 'Theo Brandt', role: 'player', createdAt: '' },
  ];
  const calls = fakeApi({
    ...signedInAs('admin'),
    'GET /api/admin/users': { status: 200, body: { users } },
    'PATCH /api/admin/users/2': (body) => ({ status: 200, body: { user: { ...users[1], ...(body as object) } } }),
  });
  renderAt('/admin/users');
  const picker = (await screen.findByLabelText('Role of Theo Brandt')) as HTMLSelectElement;
  expect((screen.getByLabelText('Role of Ruth Adeyemi') as HTMLSelectElement).disabled).toBe(true);
  await userEvent.selectOptions(picker, 'teacher');
  await waitFor(() => expect(calls.some((c) => c.key === 'PATCH /api/admin/users/2')).toBe(true));
  expect(calls.find((c) => c.key === 'PATCH /api/admin/users/2')!.body).toEqual({ role: 'teacher' });
});

test('an unknown address shows the not-found page', async () => {
  fakeApi(signedOut);
  renderAt('/no/such/page');
  expect(await screen.findByRole('heading', { name: 'This page is not here' })).toBeTruthy();
});

test('the text size choice scales the page and is remembered', async () => {
  fakeApi(signedOut);
  renderAt('/sign-in');
  await userEvent.click(screen.getByRole('button', { name: 'Text size largest' }));
  expect(document.documentElement.style.getPropertyValue('--rackside-root-size')).toBe('137.5%');
  expect(localStorage.getItem('rackside.preferences')).toContain('largest');
});

test('a page whose code cannot load shows a plain way back instead of a crash', async () => {
  fakeApi(signedInAs('player'));
  const { createMemoryRouter, RouterProvider } = await import('react-router-dom');
  const { QueryClient, QueryClientProvider } = await import('@tanstack/react-query');
  const { render } = await import('@testing-library/react');
  const { routes } = await import('../../src/router');
  const broken: RouteObject[] = [
    {
      element: routes[0].element,
      errorElement: routes[0].errorElement,
      children: [{ path: '/broken', lazy: async () => Promise.reject(new Error('chunk gone')) }],
    },
  ];
  const spy = vi.spyOn(console, 'error').mockImplementation(() => undefined);
  render(
    <QueryClientProvider client={new QueryClient()}>
      <RouterProvider router={createMemoryRouter(broken, { initialEntries: ['/broken'] })} />
    </QueryClientProvider>,
  );
  expect(await screen.findByRole('heading', { name: 'This page could not load' })).toBeTruthy();
  expect(screen.getByRole('button', { name: 'Reload the page' })).toBeTruthy();
  spy.mockRestore();
});

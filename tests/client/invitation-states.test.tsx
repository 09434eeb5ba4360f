/** An invitation that can no longer be used says why at once: a 4xx answer is final, never asked again. */
import { QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import { expect, test } from 'vitest';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { ApiError } from '../../src/lib/api/client';
import { makeQueryClient, retryUnlessAnswered } from '../../src/lib/query-client';
import { routes } from '../../src/router';
import { fakeApi, signedOut } from './render';

/** The page with the app's own query client (render.tsx turns retries off for every test). */
function renderWithAppClient(path: string) {
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  return render(
    <QueryClientProvider client={makeQueryClient()}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
}

test('the app never asks again after a 4xx answer, and still retries a failed network or a 5xx', () => {
  expect(retryUnlessAnswered(0, new ApiError(410, 'INVITATION_REPLACED', 'Replaced.'))).toBe(false);
  expect(retryUnlessAnswered(0, new ApiError(404, 'NOT_FOUND', 'Nope.'))).toBe(false);
  expect(retryUnlessAnswered(0, new ApiError(401, 'UNAUTHENTICATED', 'Sign in.'))).toBe(false);
  expect(retryUnlessAnswered(0, new ApiError(503, 'SERVER_ERROR', 'Busy.'))).toBe(true);
  expect(retryUnlessAnswered(0, new ApiError(0, 'OFFLINE', 'Offline.'))).toBe(true);
  expect(retryUnlessAnswered(3, new ApiError(503, 'SERVER_ERROR', 'Busy.'))).toBe(false);
  const options = makeQueryClient().getDefaultOptions().queries!;
  expect(options.retry).toBe(retryUnlessAnswered);
});

test('a replaced invitation says so at once, asked for once', async () => {
  const message = 'This invitation was replaced by a newer one sent to r***@harborlane.test; use the link in the latest e-mail from Ines Okafor.';
  const calls = fakeApi({ ...signedOut, 'GET /api/invitations/old': { status: 410, body: { error: { code: 'INVITATION_REPLACED', message } } } });
  renderWithAppClient('/invitations/old');
  expect(await screen.findByRole('heading', { name: 'This invitation was replaced' })).toBeTruthy();
  expect(screen.getByRole('alert').textContent).toContain('use the link in the latest e-mail');
  expect(calls.filter((c) => c.key === 'GET /api/invitations/old')).toHaveLength(1);
});

for (const [code, heading] of [
  ['INVITATION_EXPIRED', 'This invitation has expired'],
  ['INVITATION_USED', 'This invitation was already used'],
  ['INVITATION_INVALID', 'This invitation link does not work'],
] as const) {
  test(`${code} has its own heading`, async () => {
    fakeApi({ ...signedOut, 'GET /api/invitations/x': { status: code === 'INVITATION_INVALID' ? 404 : 410, body: { error: { code, message: 'Ask your teacher.' } } } });
    renderWithAppClient('/invitations/x');
    expect(await screen.findByRole('heading', { name: heading })).toBeTruthy();
  });
}

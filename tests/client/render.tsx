import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { vi } from 'vitest';
import { routes } from '../../src/router';

export type Reply = { status: number; body: unknown };
export type FakeApi = Record<string, Reply | ((body: unknown) => Reply)>;

/** Stubs fetch with answers keyed by "METHOD /api/path", and records every call. */
export function fakeApi(answers: FakeApi) {
  const calls: { key: string; body: unknown }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      const key = `${init?.method ?? 'GET'} ${url}`;
      // An upload (FormData) is recorded as the uploaded file's name.
      const raw = init?.body;
      const body = raw instanceof FormData ? { file: (raw.get('file') as File).name } : raw ? JSON.parse(String(raw)) : undefined;
      calls.push({ key, body });
      const answer = answers[key];
      const reply = typeof answer === 'function' ? answer(body) : (answer ?? { status: 404, body: { error: { code: 'NOT_FOUND', message: 'nope' } } });
      return new Response(reply.status === 204 ? null : JSON.stringify(reply.body), { status: reply.status, headers: { 'Content-Type': 'application/json' } });
    }),
  );
  return calls;
}

export function renderAt(path: string) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const utils = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...utils, router, queryClient };
}

export const signedOut = { 'GET /api/auth/me': { status: 401, body: { error: { code: 'UNAUTHENTICATED', message: 'You are not signed in.' } } } };
export function signedInAs(role: 'player' | 'teacher' | 'admin') {
  return { 'GET /api/auth/me': { status: 200, body: { user: { id: 1, email: 'ruth@harborlane.test', displayName: 'Ruth Adeyemi', role, createdAt: '2026-12-01T00:00:00Z' } } } };
}

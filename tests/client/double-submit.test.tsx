import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { expect, test, vi } from 'vitest';
import { Chat } from '../../src/features/table/components/Chat';
import { InviteForm } from '../../src/features/lessons/components/InviteForm';
import { renderAt, signedOut } from './render';

/** fetch that answers `held` only when released, and the rest from `answers`; counts every call. */
function heldFetch(held: string, heldBody: unknown, answers: Record<string, unknown> = {}) {
  const calls: string[] = [];
  let release: () => void = () => {};
  const gate = new Promise<void>((resolve) => (release = resolve));
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      const key = `${init?.method ?? 'GET'} ${url}`;
      calls.push(key);
      if (key === held) {
        await gate;
        return new Response(JSON.stringify(heldBody), { status: 201, headers: { 'Content-Type': 'application/json' } });
      }
      const answer = (answers[key] ?? { status: 404, body: { error: { code: 'NOT_FOUND', message: 'nope' } } }) as { status: number; body: unknown };
      return new Response(JSON.stringify(answer.body), { status: answer.status, headers: { 'Content-Type': 'application/json' } });
    }),
  );
  return { calls: (key: string) => calls.filter((c) => c === key).length, release: () => release() };
}

test('register: a double click sends one request, and the button stays disabled until the answer comes', async () => {
  const user = { id: 9, email: 'mina@harborlane.test', displayName: 'Mina', role: 'player', createdAt: '2026-12-01T00:00:00Z' };
  const api = heldFetch('POST /api/auth/register', { user }, signedOut);
  renderAt('/register');
  fireEvent.change(await screen.findByLabelText('Name at the table'), { target: { value: 'Mina' } });
  fireEvent.change(screen.getByLabelText('E-mail'), { target: { value: 'mina@harborlane.test' } });
  fireEvent.change(screen.getByLabelText(/^Password/), { target: { value: 'tiles-and-tea' } });
  const button = screen.getByRole('button', { name: 'Make my account' });
  fireEvent.click(button);
  fireEvent.click(button);
  await waitFor(() => expect((screen.getByRole('button', { name: 'Making your account…' }) as HTMLButtonElement).disabled).toBe(true));
  expect(api.calls('POST /api/auth/register')).toBe(1);
  api.release();
  await waitFor(() => expect(screen.queryByRole('button', { name: 'Making your account…' })).toBeNull());
  expect(api.calls('POST /api/auth/register')).toBe(1);
});

test('invite: a double click sends one request, and the button stays disabled until the answer comes', async () => {
  const api = heldFetch('POST /api/lessons/4/invitations', { results: [{ email: 'theo@harborlane.test', status: 'sent', message: 'Invitation sent to theo@harborlane.test.' }], lesson: {} });
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } })}>
      <InviteForm lessonId="4" />
    </QueryClientProvider>,
  );
  fireEvent.change(screen.getByLabelText('E-mail addresses'), { target: { value: 'theo@harborlane.test' } });
  const button = screen.getByRole('button', { name: 'Send invitations' });
  fireEvent.click(button);
  fireEvent.click(button);
  await waitFor(() => expect((screen.getByRole('button', { name: 'Sending…' }) as HTMLButtonElement).disabled).toBe(true));
  expect(api.calls('POST /api/lessons/4/invitations')).toBe(1);
  api.release();
  await screen.findByText('Invitation sent to theo@harborlane.test.');
  expect((screen.getByRole('button', { name: 'Send invitations' }) as HTMLButtonElement).disabled).toBe(false);
  expect(api.calls('POST /api/lessons/4/invitations')).toBe(1);
});

test('chat: a double click sends a message once, and Send stays disabled until the table answers', async () => {
  let answer: (ok: boolean) => void = () => {};
  const onSend = vi.fn(() => new Promise<boolean>((resolve) => (answer = resolve)));
  render(<Chat messages={[]} onSend={onSend} />);
  fireEvent.change(screen.getByLabelText('Message to the table'), { target: { value: 'Passing right!' } });
  const button = screen.getByRole('button', { name: 'Send' });
  fireEvent.click(button);
  fireEvent.click(button);
  await waitFor(() => expect((button as HTMLButtonElement).disabled).toBe(true));
  expect(onSend).toHaveBeenCalledTimes(1);
  answer(true);
  await waitFor(() => expect((screen.getByLabelText('Message to the table') as HTMLInputElement).value).toBe(''));
  fireEvent.change(screen.getByLabelText('Message to the table'), { target: { value: 'Again' } });
  expect((button as HTMLButtonElement).disabled).toBe(false);
});

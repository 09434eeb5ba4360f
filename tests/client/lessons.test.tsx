import { fireEvent, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { expect, test } from 'vitest';
import { priceToCents } from '../../src/features/lessons/components/ScheduleLessonForm';
import { fakeApi, renderAt, signedInAs, signedOut } from './render';

const lesson = {
  id: 3,
  title: 'Harbor Lane week 1',
  description: '',
  teacherId: 1,
  teacherName: 'Ines Okafor',
  startsAt: '2030-05-14T23:00:00.000Z',
  timeZone: 'America/New_York',
  durationMinutes: 60,
  seats: 4,
  seatsTaken: 1,
  seatsHeld: 0,
  holdEndsAt: null,
  priceCents: 1500,
  currency: 'usd',
  drillIds: [],
  seed: null,
  myStatus: 'enrolled',
  isTeacher: false,
};

test('prices are read as written: whole units or two decimals', () => {
  expect(priceToCents('15')).toBe(1500);
  expect(priceToCents('12.5')).toBe(1250);
  expect(priceToCents('12,50')).toBe(1250);
  expect(priceToCents('twelve')).toBeNull();
  expect(priceToCents('1.234')).toBeNull();
});

test('the schedule form sends what the teacher typed and shows each server error beside its field', async () => {
  const calls = fakeApi({
    ...signedInAs('teacher'),
    'GET /api/lessons': { status: 200, body: { teaching: [], attending: [] } },
    'GET /api/drills': { status: 200, body: { drills: [] } },
    'POST /api/lessons': {
      status: 400,
      body: { error: { code: 'BAD_INPUT', message: 'Some fields need another look.', fields: { startsAtLocal: 'Pick a start time in the future.', seed: 'Pick a drill, or name a seed.' } } },
    },
  });
  renderAt('/lessons');
  await userEvent.type(await screen.findByLabelText('Title'), 'Harbor Lane week 1');
  fireEvent.change(screen.getByLabelText('Starts at'), { target: { value: '2020-01-01T10:00' } });
  fireEvent.change(screen.getByLabelText(/^Time zone/), { target: { value: 'America/New_York' } });
  await userEvent.click(screen.getByLabelText(/^Priced/));
  await userEvent.type(screen.getByLabelText(/^Price$/), '15');
  await userEvent.click(screen.getByRole('button', { name: 'Schedule the lesson' }));
  const starts = screen.getByLabelText('Starts at');
  await waitFor(() => expect(starts.getAttribute('aria-invalid')).toBe('true'));
  expect(document.getElementById(starts.getAttribute('aria-describedby')!)!.textContent).toContain('in the future');
  expect(screen.getByText('Pick a drill, or name a seed.')).toBeTruthy();
  expect(calls.find((c) => c.key === 'POST /api/lessons')!.body).toMatchObject({
    title: 'Harbor Lane week 1',
    startsAtLocal: '2020-01-01T10:00',
    timeZone: 'America/New_York',
    durationMinutes: 60,
    seats: 8,
    priceCents: 1500,
    currency: 'usd',
    drillIds: [],
  });
});

test('a price that is not a number is caught before anything is sent', async () => {
  const calls = fakeApi({ ...signedInAs('teacher'), 'GET /api/lessons': { status: 200, body: { teaching: [], attending: [] } }, 'GET /api/drills': { status: 200, body: { drills: [] } } });
  renderAt('/lessons');
  await userEvent.click(await screen.findByLabelText(/^Priced/));
  await userEvent.type(screen.getByLabelText(/^Price$/), 'fifteen');
  await userEvent.click(screen.getByRole('button', { name: 'Schedule the lesson' }));
  expect(await screen.findByText(/such as 15 or 12.50\./)).toBeTruthy();
  expect(calls.some((c) => c.key === 'POST /api/lessons')).toBe(false);
});

test('an expired invitation says so and what to do', async () => {
  fakeApi({
    ...signedOut,
    'GET /api/invitations/1.2.3.4': { status: 410, body: { error: { code: 'INVITATION_EXPIRED', message: 'This invitation expired on Tue, 14 May 2030. Ask Ines Okafor to send you a new one.' } } },
  });
  renderAt('/invitations/1.2.3.4');
  expect(await screen.findByRole('heading', { name: 'This invitation has expired' })).toBeTruthy();
  expect(screen.getByRole('alert').textContent).toMatch(/Ask Ines Okafor to send you a new one/);
});

test('a signed-out invitee signs in on the invitation page, then accepts', async () => {
  let signedIn = false;
  const calls = fakeApi({
    'GET /api/auth/me': () => (signedIn ? signedInAs('player')['GET /api/auth/me'] : signedOut['GET /api/auth/me']),
    'POST /api/auth/login': () => {
      signedIn = true;
      return signedInAs('player')['GET /api/auth/me'];
    },
    'GET /api/invitations/tok': { status: 200, body: { invitation: { lesson, emailHint: 'r***@harborlane.test', expiresAt: '2030-05-14T00:00:00Z' } } },
    'POST /api/invitations/tok/accept': { status: 200, body: { lesson, next: 'pay' } },
    'GET /api/lessons/3': { status: 200, body: { lesson } },
  });
  const { router } = renderAt('/invitations/tok');
  expect(await screen.findByRole('heading', { name: /You are invited to “Harbor Lane week 1”/ })).toBeTruthy();
  expect(screen.getByText(/Sent to r\*\*\*@harborlane.test/)).toBeTruthy();
  await userEvent.type(screen.getByLabelText('E-mail'), 'ruth@harborlane.test');
  await userEvent.type(screen.getByLabelText('Password'), 'harbor-lane-demo');
  await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
  await userEvent.click(await screen.findByRole('button', { name: 'Accept, then pay for my seat' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/lessons/3'));
  expect(await screen.findByRole('button', { name: 'Pay $15.00 for my seat' })).toBeTruthy();
  expect(calls.some((c) => c.key === 'POST /api/invitations/tok/accept')).toBe(true);
});

test('the receipt waits for the payment to be confirmed, then shows it', async () => {
  let asked = 0;
  const receipt = (status: string) => ({
    status: 200,
    body: {
      receipt: {
        id: 9,
        status,
        amountCents: 1500,
        currency: 'usd',
        lesson: { id: 3, title: 'Harbor Lane week 1', teacherName: 'Ines Okafor', startsAt: lesson.startsAt, timeZone: lesson.timeZone },
        payerName: 'Ruth Adeyemi',
        paidAt: status === 'paid' ? '2030-05-01T10:00:00Z' : null,
        refundedAt: null,
        checkoutSessionId: 'cs_test_1',
        message: status === 'paid' ? 'Paid. Your seat is yours.' : 'We are waiting for the payment service to confirm your payment.',
      },
    },
  });
  fakeApi({ ...signedInAs('player'), 'GET /api/payments/session/cs_test_1': () => receipt(asked++ ? 'paid' : 'pending') });
  renderAt('/lessons/3/receipt?session_id=cs_test_1');
  expect(await screen.findByRole('heading', { name: 'Confirming your payment…' })).toBeTruthy();
  expect(await screen.findByRole('heading', { name: 'Receipt' }, { timeout: 4000 })).toBeTruthy();
  expect(screen.getByText('Paid. Your seat is yours.')).toBeTruthy();
  expect(screen.getByText('$15.00')).toBeTruthy();
  expect(screen.getByText('R-9')).toBeTruthy();
});

test('the outbox lists what was sent and opens a message with its link', async () => {
  fakeApi({
    ...signedInAs('teacher'),
    'GET /api/mail': { status: 200, body: { mails: [{ id: 4, to: 'theo@harborlane.test', from: 'Rackside', subject: 'Ines invites you', kind: 'invitation', receivedAt: '2030-05-01T10:00:00Z' }] } },
    'GET /api/mail/4': {
      status: 200,
      body: { mail: { id: 4, to: 'theo@harborlane.test', from: 'Rackside', subject: 'Ines invites you', kind: 'invitation', receivedAt: '2030-05-01T10:00:00Z', text: 'Accept: http://localhost:3000/invitations/abc\n', html: '<p>x</p>' } },
    },
  });
  renderAt('/mail');
  await userEvent.click(await screen.findByRole('button', { name: /Ines invites you/ }));
  expect((await screen.findByRole('link', { name: 'http://localhost:3000/invitations/abc' })).getAttribute('href')).toBe('http://localhost:3000/invitations/abc');
});

test('a player is told the mail page is for teachers and nothing is fetched', async () => {
  const calls = fakeApi(signedInAs('player'));
  renderAt('/mail');
  expect(await screen.findByRole('heading', { name: 'Mail pages are for teachers' })).toBeTruthy();
  expect(calls.some((c) => c.key.startsWith('GET /api/mail'))).toBe(false);
});

test('forgot password: the answer is the same for every address, and a used reset link says so', async () => {
  fakeApi({ ...signedOut, 'POST /api/auth/password-reset': { status: 200, body: { ok: true, message: 'If an account uses that address, we have sent it a link.' } } });
  renderAt('/forgot-password');
  await userEvent.type(await screen.findByLabelText('E-mail'), 'sol@harborlane.test');
  await userEvent.click(screen.getByRole('button', { name: 'Send me a link' }));
  expect((await screen.findByRole('status')).textContent).toMatch(/If an account uses that address/);
});

test('a used reset link offers a new one', async () => {
  fakeApi({ ...signedOut, 'GET /api/auth/password-reset/a.b.c.d': { status: 410, body: { error: { code: 'RESET_USED', message: 'This reset link was already used.' } } } });
  renderAt('/reset-password/a.b.c.d');
  expect((await screen.findByRole('alert')).textContent).toMatch(/already used/);
  expect(screen.getByRole('link', { name: 'Ask for a new link' })).toBeTruthy();
});

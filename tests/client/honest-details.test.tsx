/** Small honest details: the invite error names the wrong address, mail shows when it was sent, a UTC clock reads "UTC". */
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, expect, test, vi } from 'vitest';
import { InviteForm } from '../../src/features/lessons/components/InviteForm';
import { defaultTimeZone, lessonTimes, timeZones } from '../../src/features/lessons/lesson-time';
import { fakeApi, renderAt, signedInAs } from './render';

afterEach(() => {
  vi.restoreAllMocks();
});

test('the invite form shows every wrong address, each by name', async () => {
  fakeApi({
    'POST /api/lessons/4/invitations': {
      status: 400,
      body: {
        error: {
          code: 'BAD_INPUT',
          message: 'Some fields need another look.',
          fields: { 'emails.1': 'ruth@harborlane is not an e-mail address (name@example.test).', 'emails.2': 'theo.harborlane.test is not an e-mail address (name@example.test).' },
        },
      },
    },
  });
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { mutations: { retry: false } } })}>
      <InviteForm lessonId="4" />
    </QueryClientProvider>,
  );
  await userEvent.type(screen.getByLabelText('E-mail addresses'), 'mina@harborlane.test, ruth@harborlane, theo.harborlane.test');
  await userEvent.click(screen.getByRole('button', { name: 'Send invitations' }));
  expect(await screen.findByText(/ruth@harborlane is not an e-mail address/)).toBeTruthy();
  expect(screen.getByText(/theo\.harborlane\.test is not an e-mail address/)).toBeTruthy();
  expect(screen.getByLabelText('E-mail addresses').getAttribute('aria-invalid')).toBe('true');
});

test('each mail in the outbox says when it was sent, in the reader’s own time', async () => {
  const receivedAt = '2030-05-01T10:00:00Z';
  fakeApi({
    ...signedInAs('teacher'),
    'GET /api/mail': { status: 200, body: { mails: [{ id: 4, to: 'theo@harborlane.test', from: 'Rackside', subject: 'Ines invites you', kind: 'invitation', receivedAt }] } },
  });
  renderAt('/mail');
  const item = await screen.findByRole('button', { name: /Ines invites you/ });
  const when = within(item).getByText(new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(receivedAt)), { exact: false });
  expect(when.closest('time')?.getAttribute('datetime')).toBe(receivedAt);
});

test('a clock on UTC, under any of its names, offers "UTC"; real places keep their own name', () => {
  // Zone names and links from memory (tz database): Africa/Abidjan and Atlantic/Reykjavik are at UTC+0 all year; London and Lisbon keep summer time.
  for (const zone of ['Etc/UTC', 'UTC', 'Etc/GMT', 'GMT', 'Etc/UCT', 'Etc/Universal', 'Etc/Zulu', 'Africa/Abidjan', 'Atlantic/Reykjavik', '', undefined]) {
    expect(defaultTimeZone(zone), String(zone)).toBe('UTC');
  }
  for (const zone of ['Europe/London', 'Europe/Lisbon', 'America/New_York', 'Asia/Kolkata', 'Australia/Adelaide']) {
    expect(defaultTimeZone(zone)).toBe(zone);
  }
  expect(timeZones()[0]).toBe('UTC');
  expect(lessonTimes('2030-05-14T19:00:00Z', 'Etc/UTC').there).toMatch(/\(UTC\)$/);
});

test('the schedule form on a browser whose clock is on UTC picks "UTC", not a city', async () => {
  const real = Intl.DateTimeFormat.prototype.resolvedOptions;
  vi.spyOn(Intl.DateTimeFormat.prototype, 'resolvedOptions').mockImplementation(function (this: Intl.DateTimeFormat) {
    return { ...real.call(this), timeZone: 'Africa/Abidjan' };
  });
  fakeApi({ ...signedInAs('teacher'), 'GET /api/lessons': { status: 200, body: { teaching: [], attending: [] } }, 'GET /api/drills': { status: 200, body: { drills: [] } } });
  renderAt('/lessons');
  const zone = (await screen.findByLabelText(/^Time zone/)) as HTMLSelectElement;
  expect(zone.value).toBe('UTC');
  expect(zone.selectedOptions[0].textContent).toBe('UTC');
});

import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import { launch, snap } from './browser';

let browser: Browser;
const baseUrl = inject('baseUrl');

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function signIn(page: Page, email: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('harbor-lane-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: /Welcome/ }).waitFor();
}

/** A student follows the mailed link, signs in on the invitation page, accepts and pays on the fake checkout page. */
async function acceptAndPay(link: string, email: string, shots: boolean) {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await context.newPage();
  await page.goto(link);
  await page.getByRole('heading', { name: /You are invited to/ }).waitFor();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('harbor-lane-demo');
  if (shots) await snap(page, 'lesson-invitation');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Accept, then pay for my seat' }).click();
  await page.getByRole('button', { name: 'Pay $15.00 for my seat' }).click();
  await page.getByText('Local test checkout').waitFor();
  if (shots) await snap(page, 'lesson-fake-checkout');
  await page.getByRole('button', { name: 'Pay $15.00' }).click();
  await page.getByRole('heading', { name: 'Receipt' }).waitFor({ timeout: 15_000 });
  expect(await page.getByText('Paid. Your seat is yours.').count()).toBe(1);
  if (shots) await snap(page, 'lesson-receipt');
  await context.close();
}

test('a teacher schedules a priced lesson, invites two students who accept and pay, and splits them over two tables', async () => {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await signIn(page, 'ines@harborlane.test');
  await page.getByRole('link', { name: 'Lessons', exact: true }).click();
  await page.getByRole('button', { name: 'Schedule the lesson' }).click();
  await page.getByText('Give the lesson a title.').waitFor();
  await snap(page, 'lesson-schedule-errors');

  await page.getByLabel('Title').fill('Harbor Lane week 1: passing right');
  await page.getByLabel('Starts at').fill('2030-05-14T19:00');
  await page.getByLabel(/^Time zone/).selectOption('America/New_York');
  await page.getByLabel('Seats for students').fill('4');
  await page.getByLabel(/^Priced/).check();
  await page.getByLabel(/^Price$/).fill('15');
  await page.getByLabel(/^Deal seed/).fill('harbor-lane-week-01');
  await page.getByRole('button', { name: 'Schedule the lesson' }).click();
  await page.getByRole('heading', { name: 'Harbor Lane week 1: passing right' }).waitFor();
  const lessonUrl = page.url();

  await page.getByLabel('E-mail addresses').fill('theo@harborlane.test\nmina@harborlane.test');
  await page.getByRole('button', { name: 'Send invitations' }).click();
  await page.getByText('Invitation sent to mina@harborlane.test.').waitFor();
  await snap(page, 'lesson-teacher-invited');

  await page.getByRole('link', { name: 'Mail', exact: true }).click();
  const links: string[] = [];
  for (const who of ['theo', 'mina']) {
    await page.getByRole('button', { name: new RegExp(`Invitation to ${who}@harborlane.test`) }).first().click();
    const link = page.getByRole('link', { name: /\/invitations\// });
    await link.waitFor();
    links.push((await link.getAttribute('href'))!);
  }
  await snap(page, 'mail-outbox');
  expect(links[0]).toMatch(new RegExp(`^${baseUrl}/invitations/`));

  await acceptAndPay(links[0], 'theo@harborlane.test', true);
  await acceptAndPay(links[1], 'mina@harborlane.test', false);

  await page.goto(lessonUrl);
  await page.getByText(/\b2 of 4 seats paid/).waitFor();
  await page.getByLabel(/^Tables/).fill('2');
  await page.getByRole('button', { name: 'Split into tables' }).click();
  await page.getByRole('button', { name: 'Start every table' }).click();
  await page.getByText('Playing').first().waitFor();
  await snap(page, 'lesson-room');
  await page.getByRole('link', { name: /Open Harbor Lane week 1: passing right · table 1/ }).click();
  await page.waitForURL(/\/tables\//);
  await page.getByRole('group', { name: 'The table, seen from above' }).waitFor();
  await snap(page, 'lesson-table-1');
  await page.close();
});

test('forgot password: the reset mail arrives in the outbox and its link sets a new password', async () => {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  // The sign-in page has an E-mail field too: wait until the reset page has replaced it.
  await page.waitForURL(/\/forgot-password$/);
  await page.getByRole('button', { name: 'Send me a link' }).waitFor();
  await page.getByLabel('E-mail').fill('ruth@harborlane.test');
  await page.getByRole('button', { name: 'Send me a link' }).click();
  await page.getByText(/If an account uses that address/).waitFor();
  await snap(page, 'forgot-password');

  const admin = await browser.newContext();
  const pat = await admin.newPage();
  await signIn(pat, 'pat@harborlane.test');
  await pat.goto(`${baseUrl}/mail`);
  await pat.getByRole('button', { name: /Password reset to ruth@harborlane.test/ }).click();
  const link = (await pat.getByRole('link', { name: /\/reset-password\// }).getAttribute('href'))!;
  await admin.close();

  await page.goto(link);
  await page.getByLabel('New password').fill('a-new-harbor-password');
  await page.getByRole('button', { name: 'Save my new password' }).click();
  await page.getByText('Your password is changed').waitFor();
  await snap(page, 'reset-password-done');
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('ruth@harborlane.test');
  await page.getByLabel('Password').fill('a-new-harbor-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Welcome, Ruth Adeyemi' }).waitFor();
  await page.close();
});

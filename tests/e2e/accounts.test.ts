import type { Browser } from 'playwright-core';
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

test('a new player registers, signs out, signs in again and sees their role', async () => {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await page.goto(`${baseUrl}/`);
  await page.getByRole('heading', { name: 'What is a Charleston?' }).waitFor();
  await snap(page, 'start');
  await page.getByRole('link', { name: 'Make an account' }).click();
  await page.getByLabel('Name at the table').fill('Sol Varga Jr');
  await page.getByLabel('E-mail').fill('sol.jr@harborlane.test');
  await page.getByLabel('Password').fill('short');
  await page.getByRole('button', { name: 'Make my account' }).click();
  await page.getByText('Use at least 8 characters').waitFor();
  await snap(page, 'register-errors');
  await page.getByLabel('Password').fill('passing-right-first');
  await page.getByRole('button', { name: 'Make my account' }).click();
  await page.getByRole('heading', { name: 'Welcome, Sol Varga Jr' }).waitFor();
  expect(await page.getByTestId('role').textContent()).toBe('Player');
  await snap(page, 'home-player');
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('heading', { name: 'Sign in' }).waitFor();
  await page.getByLabel('E-mail').fill('sol.jr@harborlane.test');
  await page.getByLabel('Password').fill('passing-right-first');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Welcome, Sol Varga Jr' }).waitFor();
  await page.goto(`${baseUrl}/admin/users`);
  await page.getByRole('heading', { name: /Only organisers/ }).waitFor();
  const status = await page.evaluate(async () => (await fetch('/api/admin/users')).status);
  expect(status).toBe(403);
  await page.close();
});

test('the demo admin promotes a player to teacher', async () => {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('pat@harborlane.test');
  await page.getByLabel('Password').fill('harbor-lane-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Welcome, Pat Lindqvist' }).waitFor();
  await page.getByRole('link', { name: 'People', exact: true }).click();
  const picker = page.getByLabel('Role of Theo Brandt');
  await picker.selectOption('teacher');
  await expect.poll(() => picker.inputValue(), { timeout: 10_000 }).toBe('teacher');
  const users = await page.evaluate(async () => (await (await fetch('/api/admin/users')).json()).users as { email: string; role: string }[]);
  expect(users.find((u) => u.email === 'theo@harborlane.test')?.role).toBe('teacher');
  await snap(page, 'admin-users');
  await page.close();
});

test('the sign-in page reflows at 320 px without sideways scrolling', async () => {
  const page = await browser.newPage({ viewport: { width: 320, height: 640 } });
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByRole('heading', { name: 'Sign in' }).waitFor();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await snap(page, 'sign-in-320');
  await page.close();
});

import type { Browser, BrowserContext, Page } from 'playwright-core';
import { expect } from 'vitest';

export const DEMO_PASSWORD = 'harbor-lane-demo';

/** Opens a fresh browser context (its own cookies, so its own person) and signs in there. */
export async function signInContext(
  browser: Browser,
  baseUrl: string,
  email: string,
  name: string,
  width = 1280,
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: { width, height: 900 } });
  const page = await context.newPage();
  page.on('pageerror', (err) => console.error(`[${name}] page error:`, err.message));
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: `Welcome, ${name}` }).waitFor();
  return { context, page };
}

export const rack = (page: Page) => page.getByRole('group', { name: 'Your rack' });
export const sendButton = (page: Page) => page.getByRole('button', { name: /^Send \d tiles?$/ });
/** Tiles on this seat's rack that may still be picked (never a joker, never one already picked). */
export const pickable = (page: Page) => rack(page).locator('button[aria-pressed="false"]:not([aria-disabled="true"])');

/** Picks tiles left to right until the send button wakes up, then sends. */
export async function pickAndSend(page: Page) {
  const send = sendButton(page);
  for (let i = 0; i < 4 && !(await send.isEnabled()); i++) await pickable(page).first().click();
  await send.click();
}

/** Does whatever this seat is asked to do now; returns false once the exchange is over. */
export async function playStep(page: Page, stop: boolean): Promise<boolean> {
  if (await page.getByText('The Charleston is over.').isVisible()) return false;
  if (await sendButton(page).isVisible()) await pickAndSend(page);
  else if (await page.getByRole('button', { name: 'Stop after this round' }).isVisible())
    await page.getByRole('button', { name: stop ? 'Stop after this round' : 'Play a second Charleston' }).click();
  else if (await page.getByRole('radio', { name: '2 tiles' }).isVisible()) {
    await page.getByRole('radio', { name: '2 tiles' }).check();
    await page.getByRole('button', { name: 'Ask for 2 tiles' }).click();
  }
  return true;
}

/** The host, already seated, fills every empty seat with a bot. */
export async function seatBots(host: Page, count: number) {
  for (let i = 0; i < count; i++) {
    await host.getByRole('button', { name: 'Seat a bot' }).first().click();
    await expect.poll(() => host.getByRole('button', { name: 'Seat a bot' }).count()).toBe(count - 1 - i);
  }
}

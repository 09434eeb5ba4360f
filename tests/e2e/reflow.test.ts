import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import { launch, snap } from './browser';

// WCAG 2.2 SC 1.4.10 (reflow): content fits 320 CSS px wide without sideways scrolling, and
// SC 1.4.4 (resize text): text can grow to 200 %. Rackside's largest text size is 137.5 %.

let browser: Browser;
const baseUrl = inject('baseUrl');
const LARGEST = JSON.stringify({ state: { textSize: 'largest' }, version: 0 });
/** The longest name Rackside takes (LIMITS.displayNameMax), with no space to break at. */
const LONG_NAME = 'Q'.repeat(12) + 'Longnamewithoutanyspaces'.repeat(2);
const LONG_TABLE = 'T'.repeat(80);
const LONG_WORD = 'W'.repeat(150);

/** A player with the longest name, with a practice table of their own, for the tests that only look. */
const LOOKER = { email: 'long.name.looks@harborlane.test', password: 'passing-right-first', displayName: LONG_NAME };

beforeAll(async () => {
  browser = await launch();
  const context = await browser.newContext();
  const registered = await context.request.post(`${baseUrl}/api/auth/register`, { data: LOOKER });
  expect(registered.status()).toBe(201);
  expect((await context.request.post(`${baseUrl}/api/tables/practice`, { data: {} })).status()).toBe(201);
  await context.close();
});
afterAll(async () => {
  await browser?.close();
});

const sideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
/** Seat cards that are cut off: wider inside than they are drawn, or reaching past the table they sit at. */
const clippedSeats = (page: Page) =>
  page.evaluate(() => {
    const table = document.querySelector('[aria-label="The table, seen from above"]')!;
    const edge = table.getBoundingClientRect();
    return [...table.querySelectorAll('section')]
      .filter((s) => {
        const box = s.getBoundingClientRect();
        return s.scrollWidth > s.clientWidth + 1 || box.right > edge.right + 1 || box.left < edge.left - 1;
      })
      .map((s) => s.getAttribute('aria-label'));
  });

async function newPage(width: number, largest = false, signedIn = false) {
  const context = await browser.newContext({ viewport: { width, height: 800 } });
  if (largest) await context.addInitScript((v) => localStorage.setItem('rackside.preferences', v), LARGEST);
  // The context's request shares its cookies with its pages.
  if (signedIn) expect((await context.request.post(`${baseUrl}/api/auth/login`, { data: { email: LOOKER.email, password: LOOKER.password } })).status()).toBe(200);
  return context.newPage();
}

test('the start page says what Rackside is and fits a phone, at standard and at the largest text size', async () => {
  for (const [width, largest, name] of [[1280, false, 'start-1280'], [375, false, 'start-375'], [375, true, 'start-375-largest'], [320, true, 'start-320-largest']] as const) {
    const page = await newPage(width, largest);
    await page.goto(`${baseUrl}/`);
    await page.getByRole('heading', { name: 'What is a Charleston?' }).waitFor();
    await page.getByRole('img', { name: /table seen from above/ }).waitFor();
    expect(await sideways(page), name).toBeLessThanOrEqual(0);
    await snap(page, name);
    await page.context().close();
  }
});

test('a long name without spaces wraps everywhere on a phone: home, lobby, table, chat; the header stays compact', async () => {
  const page = await newPage(375);
  await page.goto(`${baseUrl}/register`);
  await page.getByLabel('Name at the table').fill(LONG_NAME);
  await page.getByLabel('E-mail').fill('long.name@harborlane.test');
  await page.getByLabel('Password').fill('passing-right-first');
  await page.getByRole('button', { name: 'Make my account' }).click();
  await page.getByRole('heading', { name: /^Welcome/ }).waitFor();
  // A table with the longest name Rackside takes shows in the lobby and heads its own page.
  const long = await page.evaluate(async (name) => {
    const res = await fetch('/api/tables', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ name }) });
    return (await res.json()).table.id as string;
  }, LONG_TABLE);
  await page.reload();
  await page.getByRole('link', { name: LONG_TABLE }).waitFor();
  expect(await sideways(page), 'home').toBeLessThanOrEqual(0);
  await snap(page, 'home-long-name-375');
  await page.goto(`${baseUrl}/tables/${long}`);
  await page.getByRole('button', { name: 'Sit at east' }).waitFor();
  expect(await sideways(page), 'lobby of a long-named table').toBeLessThanOrEqual(0);

  // One click from home: a table with the player in east and three bots.
  await page.goto(`${baseUrl}/`);
  await page.getByRole('button', { name: 'Try it alone with three bots' }).click();
  const deal = page.getByRole('button', { name: 'Deal and start the Charleston' });
  await expect.poll(() => deal.isEnabled(), { timeout: 15_000 }).toBe(true);
  expect(await page.getByRole('region', { name: `East: ${LONG_NAME}` }).count()).toBe(1);
  expect(await sideways(page), 'practice lobby').toBeLessThanOrEqual(0);
  expect(await clippedSeats(page)).toEqual([]);
  await deal.click();
  await page.getByRole('group', { name: 'Your rack' }).waitFor();
  await page.getByLabel('Message to the table').fill(LONG_WORD);
  await page.getByRole('button', { name: 'Send', exact: true }).click();
  await page.getByRole('log', { name: 'Messages' }).getByText(LONG_WORD).waitFor();
  expect(await sideways(page), 'table with chat').toBeLessThanOrEqual(0);
  expect(await clippedSeats(page)).toEqual([]);
  await snap(page, 'table-long-name-375');

  // At the largest text size the page still fits, seat cards are whole, and the header takes a small part of the screen.
  await page.evaluate((v) => localStorage.setItem('rackside.preferences', v), LARGEST);
  await page.reload();
  await page.getByRole('group', { name: 'Your rack' }).waitFor();
  expect(await sideways(page), 'table at the largest text size').toBeLessThanOrEqual(0);
  expect(await clippedSeats(page)).toEqual([]);
  const header = await page.locator('body > div header, #root header').first().boundingBox();
  expect(header!.height).toBeLessThanOrEqual(800 * 0.15);
  await snap(page, 'table-long-name-375-largest');
  await page.getByRole('button', { name: 'Menu' }).click();
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My exchanges' }).click();
  await page.getByRole('heading', { name: 'My exchanges' }).waitFor();
  await page.context().close();
});

test('the tiles in the analysis grow with the text size, and the seats stay whole at every laptop width', async () => {
  const widths: number[] = [];
  for (const largest of [false, true]) {
    const page = await newPage(1280, largest, true);
    await page.goto(`${baseUrl}/`);
    await page.getByRole('link', { name: 'Practice with three bots' }).first().click();
    // The first visit deals; the second finds the deal under way.
    const deal = page.getByRole('button', { name: 'Deal and start the Charleston' });
    await deal.or(page.getByRole('group', { name: 'Your rack' })).first().waitFor();
    if (await deal.isVisible()) {
      await expect.poll(() => deal.isEnabled()).toBe(true);
      await deal.click();
    }
    await page.getByRole('group', { name: 'Your rack' }).waitFor();
    const analysis = page.getByRole('region', { name: 'Your rack at a glance' });
    await analysis.locator('svg[data-kind]').first().waitFor();
    widths.push((await analysis.locator('svg[data-kind]').first().boundingBox())!.width);
    for (const width of [1280, 1024, 800, 640]) {
      await page.setViewportSize({ width, height: 800 });
      await expect.poll(() => clippedSeats(page), { message: `seats at ${width} px${largest ? ', largest text' : ''}` }).toEqual([]);
    }
    await page.context().close();
  }
  // 137.5 % text: the tiles follow (allowing for rounding).
  expect(widths[1] / widths[0]).toBeGreaterThan(1.3);
});

test('the history fits a phone: a long table name wraps and the table scrolls in its own region, not the page', async () => {
  const page = await newPage(375, true, true);
  const rows = [0, 1, 2].map((i) => ({
    id: `x${i}`,
    tableId: `t${i}`,
    tableName: i === 0 ? LONG_TABLE : 'Tuesday practice',
    seat: 'east',
    status: i === 2 ? 'playing' : 'done',
    startedAt: '2026-12-01T10:00:00Z',
    finishedAt: null,
    awayBefore: 7,
    awayAfter: 4,
    nearestPattern: 'Anchor and two dragons',
  }));
  // The list itself is the server's; here it is stood in for, so the page can be judged with a long name in it.
  await page.route('**/api/exchanges', (route) => route.fulfill({ json: { exchanges: rows } }));
  await page.goto(`${baseUrl}/history`);
  await page.getByRole('heading', { name: 'My exchanges' }).waitFor();
  await page.getByRole('table').waitFor();
  expect(await sideways(page)).toBeLessThanOrEqual(0);
  await snap(page, 'history-375-largest');
  await page.context().close();
});

import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import { launch, snap } from './browser';
import { PLAY_DEADLINE_MS, pickAndSend, playToEnd, rack } from './play';

let browser: Browser;
const baseUrl = inject('baseUrl');
const contexts: BrowserContext[] = [];

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  for (const c of contexts) await c.close();
  await browser?.close();
});

async function signIn(email: string, name: string, width = 1280): Promise<Page> {
  const context = await browser.newContext({ viewport: { width, height: 900 } });
  contexts.push(context);
  const page = await context.newPage();
  page.on('pageerror', (err) => console.error(`[${name}] page error:`, err.message));
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('harbor-lane-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: `Welcome, ${name}` }).waitFor();
  return page;
}

test('two players and two bots finish an exchange with a huddle, then replay it', async () => {
  const ines = await signIn('ines@harborlane.test', 'Ines Okafor');
  const theo = await signIn('theo@harborlane.test', 'Theo Brandt');

  // The host opens a table from the lobby.
  await ines.getByLabel('Table name').fill('Harbor Lane evening');
  await ines.getByLabel(/Deal seed/).fill('harbor-lane-week-01');
  await snap(ines, 'lobby');
  await ines.getByRole('button', { name: 'Open the table' }).click();
  await ines.waitForURL(/\/tables\//);
  const tableUrl = ines.url();
  await ines.getByRole('button', { name: 'Sit at east' }).click();
  await ines.getByRole('button', { name: 'Stand up' }).waitFor();

  // A second player finds it among the open tables and sits across.
  await theo.reload();
  await theo.getByRole('heading', { name: 'Open tables' }).waitFor();
  await snap(theo, 'lobby-open-tables');
  await theo.getByRole('link', { name: 'Harbor Lane evening' }).first().click();
  await theo.getByRole('button', { name: 'Sit at west' }).click();
  await theo.getByRole('button', { name: 'Stand up' }).waitFor();

  // The host fills the rest with bots and deals.
  await ines.getByRole('button', { name: 'Seat a bot' }).first().click();
  await ines.getByText('1 empty').or(ines.getByRole('button', { name: 'Seat a bot' })).first().waitFor();
  await expect.poll(() => ines.getByRole('button', { name: 'Seat a bot' }).count()).toBe(1);
  await ines.getByRole('button', { name: 'Seat a bot' }).click();
  await snap(ines, 'table-seated');
  await ines.getByRole('button', { name: 'Deal and start the Charleston' }).click();
  await rack(ines).waitFor();
  await rack(theo).waitFor();
  await expect.poll(() => rack(theo).getByRole('button').count()).toBe(13);
  await expect.poll(() => rack(ines).getByRole('button').count()).toBe(14);

  // The host holds the first pass, shows a seat and writes a note.
  await ines.getByRole('button', { name: 'Hold this pass' }).click();
  await theo.getByRole('heading', { name: 'This pass is on hold' }).waitFor();
  const theoTiles = rack(theo).locator('button[aria-pressed="false"]:not([aria-disabled="true"])');
  await theoTiles.first().click();
  await theoTiles.first().click();
  await snap(theo, 'table-mid-pass');
  await theo.getByRole('button', { name: 'Send 3 tiles' }).isDisabled();
  await theoTiles.first().click();
  await theo.getByRole('button', { name: 'Send 3 tiles' }).click();
  await theo.getByText(/Your pass is in/).waitFor();
  await ines.getByRole('button', { name: 'Show west' }).click();
  await ines.getByLabel('Note for the table').fill('Theo passes early from his weakest suit.');
  await ines.getByLabel('About').selectOption('west');
  await ines.getByRole('button', { name: 'Add note' }).click();
  await theo.getByText(/weakest suit/).waitFor();
  await theo.getByRole('group', { name: 'Rack of Theo Brandt' }).waitFor();
  await snap(theo, 'huddle');
  await snap(ines, 'huddle-host');
  // A held pass can be revised: take it back and choose again.
  await theo.getByRole('button', { name: 'Take back my choice' }).click();
  await theo.getByRole('button', { name: 'Send 3 tiles' }).waitFor();
  await pickAndSend(theo);
  await theo.getByText(/Your pass is in/).waitFor();
  await pickAndSend(ines);
  await ines.getByRole('button', { name: 'Let the pass go' }).click();
  await theo.getByText(/^You received 3 tiles from/).waitFor();

  // Everyone plays on; the player across asks to stop after the first Charleston.
  await Promise.all([playToEnd(ines, { stop: false }), playToEnd(theo, { stop: true })]);
  await ines.getByText('The Charleston is over.').waitFor();
  await snap(ines, 'table-done');
  const overflow = await theo.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);

  // The replay opens from the table and steps with the keyboard.
  await ines.getByRole('link', { name: 'Replay this exchange pass by pass' }).click();
  await ines.getByRole('heading', { name: 'Replay: Harbor Lane evening' }).waitFor();
  await ines.keyboard.press('ArrowRight');
  await ines.getByText(/^Step 1 of \d+: After the first Charleston, pass right/).waitFor();
  await ines.getByText(/weakest suit/).waitFor();
  await snap(ines, 'replay');
  await ines.keyboard.press('End');
  await snap(ines, 'replay-end');

  await ines.getByRole('link', { name: 'My exchanges' }).click();
  await ines.getByRole('link', { name: /^Replay Harbor Lane evening/ }).first().waitFor();
  await snap(ines, 'history');
  expect(tableUrl).toContain('/tables/');
}, 2 * PLAY_DEADLINE_MS);

test('on a 375 px phone the rack reads at 44 px, plays by keyboard, and reduced motion stops the slide', async () => {
  const mina = await signIn('mina@harborlane.test', 'Mina Castellanos', 375);
  await mina.emulateMedia({ reducedMotion: 'reduce' });
  await mina.getByLabel('Table name').fill('Phone table');
  await mina.getByRole('button', { name: 'Open the table' }).click();
  await mina.getByRole('button', { name: 'Sit at east' }).click();
  for (let i = 0; i < 3; i++) {
    await mina.getByRole('button', { name: 'Seat a bot' }).first().click();
    await expect.poll(() => mina.getByRole('button', { name: 'Seat a bot' }).count()).toBe(2 - i);
  }
  await mina.getByRole('button', { name: 'Deal and start the Charleston' }).click();
  await rack(mina).waitFor();
  const width = await rack(mina).getByRole('button').first().evaluate((b) => b.getBoundingClientRect().width);
  expect(width).toBeGreaterThanOrEqual(44);
  const overflow = await mina.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await snap(mina, 'table-phone');

  // Keyboard only: Tab into the rack, arrows move, Space picks (never a joker), Enter sends.
  const first = rack(mina).locator('button[tabindex="0"]');
  await first.focus();
  let picked = 0;
  for (let i = 0; i < 14 && picked < 3; i++) {
    const label = (await mina.evaluate(() => document.activeElement?.getAttribute('aria-label'))) ?? '';
    if (!label.startsWith('joker')) {
      await mina.keyboard.press('Space');
      picked++;
    }
    await mina.keyboard.press('ArrowRight');
  }
  await mina.keyboard.press('Enter');
  const news = mina.getByText(/^You received 3 tiles from your left \(north\): /);
  // A send that crosses a bot's pass in flight is refused as stale, picks kept; a person presses Enter again.
  const stale = mina.getByText('The table changed while you were choosing. Look again and resend.');
  await news.or(stale).first().waitFor();
  if (await stale.isVisible()) await mina.keyboard.press('Enter');
  await news.waitFor();
  const animation = await rack(mina).locator('.tile-arrive').first().evaluate((el) => getComputedStyle(el).animationName);
  expect(animation).toBe('none');
  await snap(mina, 'table-phone-received');
}, 120_000);

test('the lobby reflows at 320 px with the largest text', async () => {
  const sol = await signIn('sol@harborlane.test', 'Sol Varga', 320);
  // On a phone the text sizes sit behind the Menu button.
  const menu = sol.getByRole('button', { name: /Menu/ });
  if (await menu.isVisible()) await menu.click();
  await sol.getByRole('button', { name: 'Text size largest' }).click();
  await sol.getByRole('heading', { name: 'Open a new table' }).waitFor();
  const overflow = await sol.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  await snap(sol, 'lobby-320-largest');
  expect(overflow).toBeLessThanOrEqual(0);
});

test('a new user registers, finishes an exchange against three bots, and replays it', async () => {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  contexts.push(context);
  const page = await context.newPage();
  await page.goto(`${baseUrl}/register`);
  await page.getByLabel('Name at the table').fill('Dana Okoye');
  await page.getByLabel('E-mail').fill('dana@harborlane.test');
  await page.getByLabel('Password').fill('three-bots-and-me');
  await page.getByRole('button', { name: 'Make my account' }).click();
  await page.getByRole('heading', { name: 'Welcome, Dana Okoye' }).waitFor();
  await page.getByLabel('Table name').fill('Dana practises');
  await page.getByRole('button', { name: 'Open the table' }).click();
  await page.getByRole('button', { name: 'Sit at south' }).click();
  for (let i = 0; i < 3; i++) {
    await page.getByRole('button', { name: 'Seat a bot' }).first().click();
    await expect.poll(() => page.getByRole('button', { name: 'Seat a bot' }).count()).toBe(2 - i);
  }
  await page.getByRole('button', { name: 'Deal and start the Charleston' }).click();
  await rack(page).waitFor();
  await playToEnd(page, { stop: false });
  await page.getByText('The Charleston is over.').waitFor();
  await page.getByRole('link', { name: 'Replay this exchange pass by pass' }).click();
  await page.getByRole('heading', { name: 'Replay: Dana practises' }).waitFor();
  await page.getByRole('button', { name: 'Next step →' }).click();
  await page.getByText(/^Step 1 of \d+/).waitFor();
  await snap(page, 'replay-1440');
  await page.getByRole('link', { name: 'My exchanges' }).click();
  await page.getByRole('link', { name: /^Replay Dana practises/ }).waitFor();
}, 2 * PLAY_DEADLINE_MS);

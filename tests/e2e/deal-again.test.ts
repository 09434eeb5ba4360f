/**
 * One person and three bots in Chromium: the bots wait for the person's vote, the table says who
 * stopped, and the host deals again with the same seats.
 */
import type { Browser, BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import { launch, snap } from './browser';
import { PLAY_DEADLINE_MS, pickAndSend, playToEnd, rack, signInContext } from './play';

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

/** Three coin-flip votes stop a deal seven times in eight; eight deals without a stop happen once in 17 million. */
const MOST_DEALS = 8;

test('a bot votes to stop and the person sees who stopped; then the host deals again with the same seats', async () => {
  const { context, page: sol } = await signInContext(browser, baseUrl, 'sol@harborlane.test', 'Sol Varga');
  contexts.push(context);
  await sol.getByLabel('Table name').fill('Sol practises');
  await sol.getByRole('button', { name: 'Open the table' }).click();
  await sol.waitForURL(/\/tables\//);
  await sol.getByRole('button', { name: 'Sit at east' }).click();
  await sol.getByRole('button', { name: 'Stand up' }).waitFor();
  // Bots that vote on a coin flip, so one of them stops now and then.
  for (const seat of ['south', 'west', 'north']) {
    await sol.getByLabel(`Bot for ${seat}`).selectOption('random');
    await sol.getByRole('button', { name: `Seat a bot at ${seat}` }).click();
    await sol.getByRole('button', { name: `Seat a bot at ${seat}` }).waitFor({ state: 'detached', timeout: 20_000 });
  }
  const seats = await sol.getByRole('group', { name: 'The table, seen from above' }).innerText();
  await sol.getByRole('button', { name: 'Deal and start the Charleston' }).click();

  let stoppedBy: string | null = null;
  for (let deal = 1; deal <= MOST_DEALS && !stoppedBy; deal++) {
    await expect.poll(() => rack(sol).getByRole('button').count(), { timeout: 30_000 }).toBe(14);
    const firstRack = await rack(sol).innerText();
    // The vote waits for Sol: when it is asked, no bot has voted yet.
    await playToEndWatchingVote(sol);
    const result = sol.getByText(/voted to stop: no second Charleston\.$|^Everyone voted to go on/);
    await result.first().waitFor();
    const said = (await result.first().innerText()).trim();
    if (/\(bot\) voted to stop/.test(said)) {
      stoppedBy = said;
      await snap(sol, 'vote-result');
    }
    await sol.getByText('The Charleston is over.').waitFor();
    await snap(sol, 'table-done-deal-again');
    await sol.getByRole('button', { name: 'Deal again' }).click();
    // A new deal for the same four seats.
    await expect.poll(() => rack(sol).innerText(), { timeout: 30_000 }).not.toBe(firstRack);
    expect(await sol.getByRole('group', { name: 'The table, seen from above' }).innerText()).toContain(seats.split('\n').find((l) => l.includes('(bot'))?.trim() ?? 'bot');
  }
  expect(stoppedBy).toMatch(/^(South|West|North) \(bot\)( and (South|West|North) \(bot\))* voted to stop: no second Charleston\.$/);
}, MOST_DEALS * PLAY_DEADLINE_MS);

/** Plays the first Charleston; at the vote, checks that every bot is still to vote; then plays to the end. */
async function playToEndWatchingVote(page: Parameters<typeof playToEnd>[0]) {
  const vote = page.getByRole('button', { name: 'Play a second Charleston' });
  const send = page.getByRole('button', { name: /^Send \d tiles?$/ });
  const deadline = Date.now() + PLAY_DEADLINE_MS;
  for (;;) {
    await vote.or(send).first().waitFor({ timeout: Math.max(1, deadline - Date.now()) });
    if (await vote.isVisible()) break;
    await pickAndSend(page);
    await page.getByText(/Your pass is in|^You received/).or(vote).first().waitFor({ timeout: Math.max(1, deadline - Date.now()) });
  }
  const tally = page.getByRole('list', { name: 'Votes so far' });
  await snap(page, 'vote-open');
  expect(await tally.innerText()).not.toMatch(/\(bot\):\s*(stop|go on)/);
  await playToEnd(page, { stop: false });
}

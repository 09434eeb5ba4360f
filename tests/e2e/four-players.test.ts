import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import { seriousViolations } from './axe';
import { launch, snap } from './browser';
import { PLAY_DEADLINE_MS, pickAndSend, pickable, playToEnd, rack, sendButton, signInContext } from './play';

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

/** Picks and sends; if the table moved on in the same moment, does what a person would: sends again. */
async function send(page: Page) {
  await pickAndSend(page);
  const done = page.getByText(/Your pass is in/);
  const stale = page.getByText('The table changed while you were choosing. Look again and resend.');
  await done.or(stale).first().waitFor();
  if (await stale.isVisible()) {
    await sendButton(page).click();
    await done.waitFor();
  }
}

async function person(email: string, name: string): Promise<Page> {
  const { context, page } = await signInContext(browser, baseUrl, email, name, 1280);
  contexts.push(context);
  return page;
}

test('four people in four browsers sit at one table, play a whole exchange through a huddle, and open the replay', async () => {
  const [ines, theo, mina, sol] = await Promise.all([
    person('ines@harborlane.test', 'Ines Okafor'),
    person('theo@harborlane.test', 'Theo Brandt'),
    person('mina@harborlane.test', 'Mina Castellanos'),
    person('sol@harborlane.test', 'Sol Varga'),
  ]);
  const players = [ines, theo, mina, sol];

  // The teacher opens a table and sits east; one player finds it among the open tables, two follow the link.
  await ines.getByLabel('Table name').fill('Harbor Lane four at one table');
  await ines.getByLabel(/Deal seed/).fill('harbor-lane-week-02');
  await ines.getByRole('button', { name: 'Open the table' }).click();
  await ines.waitForURL(/\/tables\//);
  const tableUrl = ines.url();
  await ines.getByRole('button', { name: 'Sit at east' }).click();
  await ines.getByRole('button', { name: 'Stand up' }).waitFor();
  await theo.reload();
  await theo.getByRole('link', { name: 'Harbor Lane four at one table' }).first().click();
  await theo.getByRole('button', { name: 'Sit at south' }).click();
  await theo.getByRole('button', { name: 'Stand up' }).waitFor();
  await mina.goto(tableUrl);
  await mina.getByRole('button', { name: 'Sit at west' }).click();
  await mina.getByRole('button', { name: 'Stand up' }).waitFor();
  await sol.goto(tableUrl);
  await sol.getByRole('button', { name: 'Sit at north' }).click();
  await sol.getByRole('button', { name: 'Stand up' }).waitFor();
  await expect.poll(() => ines.getByRole('button', { name: 'Seat a bot' }).count()).toBe(0);
  await snap(ines, 'four-seated');

  await ines.getByRole('button', { name: 'Deal and start the Charleston' }).click();
  for (const p of players) await rack(p).waitFor();
  await expect.poll(() => rack(ines).getByRole('button').count()).toBe(14);
  for (const p of [theo, mina, sol]) await expect.poll(() => rack(p).getByRole('button').count()).toBe(13);
  await snap(mina, 'four-table');

  // The host holds the first pass; every player sees why, and the three others send.
  await ines.getByRole('button', { name: 'Hold this pass' }).click();
  for (const p of [theo, mina, sol]) await p.getByRole('heading', { name: 'This pass is on hold' }).waitFor();
  // One after another: a send made against a table that has changed since it was drawn is refused
  // as stale (the server checks the table's version), so each waits until the last is in.
  for (const p of [theo, mina, sol]) await send(p);

  // The host shows Theo's seat to the table and writes a note about it.
  await ines.getByRole('button', { name: 'Show south' }).click();
  await ines.getByLabel('Note for the table').fill('South passes from two suits and keeps every honour.');
  await ines.getByLabel('About').selectOption('south');
  await ines.getByRole('button', { name: 'Add note' }).click();
  // The shown rack is the table's to see; a note on one seat is for that seat (and the host) until the end.
  await theo.getByText(/keeps every honour/).waitFor();
  for (const p of [theo, mina, sol]) await p.getByRole('group', { name: 'Rack of Theo Brandt' }).waitFor();
  for (const p of [mina, sol]) expect(await p.getByText(/keeps every honour/).count()).toBe(0);
  await snap(mina, 'four-huddle');
  await snap(ines, 'four-huddle-host');
  const huddleFindings = [...(await seriousViolations(mina, 'huddle, player')), ...(await seriousViolations(ines, 'huddle, host'))];
  expect(huddleFindings).toEqual([]);

  // Sol takes a pass back and chooses again while it is held; then the host sends and lets it go.
  await sol.getByRole('button', { name: 'Take back my choice' }).click();
  await pickable(sol).first().waitFor();
  await send(sol);
  await send(ines);
  await ines.getByRole('button', { name: 'Let the pass go' }).click();
  for (const p of players) await p.getByText(/^You received 3 tiles from/).waitFor();

  // Everyone plays on to the end; all four vote to stop after the first Charleston.
  await Promise.all(players.map((p) => playToEnd(p, { stop: true })));
  for (const p of players) await p.getByText('The Charleston is over.').waitFor();
  await snap(theo, 'four-done');

  // The replay opens from the table for the host and from her history for a player; the note sits in place.
  await ines.getByRole('link', { name: 'Replay this exchange pass by pass' }).click();
  await ines.getByRole('heading', { name: 'Replay: Harbor Lane four at one table' }).waitFor();
  await ines.keyboard.press('ArrowRight');
  await ines.getByText(/^Step 1 of \d+: After the first Charleston, pass right/).waitFor();
  await ines.getByText(/keeps every honour/).waitFor();
  await snap(ines, 'four-replay');
  await mina.getByRole('link', { name: 'My exchanges' }).click();
  await mina.getByRole('link', { name: /^Replay Harbor Lane four at one table/ }).first().click();
  await mina.getByRole('heading', { name: 'Replay: Harbor Lane four at one table' }).waitFor();
  for (const seat of ['Ines Okafor', 'Theo Brandt', 'Mina Castellanos', 'Sol Varga']) await mina.getByText(seat).first().waitFor();
}, 2 * PLAY_DEADLINE_MS);

import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import { seriousViolations } from './axe';
import { launch } from './browser';
import { PLAY_DEADLINE_MS, pickable, playToEnd, rack, seatBots, signInContext } from './play';

// Every page scanned with axe-core (WCAG 2.0–2.2 A and AA tags plus best practice):
// none may have a violation that axe rates serious or critical.

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

async function as(email: string, name: string, width?: number): Promise<Page> {
  const { context, page } = await signInContext(browser, baseUrl, email, name, width);
  contexts.push(context);
  return page;
}

test('no serious or critical axe violations on any page', async () => {
  const found: string[] = [];
  const scan = async (page: Page, label: string) => found.push(...(await seriousViolations(page, label)));

  // Signed out: sign-in, register (empty and with its field errors), forgot password, a missing page.
  const anonymous = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  contexts.push(anonymous);
  const guest = await anonymous.newPage();
  await guest.goto(`${baseUrl}/sign-in`);
  await guest.getByRole('heading', { name: 'Sign in' }).waitFor();
  await scan(guest, 'sign-in');
  await guest.goto(`${baseUrl}/register`);
  await guest.getByRole('heading', { name: 'Make an account' }).waitFor();
  await scan(guest, 'register');
  await guest.getByRole('button', { name: 'Make my account' }).click();
  await guest.getByText('Use at least 8 characters').waitFor();
  await scan(guest, 'register with errors');
  await guest.goto(`${baseUrl}/forgot-password`);
  await guest.getByLabel('E-mail').fill('theo@harborlane.test');
  await guest.getByRole('button', { name: 'Send me a link' }).click();
  await guest.getByRole('link', { name: 'Back to sign in' }).waitFor();
  await scan(guest, 'forgot password, sent');
  await guest.goto(`${baseUrl}/no-such-page`);
  await guest.getByRole('heading', { name: 'This page is not here' }).waitFor();
  await scan(guest, 'not found');

  // A player: home and lobby, a table with three bots from the lobby to the end, its replay, her history.
  const mina = await as('mina@harborlane.test', 'Mina Castellanos');
  await mina.getByRole('heading', { name: 'Open a new table' }).waitFor();
  await scan(mina, 'home');
  await mina.getByLabel('Table name').fill('Axe check');
  await mina.getByRole('button', { name: 'Open the table' }).click();
  await mina.getByRole('button', { name: 'Sit at east' }).click();
  await seatBots(mina, 3);
  await scan(mina, 'table lobby');
  await mina.getByRole('button', { name: 'Deal and start the Charleston' }).click();
  await rack(mina).waitFor();
  await pickable(mina).first().click();
  await pickable(mina).first().click();
  await scan(mina, 'table mid-pass');
  // Picks are kept until the pass is sent: complete them, and the seat plays on from there.
  await pickable(mina).first().click();
  await playToEnd(mina, { stop: true });
  await mina.getByText('The Charleston is over.').waitFor();
  await scan(mina, 'table done');
  await mina.getByRole('link', { name: 'Replay this exchange pass by pass' }).click();
  await mina.getByRole('heading', { name: 'Replay: Axe check' }).waitFor();
  await mina.getByRole('button', { name: 'Next step →' }).click();
  await mina.getByText(/^Step 1 of \d+/).waitFor();
  await scan(mina, 'replay');
  await mina.getByRole('link', { name: 'My exchanges' }).click();
  await mina.getByRole('link', { name: /^Replay Axe check/ }).first().waitFor();
  await scan(mina, 'history');
  // One table on this deal: the history offers no Compare, but the comparison page still opens and says so.
  const replayHref = (await mina.getByRole('link', { name: /^Replay Axe check/ }).first().getAttribute('href'))!;
  await mina.goto(`${baseUrl}/compare/exchanges/${replayHref.split('/').pop()}`);
  await mina.getByRole('heading', { name: 'Same deal, compared' }).waitFor();
  await scan(mina, 'comparison');
  await mina.getByRole('link', { name: 'My progress' }).click();
  await mina.getByRole('heading', { level: 1 }).waitFor();
  await mina.locator('.recharts-surface').first().waitFor();
  await scan(mina, 'progress');

  // The teacher: drills, pattern lists, lessons and her outbox.
  const ines = await as('ines@harborlane.test', 'Ines Okafor');
  await ines.getByRole('link', { name: 'Drills' }).click();
  await ines.getByRole('heading', { name: 'Harbor Lane week 1' }).waitFor();
  await scan(ines, 'drills');
  await ines.getByRole('link', { name: 'Edit Harbor Lane week 1' }).click();
  await ines.getByRole('heading', { name: /^East starts with/ }).waitFor();
  await scan(ines, 'drill editor');
  await ines.getByRole('link', { name: 'Pattern lists' }).click();
  await ines.getByRole('heading', { name: 'Harbor Lane practice list' }).waitFor();
  await scan(ines, 'pattern lists');
  await ines.getByRole('link', { name: 'Edit Harbor Lane practice list' }).click();
  await ines.getByRole('button', { name: 'Edit pattern 1', exact: true }).waitFor();
  await scan(ines, 'pattern list editor');
  await ines.getByRole('link', { name: 'Lessons', exact: true }).click();
  await ines.getByRole('heading', { name: 'Lessons', exact: true }).waitFor();
  await scan(ines, 'lessons');

  // The organiser: people and roles, and the whole outbox with the reset mail open.
  const pat = await as('pat@harborlane.test', 'Pat Lindqvist');
  await pat.goto(`${baseUrl}/admin/users`);
  await pat.getByRole('heading', { name: 'People and roles' }).waitFor();
  await scan(pat, 'admin people');
  await pat.goto(`${baseUrl}/mail`);
  await pat.getByRole('heading', { name: 'Mail sent' }).waitFor();
  await pat.getByRole('button', { name: /Password reset to theo@harborlane.test/ }).first().click();
  await pat.getByRole('heading', { name: /password/i, level: 2 }).waitFor();
  await scan(pat, 'mail outbox');

  expect(found, `axe found ${found.length} serious or critical violations:\n${found.join('\n')}`).toEqual([]);
}, 2 * PLAY_DEADLINE_MS);

import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, onTestFailed, test } from 'vitest';
import { launch, snap } from './browser';
import { PLAY_DEADLINE_MS, playToEnd, rack } from './play';

/**
 * A whole lesson day from the browser alone: the teacher schedules a priced lesson on her demo
 * drill, invites two students by e-mail, each follows the mailed link in their own browser,
 * accepts and pays on the local checkout, both play at their own table on the same deal, and
 * the teacher reads the comparison and each student's progress.
 */

let browser: Browser;
const baseUrl = inject('baseUrl');
const contexts: BrowserContext[] = [];
const pages = new Map<string, Page>();
const PASSWORD = 'harbor-lane-demo';
// Unique per run, so a re-run against the same database never finds an older lesson of this name.
const TITLE = `Harbor Lane lesson day ${Date.now().toString(36)}`;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  for (const c of contexts) await c.close();
  await browser?.close();
});

async function newPage(name: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  contexts.push(context);
  const page = await context.newPage();
  page.on('pageerror', (err) => console.error(`[${name}] page error:`, err.message));
  pages.set(name, page);
  return page;
}

async function signIn(page: Page, email: string, name: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: `Welcome, ${name}` }).waitFor();
}

/** The student follows the mailed link in their own browser, signs in there, accepts, pays and reads the receipt. */
async function acceptAndPay(page: Page, link: string, email: string, who: string) {
  await page.goto(link);
  await page.getByRole('heading', { name: `You are invited to “${TITLE}”` }).waitFor();
  await page.getByText('$12.50').first().waitFor();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Accept, then pay for my seat' }).click();
  await page.getByRole('heading', { name: TITLE }).waitFor();
  await page.getByRole('button', { name: 'Pay $12.50 for my seat' }).click();
  await page.getByText('Local test checkout').waitFor();
  await snap(page, `lesson-day-checkout-${who}`);
  await page.getByRole('button', { name: 'Pay $12.50' }).click();
  await page.getByRole('heading', { name: 'Receipt' }).waitFor({ timeout: 15_000 });
  await page.getByText('Paid. Your seat is yours.').waitFor();
  const receipt = page.locator('dl');
  await receipt.getByText(TITLE).waitFor();
  await receipt.getByText('Ines Okafor').waitFor();
  await receipt.getByText('$12.50').waitFor();
  await snap(page, `lesson-day-receipt-${who}`);
  await page.getByRole('link', { name: 'Back to the lesson' }).click();
  await page.getByText('Your place:').waitFor();
  expect(await page.getByText('Paid', { exact: true }).count()).toBe(1);
}

test('a lesson day: a priced drill lesson, two invited students pay, play two tables on one deal, then comparison and progress', async () => {
  // When a step fails, every person's screen as it was, for a person to look at.
  onTestFailed(async () => {
    for (const [name, page] of pages) {
      console.error(`[${name}] at ${page.url()}`);
      await snap(page, `lesson-day-failed-${name.toLowerCase()}`).catch(() => undefined);
    }
  });
  // The teacher schedules a priced lesson on her demo drill.
  const ines = await newPage('Ines');
  await signIn(ines, 'ines@harborlane.test', 'Ines Okafor');
  await ines.getByRole('link', { name: 'Lessons', exact: true }).click();
  await ines.getByLabel('Title').fill(TITLE);
  await ines.getByLabel('Starts at').fill('2031-03-11T19:00');
  await ines.getByLabel(/^Time zone/).selectOption('America/Chicago');
  await ines.getByLabel('Seats for students').fill('6');
  await ines.getByLabel(/^Priced/).check();
  await ines.getByLabel(/^Price$/).fill('12.50');
  await ines.getByLabel(/^Drill to play/).selectOption({ label: 'Harbor Lane week 1' });
  await snap(ines, 'lesson-day-schedule');
  await ines.getByRole('button', { name: 'Schedule the lesson' }).click();
  await ines.getByRole('heading', { name: TITLE }).waitFor();
  const lessonUrl = ines.url();
  await ines.getByText(/\b0 of 6 seats paid/).waitFor();
  await ines.getByText('Deal: drill “Harbor Lane week 1”').waitFor();
  await ines.getByText(/\$12\.50/).first().waitFor();

  // She invites Mina and Sol by e-mail.
  await ines.getByLabel('E-mail addresses').fill('mina@harborlane.test, sol@harborlane.test');
  await ines.getByRole('button', { name: 'Send invitations' }).click();
  await ines.getByText('Invitation sent to mina@harborlane.test.').waitFor();
  await ines.getByText('Invitation sent to sol@harborlane.test.').waitFor();
  await snap(ines, 'lesson-day-invited');

  // She reads each invitation on the Mail page; the newest one for each address is this lesson's.
  await ines.getByRole('link', { name: 'Mail', exact: true }).click();
  const links: Record<string, string> = {};
  for (const who of ['mina', 'sol']) {
    await ines.getByRole('button', { name: new RegExp(`${TITLE}.*Invitation to ${who}@harborlane\\.test`) }).click();
    await ines.getByText(`To ${who}@harborlane.test ·`).waitFor();
    const link = ines.getByRole('link', { name: /\/invitations\// });
    links[who] = (await link.getAttribute('href'))!;
  }
  await snap(ines, 'lesson-day-mail');
  expect(links.mina).toMatch(new RegExp(`^${baseUrl}/invitations/`));
  expect(links.sol).not.toBe(links.mina);

  // Each student, in their own browser, follows the link, accepts and pays.
  const mina = await newPage('Mina');
  const sol = await newPage('Sol');
  await acceptAndPay(mina, links.mina, 'mina@harborlane.test', 'mina');
  await acceptAndPay(sol, links.sol, 'sol@harborlane.test', 'sol');
  await mina.getByText('Your table appears here once the teacher splits the room.').waitFor();
  await snap(mina, 'lesson-day-student-waiting');

  // The teacher sees both seats paid, splits the room over two tables and starts them.
  await ines.goto(lessonUrl);
  await ines.getByText(/\b2 of 6 seats paid/).waitFor();
  const students = ines.getByRole('table');
  await students.getByRole('row', { name: /Mina Castellanos.*Paid/ }).waitFor();
  await students.getByRole('row', { name: /Sol Varga.*Paid/ }).waitFor();
  await ines.getByLabel(/^Tables/).fill('2');
  await ines.getByRole('button', { name: 'Split into tables' }).click();
  const table1 = ines.getByRole('listitem').filter({ has: ines.getByRole('heading', { name: `${TITLE} · table 1` }) });
  const table2 = ines.getByRole('listitem').filter({ has: ines.getByRole('heading', { name: `${TITLE} · table 2` }) });
  await table1.getByText('Mina Castellanos').waitFor();
  await table2.getByText('Sol Varga').waitFor();
  expect(await table1.getByText('(bot)').count()).toBe(3);
  expect(await table2.getByText('(bot)').count()).toBe(3);
  await ines.getByRole('button', { name: 'Start every table' }).click();
  await expect.poll(() => ines.getByText('Playing', { exact: true }).count(), { timeout: 10_000 }).toBe(2);
  await snap(ines, 'lesson-day-room');

  // Each student finds their own table in the lesson room (and only theirs) and plays it to the end.
  for (const [page, name] of [[mina, 'Mina'], [sol, 'Sol']] as const) {
    await page.getByRole('link', { name: /^Open .* · table \d$/ }).waitFor({ timeout: 15_000 });
    expect(await page.getByRole('link', { name: /^Open .* · table \d$/ }).count()).toBe(1);
    await page.getByRole('link', { name: /^Open .* · table \d$/ }).click();
    await page.waitForURL(/\/tables\//);
    await rack(page).waitFor();
    // East is dealt the drill's preset rack, jokers included, and starts with 14 tiles.
    await expect.poll(() => rack(page).getByRole('button').count()).toBe(14);
    await expect.poll(() => rack(page).getByRole('button', { name: /^joker/ }).count()).toBeGreaterThanOrEqual(1);
    await snap(page, `lesson-day-table-${name.toLowerCase()}-dealt`);
  }
  // Each student has a habit (passing from the left or the right end of the rack), so the two
  // tables part ways on the same deal and the comparison has something to show.
  await Promise.all([playToEnd(mina, { stop: false, from: 'left', ask: 1 }), playToEnd(sol, { stop: true, from: 'right', ask: 1 })]);
  await mina.getByText('The Charleston is over.').waitFor();
  await sol.getByText('The Charleston is over.').waitFor();
  await snap(mina, 'lesson-day-table-mina-done');
  await snap(sol, 'lesson-day-table-sol-done');

  // The teacher compares the two tables on the one deal.
  await ines.goto(lessonUrl);
  await expect.poll(() => ines.getByText('Finished', { exact: true }).count(), { timeout: 15_000 }).toBe(2);
  await ines.getByRole('link', { name: 'Compare the tables of this lesson' }).click();
  await ines.getByRole('heading', { name: 'Same deal, compared' }).waitFor();
  await ines.getByRole('heading', { name: 'Tables, best first' }).waitFor();
  const standings = ines.getByRole('table');
  await standings.getByRole('row', { name: /Mina Castellanos/ }).waitFor();
  await standings.getByRole('row', { name: /Sol Varga/ }).waitFor();
  // Both tables, four seats each, on one deal.
  expect(await ines.getByRole('heading', { level: 2 }).count()).toBe(1);
  expect(await standings.getByRole('row').count()).toBe(1 + 8);
  expect(await ines.getByText(/still passing/).count()).toBe(0);
  // East was dealt the same rack at both tables; the two students chose differently from it.
  const firstPass = (who: string) => ines.getByRole('list', { name: `What ${who} passed` }).getByRole('img').first().getAttribute('aria-label');
  const [minaFirst, solFirst] = [await firstPass('Mina Castellanos'), await firstPass('Sol Varga')];
  expect(minaFirst).toMatch(/\w/);
  expect(solFirst).not.toBe(minaFirst);
  await snap(ines, 'lesson-day-comparison');

  // And each student's progress, from the lesson's list of students.
  for (const [name, table] of [['Mina Castellanos', 'table 1'], ['Sol Varga', 'table 2']] as const) {
    await ines.goto(lessonUrl);
    await ines.getByRole('link', { name: `Progress of ${name}` }).click();
    await ines.getByRole('heading', { name: `Progress of ${name}` }).waitFor();
    await ines.getByRole('row', { name: new RegExp(`${TITLE} · ${table}`) }).waitFor();
    await ines.mouse.move(0, 0);
    await snap(ines, `lesson-day-progress-${name.split(' ')[0].toLowerCase()}`);
  }

  // A student opens their own progress from the menu.
  await sol.getByRole('link', { name: 'My progress' }).click();
  await sol.getByRole('heading', { name: 'My progress' }).waitFor();
  await sol.getByRole('row', { name: new RegExp(`${TITLE} · table 2`) }).waitFor();
  await sol.mouse.move(0, 0);
  await snap(sol, 'lesson-day-own-progress');
}, 2 * PLAY_DEADLINE_MS);

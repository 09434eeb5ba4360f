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

/** How a seat plays: its vote, which end of the rack it passes from, and how many courtesy tiles it asks for. */
export interface PlayStyle {
  /** Vote to stop after the first Charleston (else for a second one). */
  stop: boolean;
  from?: 'left' | 'right';
  ask?: 1 | 2 | 3;
}

type Move = 'over' | 'send' | 'vote' | 'ask';

/** Long enough for a whole exchange with bots on a busy two-core machine. */
export const PLAY_DEADLINE_MS = 150_000;

/**
 * Waits, on the page itself, until this seat has something to do or the exchange is over. A send
 * is due when the send button shows and either nothing is picked yet or the picks are complete
 * (a send refused as stale keeps its picks); a disabled button with picks means one is on its way.
 */
async function nextMove(page: Page, timeout: number): Promise<Move> {
  const due = await page.waitForFunction(
    () => {
      if (document.body.innerText.includes('The Charleston is over.')) return 'over';
      const buttons = [...document.querySelectorAll('button')];
      const named = (pattern: RegExp) => buttons.find((b) => pattern.test(b.textContent?.trim() ?? ''));
      const vote = named(/^Stop after this round$/);
      if (vote && !vote.disabled) return 'vote';
      const ask = named(/^Ask for /);
      if (ask && !ask.disabled) return 'ask';
      const send = named(/^Send \d tiles?$/);
      // Picks are kept until a pass is sent, so a disabled button with fewer picks than the pass
      // asks for is waiting for more picks, not for an answer.
      const picked = document.querySelectorAll('[role="group"][aria-label="Your rack"] button[aria-pressed="true"]').length;
      const size = Number(/\d/.exec(send?.textContent ?? '')?.[0] ?? 0);
      if (send && (!send.disabled || picked < size)) return 'send';
      return null;
    },
    undefined,
    { timeout, polling: 50 },
  );
  return (await due.jsonValue()) as Move;
}

const tiles = (n: number) => `${n} ${n === 1 ? 'tile' : 'tiles'}`;

/** Makes one move and returns the button pressed last, so the caller can wait for it to take. */
async function makeMove(page: Page, move: Exclude<Move, 'over'>, style: PlayStyle, timeout: number) {
  const quick = { timeout };
  if (move === 'vote') {
    const button = page.getByRole('button', { name: style.stop ? 'Stop after this round' : 'Play a second Charleston' });
    const handle = await button.elementHandle(quick);
    await button.click(quick);
    return handle;
  }
  if (move === 'ask') {
    const n = style.ask ?? 2;
    await page.getByRole('radio', { name: tiles(n), exact: true }).check(quick);
    const button = page.getByRole('button', { name: `Ask for ${tiles(n)}` });
    const handle = await button.elementHandle(quick);
    await button.click(quick);
    return handle;
  }
  const send = sendButton(page);
  const handle = await send.elementHandle(quick);
  // At most three picks wake the button; the fourth try covers a pick the page turned down.
  for (let i = 0; i < 4 && !(await send.isEnabled()); i++) await (style.from === 'right' ? pickable(page).last() : pickable(page).first()).click(quick);
  await send.click(quick);
  return handle;
}

/**
 * Plays this seat to the end of the exchange: waits for each thing it is asked to do, does it, and
 * waits until the page has taken it (the button pressed is disabled while the action is on its way,
 * or gone). The table may move on while a button is reached for (a bot's vote can end a round
 * first): a move whose button went away gives up after a few seconds, and the seat looks again.
 * Fails only when the exchange is not over within `deadlineMs`.
 */
export async function playToEnd(page: Page, style: PlayStyle, deadlineMs = PLAY_DEADLINE_MS) {
  const deadline = Date.now() + deadlineMs;
  const left = () => {
    const ms = deadline - Date.now();
    if (ms <= 0) throw new Error(`The exchange was not over within ${deadlineMs / 1000} s; the page says: ${page.url()}`);
    return ms;
  };
  for (;;) {
    let move: Move;
    try {
      move = await nextMove(page, left());
    } catch (err) {
      // Say what the page showed when it stopped asking for anything.
      const shown = (await page.locator('main').innerText().catch(() => '')).replace(/\s+/g, ' ').slice(0, 1500);
      throw new Error(`${(err as Error).message}\nThe page showed: ${shown}`, { cause: err });
    }
    if (move === 'over') return;
    if (process.env.E2E_TRACE) console.error(`[play] ${move} ${new Date().toISOString()}`);
    try {
      const label = move === 'vote' ? (style.stop ? 'Stop after this round' : 'Play a second Charleston') : move === 'ask' ? `Ask for ${tiles(style.ask ?? 2)}` : null;
      const pressed = await makeMove(page, move, style, Math.min(5_000, left()));
      // Taken once the button is gone, disabled, or (React reuses elements) says something else now.
      await page.waitForFunction(
        ([button, was]) => !button?.isConnected || (button as HTMLButtonElement).disabled || (was !== null && button.textContent?.trim() !== was),
        [pressed, label] as const,
        { timeout: left(), polling: 50 },
      );
    } catch (err) {
      if (!(err instanceof Error && err.name === 'TimeoutError')) throw err;
    }
  }
}

/** The host, already seated, fills every empty seat with a bot. */
export async function seatBots(host: Page, count: number) {
  for (let i = 0; i < count; i++) {
    await host.getByRole('button', { name: 'Seat a bot' }).first().click();
    await expect.poll(() => host.getByRole('button', { name: 'Seat a bot' }).count()).toBe(count - 1 - i);
  }
}

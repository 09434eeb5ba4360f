import { mkdirSync } from 'node:fs';
import { chromium, type Browser, type Page } from 'playwright-core';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}

/** Saves a screenshot under .tmp/screens for a person to look at. */
export async function snap(page: Page, name: string) {
  mkdirSync('.tmp/screens', { recursive: true });
  await page.screenshot({ path: `.tmp/screens/${name}.png`, fullPage: true });
}

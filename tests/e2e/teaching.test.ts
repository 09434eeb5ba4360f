import type { Browser, Page } from 'playwright-core';
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

async function signInAsInes(page: Page) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('ines@harborlane.test');
  await page.getByLabel('Password').fill('harbor-lane-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: /Welcome, Ines Okafor/ }).waitFor();
}

test('the demo teacher edits her drill with tiles, opens a table from it, and works on her pattern list', async () => {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await signInAsInes(page);
  await page.getByRole('link', { name: 'Drills' }).click();
  await page.getByRole('heading', { name: 'Harbor Lane week 1' }).waitFor();
  await snap(page, 'drills');

  await page.getByRole('link', { name: 'Edit Harbor Lane week 1' }).click();
  await page.getByRole('heading', { name: 'East starts with 6 of 14 tiles' }).waitFor();
  await page.getByRole('radio', { name: /South/ }).check({ force: true });
  await page.getByRole('button', { name: 'Add 5 dot to south, 4 left' }).click();
  await page.getByRole('button', { name: 'Add 5 dot to south, 3 left' }).click();
  await page.getByRole('heading', { name: 'South starts with 2 of 13 tiles' }).waitFor();
  await snap(page, 'drill-edit');
  await page.getByRole('button', { name: 'Save the drill' }).click();
  await page.getByText('Saved “Harbor Lane week 1”.').waitFor();

  await page.setViewportSize({ width: 320, height: 800 });
  const sideways = await page.evaluate(() => document.documentElement.scrollWidth > document.documentElement.clientWidth);
  expect(sideways).toBe(false);
  await snap(page, 'drill-edit-320');
  await page.getByRole('heading', { name: 'South starts with 2 of 13 tiles' }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: '.tmp/screens/drill-edit-320-view.png' });
  await page.setViewportSize({ width: 1280, height: 900 });

  await page.getByRole('button', { name: 'Open a table with this drill' }).click();
  await page.waitForURL(/\/tables\/[0-9a-f-]{36}$/);
  const tableId = page.url().split('/').pop()!;
  const table = await page.evaluate(async (id) => (await (await fetch(`/api/tables/${id}`)).json()).table, tableId);
  expect(table.options).toMatchObject({ seed: 'harbor-lane-week-01', drillName: 'Harbor Lane week 1' });
  expect(table.options).not.toHaveProperty('racks');
  await snap(page, 'table-from-drill');

  await page.getByRole('link', { name: 'Pattern lists' }).click();
  await page.getByRole('heading', { name: 'Harbor Lane practice list' }).waitFor();
  await snap(page, 'pattern-lists');
  await page.getByRole('link', { name: 'Edit Harbor Lane practice list' }).click();
  await page.getByRole('button', { name: 'Edit pattern 1', exact: true }).click();
  await page.getByRole('group', { name: /^Group 2 of / }).getByLabel('Size').selectOption('6');
  await page.getByText(/of 14 tiles — remove/).waitFor();
  await snap(page, 'pattern-edit');
  await page.getByRole('button', { name: 'Save the list' }).click();
  await page.getByText(/The groups add up to \d+ tiles; a hand has 14/).first().waitFor();
  await snap(page, 'pattern-edit-error');
  // The part a person looks at, without the rest of the long list.
  await page.getByRole('group', { name: /^Group 2 of / }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: '.tmp/screens/pattern-edit-error-view.png' });

  await page.goto(`${baseUrl}/pattern-lists`);
  await page.getByLabel('Import a pattern list').setInputFiles({
    name: 'broken.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from('rackside-pattern-list,1\nname,Broken\nid,name,family,points,concealed,size,tile,suit,rank,dragon\nx-01,X,even,25,no,9,flower,,,\n'),
  });
  await page.getByRole('button', { name: 'Import', exact: true }).click();
  await page.getByRole('alert').getByText(/line 4, .*column size/).waitFor();
  await snap(page, 'pattern-import-error');
  await page.close();
});

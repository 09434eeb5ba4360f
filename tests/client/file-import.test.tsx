/** Importing pattern lists and drills from files, as a teacher meets it. */
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { expect, test } from 'vitest';
import { starterPatterns } from '../../shared/analysis';
import { fakeApi, type Reply, renderAt, signedInAs } from './render';


const teacher = signedInAs('teacher');
const starterSummary = { id: 'starter', name: 'Starter list', description: 'Rackside’s own practice list.', patternCount: starterPatterns.length, readOnly: true, updatedAt: null };
const oneAnchor = { id: 'l1', name: 'One anchor', description: '', patternCount: 1, readOnly: false, updatedAt: '2026-12-01T00:00:00Z' };
const brokenTwice = {
  status: 400,
  body: {
    error: {
      code: 'BAD_FILE',
      message: 'The file was not imported: 2 problems, each listed by its place. The first: line 4, pattern anchor-1: The groups add up to 13 tiles; a hand has 14. Nothing was saved.',
      fields: {
        file: 'line 4, pattern anchor-1: The groups add up to 13 tiles; a hand has 14.',
        'line 4, pattern anchor-1': 'The groups add up to 13 tiles; a hand has 14.',
        'line 9, pattern anchor-2, column value': 'value must be a whole number, such as 40.',
      },
    },
  },
};

const occurrences = (text: string, part: string) => text.split(part).length - 1;

async function importFile(label: string, name: string) {
  await userEvent.upload(screen.getByLabelText(label), new File(['x'], name, { type: name.endsWith('.csv') ? 'text/csv' : 'application/json' }));
  await userEvent.click(screen.getByRole('button', { name: 'Import' }));
}

test('a file with several problems shows each one once, in a list under a count', async () => {
  fakeApi({ ...teacher, 'GET /api/pattern-lists': { status: 200, body: { lists: [starterSummary] } }, 'POST /api/pattern-lists/import': brokenTwice });
  renderAt('/pattern-lists');
  await screen.findByRole('heading', { name: 'Starter list' });
  await importFile('Import a pattern list', 'anchors.csv');
  const alert = await screen.findByRole('alert');
  expect(occurrences(alert.textContent!, 'The groups add up to 13 tiles')).toBe(1);
  expect(within(alert).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
    'line 4, pattern anchor-1: The groups add up to 13 tiles; a hand has 14.',
    'line 9, pattern anchor-2, column value: value must be a whole number, such as 40.',
  ]);
  expect(alert.textContent).toContain('The file has 2 problems');
  expect(alert.textContent).toContain('Nothing was saved');
});

test('a file with one problem shows it once, without a list', async () => {
  fakeApi({
    ...teacher,
    'GET /api/drills': { status: 200, body: { drills: [] } },
    'POST /api/drills/import': {
      status: 400,
      body: { error: { code: 'BAD_FILE', message: 'The file was not imported.', fields: { file: 'line 5, column 3: Put a comma between entries.', 'line 5, column 3': 'Put a comma between entries.' } } },
    },
  });
  renderAt('/drills');
  await screen.findByText(/No drills yet/);
  await importFile('Import a drill file', 'week.json');
  const alert = await screen.findByRole('alert');
  expect(occurrences(alert.textContent!, 'Put a comma between entries.')).toBe(1);
  expect(within(alert).queryAllByRole('listitem')).toHaveLength(0);
});

test('an upload refused before reading shows the server’s message, once', async () => {
  fakeApi({
    ...teacher,
    'GET /api/pattern-lists': { status: 200, body: { lists: [starterSummary] } },
    'POST /api/pattern-lists/import': {
      status: 415,
      body: { error: { code: 'UNSUPPORTED_FILE', message: 'Rackside reads .json or .csv files here; "tiles.png" is neither. Pick a .json or .csv file.', fields: { file: 'Pick a .json or .csv file.' } } },
    },
  });
  renderAt('/pattern-lists');
  await screen.findByRole('heading', { name: 'Starter list' });
  await importFile('Import a pattern list', 'tiles.csv');
  const alert = await screen.findByRole('alert');
  expect(alert.textContent).toContain('"tiles.png" is neither');
  expect(occurrences(alert.textContent!, 'Pick a .json or .csv file.')).toBe(1);
});

test('a new import takes away the last import’s “Open the imported list”', async () => {
  let next: Reply = { status: 201, body: { list: { ...oneAnchor, patterns: [starterPatterns[0]] } } };
  fakeApi({ ...teacher, 'GET /api/pattern-lists': { status: 200, body: { lists: [starterSummary] } }, 'POST /api/pattern-lists/import': () => next });
  renderAt('/pattern-lists');
  await screen.findByRole('heading', { name: 'Starter list' });
  await importFile('Import a pattern list', 'one.json');
  expect(await screen.findByRole('link', { name: 'Open the imported list' })).toBeTruthy();
  // The singular: one pattern, not "1 patterns".
  expect(screen.getByText('Imported “One anchor” with 1 pattern.')).toBeTruthy();
  next = brokenTwice;
  await importFile('Import a pattern list', 'anchors.csv');
  await screen.findByRole('alert');
  expect(screen.queryByRole('link', { name: 'Open the imported list' })).toBeNull();
  expect(screen.queryByText(/Imported “One anchor”/)).toBeNull();
});

test('counts of patterns take the singular for one, and only the starter list says it can’t be changed', async () => {
  fakeApi({ ...teacher, 'GET /api/pattern-lists': { status: 200, body: { lists: [starterSummary, oneAnchor] } } });
  renderAt('/pattern-lists');
  const mine = (await screen.findByRole('heading', { name: 'One anchor' })).closest('li')!;
  expect(within(mine).getByText('1 pattern')).toBeTruthy();
  expect(mine.textContent).not.toMatch(/can’t be changed|read-only/);
  const starter = screen.getByRole('heading', { name: 'Starter list' }).closest('li')!;
  expect(within(starter).getByText(`${starterPatterns.length} patterns · read-only`)).toBeTruthy();
  expect(starter.textContent).toMatch(/It can’t be changed; copy it to make a list of your own\./);
});

test('the starter list’s page says it can’t be changed; a copy of it is a form to change, and saving one pattern says so', async () => {
  const copy = { ...oneAnchor, id: 'l2', name: 'Copy of Starter list', description: 'Rackside’s own practice list.', patterns: [starterPatterns[0]] };
  fakeApi({
    ...teacher,
    'GET /api/pattern-lists/starter': { status: 200, body: { list: { ...starterSummary, patterns: starterPatterns } } },
    'GET /api/pattern-lists/l2': { status: 200, body: { list: copy } },
    'PUT /api/pattern-lists/l2': { status: 200, body: { list: copy } },
  });
  const { router } = renderAt('/pattern-lists/starter');
  expect(await screen.findByText(/It can’t be changed; copy it to make a list of your own\./)).toBeTruthy();
  await router.navigate('/pattern-lists/l2');
  await screen.findByRole('heading', { name: 'Pattern list: Copy of Starter list' });
  expect(document.body.textContent).not.toMatch(/can’t be changed/);
  await userEvent.click(screen.getByRole('button', { name: 'Save the list' }));
  await waitFor(() => expect(screen.getByRole('status').textContent).toBe('Saved “Copy of Starter list” with 1 pattern.'));
});

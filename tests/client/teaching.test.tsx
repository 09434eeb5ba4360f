import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { expect, test, vi } from 'vitest';
import { starterPatterns } from '../../shared/analysis';
import type { DrillDto } from '../../shared/drills';
import { fakeApi, renderAt, signedInAs } from './render';

vi.mock('../../src/features/table/api/socket', () => ({ send: vi.fn(async () => ({ ok: true })), joinTable: vi.fn(async () => ({ ok: true })), leaveTable: vi.fn() }));


const teacher = signedInAs('teacher');
const starterSummary = { id: 'starter', name: 'Starter list', description: 'Rackside’s own practice list.', patternCount: starterPatterns.length, readOnly: true, updatedAt: null };
const weekOne: DrillDto = {
  id: 'd1',
  name: 'Harbor Lane week 1',
  description: 'East starts with two pairs.',
  seed: 'harbor-lane-week-01',
  jokers: true,
  secondCharleston: false,
  courtesy: true,
  racks: { east: ['bam2', 'bam2', 'dot8', 'dot8'] },
  patternListId: 'starter',
  patternListName: 'Starter list',
  updatedAt: '2026-12-01T00:00:00Z',
};

test('a player is told drills are for teachers, and no drill is asked for', async () => {
  const calls = fakeApi(signedInAs('player'));
  renderAt('/drills');
  expect(await screen.findByRole('heading', { name: 'Drills are for teachers' })).toBeTruthy();
  expect(calls.some((c) => c.key.includes('/api/drills'))).toBe(false);
  expect(screen.queryByRole('link', { name: 'Drills' })).toBeNull();
});

test('the drills page lists drills and opens a table from one in one click', async () => {
  const calls = fakeApi({
    ...teacher,
    'GET /api/drills': { status: 200, body: { drills: [weekOne] } },
    'POST /api/tables': { status: 201, body: { table: { id: 'table-7', name: weekOne.name } } },
  });
  const { router } = renderAt('/drills');
  expect(await screen.findByRole('heading', { name: 'Harbor Lane week 1' })).toBeTruthy();
  expect(screen.getByText('Preset tiles: east 4')).toBeTruthy();
  expect(screen.getByText(/no second Charleston/)).toBeTruthy();
  expect(screen.getByRole('link', { name: 'Download Harbor Lane week 1 as a drill file' }).getAttribute('href')).toBe('/api/drills/d1/export');
  expect(screen.getByRole('link', { name: 'Drills' })).toBeTruthy();
  await userEvent.click(screen.getByRole('button', { name: 'Open a table with this drill' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/tables/table-7'));
  expect(calls.find((c) => c.key === 'POST /api/tables')!.body).toEqual({ name: 'Harbor Lane week 1', drillId: 'd1' });
});

test('the drill form builds preset racks from tiles, sends every field and shows the server’s errors beside them', async () => {
  const calls = fakeApi({
    ...teacher,
    'GET /api/pattern-lists': { status: 200, body: { lists: [starterSummary, { ...starterSummary, id: 'l2', name: 'Tuesday list', readOnly: false, patternCount: 2 }] } },
    'POST /api/drills': {
      status: 400,
      body: {
        error: {
          code: 'BAD_INPUT',
          message: 'Some fields need another look.',
          fields: { seed: 'Give the deal a seed: any word or phrase, such as harbor-lane-week-01.', 'racks.west': "West's preset rack has 14 tiles; west holds 13. Remove 1 tile." },
        },
      },
    },
  });
  renderAt('/drills/new');
  await userEvent.type(await screen.findByLabelText('Drill name'), 'Week 2');
  await userEvent.click(screen.getByRole('button', { name: 'Add 2 bam to east, 4 left' }));
  await userEvent.click(screen.getByRole('button', { name: 'Add 2 bam to east, 3 left' }));
  await userEvent.click(screen.getByRole('button', { name: 'Add north wind to east, 4 left' }));
  expect(screen.getByRole('heading', { name: 'East starts with 3 of 14 tiles' })).toBeTruthy();
  await userEvent.click(screen.getByRole('button', { name: 'Remove north wind from east' }));
  // West: pick a seat with the keyboard-friendly radio group.
  await userEvent.click(screen.getByRole('radio', { name: /West/ }));
  await userEvent.click(screen.getByRole('button', { name: 'Add flower to west, 8 left' }));
  await userEvent.click(screen.getByLabelText(/Offer the courtesy pass/));
  await userEvent.click(screen.getByLabelText(/Deal with jokers/));
  expect((screen.getByRole('button', { name: 'Add joker to west (jokers are off)' }) as HTMLButtonElement).disabled).toBe(true);
  await waitFor(() => expect(screen.getByRole('option', { name: /Tuesday list/ })).toBeTruthy());
  await userEvent.selectOptions(screen.getByLabelText('Pattern list'), 'l2');
  await userEvent.click(screen.getByRole('button', { name: 'Make the drill' }));

  await waitFor(() => expect(screen.getByLabelText(/^Deal seed/).getAttribute('aria-invalid')).toBe('true'));
  const seed = screen.getByLabelText(/^Deal seed/);
  expect(document.getElementById(seed.getAttribute('aria-describedby')!.split(' ').pop()!)!.textContent).toContain('Give the deal a seed');
  expect(screen.getByRole('radio', { name: /West.*needs a look/ })).toBeTruthy();
  expect(screen.getByText("West's preset rack has 14 tiles; west holds 13. Remove 1 tile.")).toBeTruthy();
  expect(calls.find((c) => c.key === 'POST /api/drills')!.body).toEqual({
    name: 'Week 2',
    description: '',
    seed: '',
    jokers: false,
    secondCharleston: true,
    courtesy: false,
    racks: { east: ['bam2', 'bam2'], west: ['flower'] },
    patternListId: 'l2',
  });
});

test('an existing drill loads into the form and saves with PUT', async () => {
  const calls = fakeApi({
    ...teacher,
    'GET /api/pattern-lists': { status: 200, body: { lists: [starterSummary] } },
    'GET /api/drills/d1': { status: 200, body: { drill: weekOne } },
    'PUT /api/drills/d1': (body) => ({ status: 200, body: { drill: { ...weekOne, ...(body as object) } } }),
  });
  renderAt('/drills/d1');
  const name = (await screen.findByLabelText('Drill name')) as HTMLInputElement;
  expect(name.value).toBe('Harbor Lane week 1');
  expect(screen.getAllByRole('button', { name: /^Remove .* from east$/ })).toHaveLength(4);
  fireEvent.change(name, { target: { value: 'Harbor Lane week 1, again' } });
  await userEvent.click(screen.getByRole('button', { name: 'Save the drill' }));
  expect(await screen.findByText('Saved “Harbor Lane week 1, again”.')).toBeTruthy();
  expect(calls.find((c) => c.key === 'PUT /api/drills/d1')!.body).toMatchObject({ name: 'Harbor Lane week 1, again', racks: weekOne.racks, secondCharleston: false });
});

test('a broken drill file is refused with each problem listed', async () => {
  fakeApi({
    ...teacher,
    'GET /api/drills': { status: 200, body: { drills: [] } },
    'POST /api/drills/import': {
      status: 400,
      body: { error: { code: 'BAD_FILE', message: 'The file was not imported.', fields: { file: 'line 5, column 3: Put a comma between entries.', 'line 5, column 3': 'Put a comma between entries.', 'deal.seed': 'Give the deal a seed.' } } },
    },
  });
  renderAt('/drills');
  await screen.findByText(/No drills yet/);
  await userEvent.upload(screen.getByLabelText('Import a drill file'), new File(['{'], 'week.json', { type: 'application/json' }));
  await userEvent.click(screen.getByRole('button', { name: 'Import' }));
  const alert = await screen.findByRole('alert');
  expect(alert.textContent).toContain('line 5, column 3: Put a comma between entries.');
  expect(within(alert).getAllByRole('listitem').map((li) => li.textContent)).toEqual(['line 5, column 3: Put a comma between entries.', 'deal.seed: Give the deal a seed.']);
  expect(alert.textContent).toContain('Nothing was saved');
});

test('the pattern lists page copies the starter list and opens the copy', async () => {
  const calls = fakeApi({
    ...teacher,
    'GET /api/pattern-lists': { status: 200, body: { lists: [starterSummary] } },
    'POST /api/pattern-lists/starter/copy': { status: 201, body: { list: { ...starterSummary, id: 'l9', name: 'Copy of Starter list', readOnly: false, patterns: starterPatterns } } },
  });
  const { router } = renderAt('/pattern-lists');
  expect(await screen.findByText(`${starterPatterns.length} patterns · read-only`)).toBeTruthy();
  expect(screen.getByRole('link', { name: 'Download Starter list as CSV' }).getAttribute('href')).toBe('/api/pattern-lists/starter/export?format=csv');
  await userEvent.click(screen.getByRole('button', { name: 'Copy Starter list into a new list' }));
  await waitFor(() => expect(router.state.location.pathname).toBe('/pattern-lists/l9'));
  expect(calls.some((c) => c.key === 'POST /api/pattern-lists/starter/copy')).toBe(true);
  expect(await screen.findByRole('heading', { name: 'Pattern list: Copy of Starter list' })).toBeTruthy();
});

test('the starter list is shown read-only, each pattern as tiles', async () => {
  fakeApi({ ...teacher, 'GET /api/pattern-lists/starter': { status: 200, body: { list: { ...starterSummary, patterns: starterPatterns } } } });
  renderAt('/pattern-lists/starter');
  expect(await screen.findByRole('button', { name: 'Copy into a list of my own' })).toBeTruthy();
  expect(screen.queryByRole('button', { name: /Save/ })).toBeNull();
  expect(screen.getAllByRole('img', { name: /^Group 1: / }).length).toBeGreaterThanOrEqual(starterPatterns.length);
});

test('the pattern editor draws the pattern as tiles while it is built and puts server errors beside the group', async () => {
  const calls = fakeApi({
    ...teacher,
    'POST /api/pattern-lists': {
      status: 400,
      body: { error: { code: 'BAD_INPUT', message: 'Some patterns need another look.', fields: { 'patterns.0.groups.1.size': 'Pattern "pattern-01", group 2 of 4: A group holds at most 6 tiles (a sextet).' } } },
    },
  });
  renderAt('/pattern-lists/new');
  await userEvent.type(await screen.findByLabelText('List name'), 'Harbor Lane evens');
  expect(screen.getByText('14 of 14 tiles')).toBeTruthy();
  expect(screen.getByRole('img', { name: 'Group 2: kong of suit A, rank n, shown as 1 bam' })).toBeTruthy();
  expect(screen.getByRole('img', { name: 'Group 4: kong of suit A, rank n+2, shown as 3 bam' })).toBeTruthy();

  const group2 = screen.getByRole('group', { name: 'Group 2 of 4' });
  await userEvent.selectOptions(within(group2).getByLabelText('Suit'), 'B');
  await userEvent.selectOptions(within(group2).getByLabelText('Rank'), '6');
  expect(screen.getByRole('img', { name: 'Group 2: kong of suit B, rank 6, shown as 6 crack' })).toBeTruthy();
  await userEvent.selectOptions(within(group2).getByLabelText('Size'), '5');
  expect(screen.getByText('15 of 14 tiles')).toBeTruthy();
  expect(screen.getByText(/remove 1/)).toBeTruthy();
  await userEvent.selectOptions(within(group2).getByLabelText('Made of'), 'dragon');
  expect(screen.getByRole('img', { name: 'Group 2: quint of the dragon matching suit B, shown as red dragon' })).toBeTruthy();

  await userEvent.click(screen.getByRole('button', { name: 'Make the list' }));
  const size = within(screen.getByRole('group', { name: 'Group 2 of 4' })).getByLabelText('Size');
  await waitFor(() => expect(size.getAttribute('aria-invalid')).toBe('true'));
  expect(document.getElementById(size.getAttribute('aria-describedby')!)!.textContent).toContain('group 2 of 4: A group holds at most 6 tiles');
  const sent = calls.find((c) => c.key === 'POST /api/pattern-lists')!.body as { name: string; patterns: { groups: unknown[] }[] };
  expect(sent.name).toBe('Harbor Lane evens');
  expect(sent.patterns[0].groups[1]).toEqual({ size: 5, dragon: 'match', suit: 'B' });
});

test('the pattern editor sets a value and the sealed mark, sent in today\'s field names; a list shows both', async () => {
  const calls = fakeApi({ ...teacher, 'POST /api/pattern-lists': { status: 400, body: { error: { code: 'BAD_INPUT', message: 'Look again.', fields: { 'patterns.0.value': 'A value is a whole number from 0 to 1000.' } } } } });
  renderAt('/pattern-lists/new');
  await userEvent.type(await screen.findByLabelText('List name'), 'Harbor Lane sealed');
  const sealed = screen.getByRole('checkbox', { name: /^Sealed/ });
  expect(sealed.closest('label')!.textContent).toBe('SealedBuild it from your own draws, no calls.');
  expect(screen.queryByText(/concealed/i)).toBeNull();
  await userEvent.click(sealed);
  const value = screen.getByLabelText('Value');
  await userEvent.clear(value);
  await userEvent.type(value, '65');
  await userEvent.click(screen.getByRole('button', { name: 'Make the list' }));
  await waitFor(() => expect(value.getAttribute('aria-invalid')).toBe('true'));
  const sent = calls.find((c) => c.key === 'POST /api/pattern-lists')!.body as { patterns: Record<string, unknown>[] };
  expect(sent.patterns[0]).toMatchObject({ value: 65, sealed: true });
  expect(sent.patterns[0]).not.toHaveProperty('points');
  expect(sent.patterns[0]).not.toHaveProperty('concealed');

  const shown = { ...starterSummary, patterns: [{ ...starterPatterns[0], id: 'x-01', name: 'Shown sealed', value: 85, sealed: true }] };
  fakeApi({ ...teacher, 'GET /api/pattern-lists/starter': { status: 200, body: { list: shown } } });
  renderAt('/pattern-lists/starter');
  const heading = await screen.findByRole('heading', { name: /^Shown sealed/ });
  expect(heading.textContent).toBe(`Shown sealed · ${starterPatterns[0].family} · value 85 · sealed: build it from your own draws, no calls`);
});

test('a pattern-list upload shows the line at fault', async () => {
  const calls = fakeApi({
    ...teacher,
    'GET /api/pattern-lists': { status: 200, body: { lists: [starterSummary] } },
    'POST /api/pattern-lists/import': {
      status: 400,
      body: { error: { code: 'BAD_FILE', message: 'x', fields: { file: 'line 7, column size: Pattern "harbor-01", group 2 of 5: A group holds at most 6 tiles (a sextet).' } } },
    },
  });
  renderAt('/pattern-lists');
  await screen.findByText(`${starterPatterns.length} patterns · read-only`);
  await userEvent.upload(screen.getByLabelText('Import a pattern list'), new File(['rackside-pattern-list,1'], 'harbor.csv', { type: 'text/csv' }));
  await userEvent.click(screen.getByRole('button', { name: 'Import' }));
  expect((await screen.findByRole('alert')).textContent).toContain('line 7, column size: Pattern "harbor-01", group 2 of 5');
  expect(calls.find((c) => c.key === 'POST /api/pattern-lists/import')!.body).toEqual({ file: 'harbor.csv' });
});

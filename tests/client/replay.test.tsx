import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeAll, expect, test } from 'vitest';
import { replay } from '../../shared/exchange';
import { replaySteps } from '../../src/features/replay/replay-steps';
import { fakeApi, renderAt, signedInAs } from './render';
import { finishedReplay } from './fake-table';

const dto = finishedReplay();

// The replay route loads recharts on first use; load it once here so no test pays for it.
beforeAll(async () => {
  await import('../../src/features/replay/routes/ReplayPage');
}, 30_000);
const answers = { ...signedInAs('player'), 'GET /api/exchanges/x1/replay': { status: 200, body: { replay: { ...dto, final: undefined } } } };
const stepText = () => screen.getByText(/^Step \d+ of \d+:/).textContent;

test('every step is the state the shared replay gives for that much of the log', () => {
  const steps = replaySteps(dto);
  expect(steps.map((s) => s.title)).toEqual([
    'The deal',
    'After the first Charleston, pass right',
    'After the first Charleston, pass across',
    'After the first Charleston, pass left',
    'The table stopped after the first Charleston',
    'Courtesy asks settled',
  ]);
  for (const step of steps) expect(step.state).toEqual(replay(dto.options, dto.log.slice(0, step.at)));
  expect(steps.at(-1)!.state.phase).toBe('done');
});

test('the stepper moves pass by pass with its buttons and the arrow keys', async () => {
  fakeApi(answers);
  renderAt('/replays/x1');
  await screen.findByRole('heading', { name: 'Replay: Harbor Lane Tuesday' });
  expect(stepText()).toBe('Step 0 of 5: The deal');
  expect((screen.getByRole('button', { name: '← Previous step' }) as HTMLButtonElement).disabled).toBe(true);
  await userEvent.click(screen.getByRole('button', { name: 'Next step →' }));
  expect(stepText()).toBe('Step 1 of 5: After the first Charleston, pass right');
  await userEvent.keyboard('{ArrowRight}');
  expect(stepText()).toBe('Step 2 of 5: After the first Charleston, pass across');
  await userEvent.keyboard('{ArrowLeft}');
  expect(stepText()).toContain('Step 1 of 5');
  await userEvent.keyboard('{End}');
  expect(stepText()).toContain('Step 5 of 5');
  await userEvent.keyboard('{Home}');
  expect(stepText()).toContain('Step 0 of 5');
});

test('each step shows every rack, what moved where, the notes for that pass, and the analysis', async () => {
  fakeApi(answers);
  const { router } = renderAt('/replays/x1?step=1');
  await screen.findByRole('heading', { name: 'Replay: Harbor Lane Tuesday' });
  for (const name of ['Ruth Adeyemi', 'Coach (bot)', 'Theo Brandt', 'Pair keeper (bot)']) expect(screen.getByRole('group', { name: `Rack of ${name}` })).toBeTruthy();
  expect(screen.getByRole('img', { name: 'East sent 3 to south; South sent 3 to west; West sent 3 to north; North sent 3 to east' })).toBeTruthy();
  expect(within(screen.getByRole('region', { name: 'East: Ruth Adeyemi' })).getAllByRole('button', { name: /just received/ })).toHaveLength(3);
  expect(screen.getByText(/Theo kept both flowers here/)).toBeTruthy();
  expect(screen.getAllByText(/^Nearest:/)).toHaveLength(4);
  await userEvent.keyboard('{ArrowRight}{ArrowRight}');
  await waitFor(() => expect(router.state.location.search).toBe('?step=3'));
  expect(screen.queryByText(/Theo kept both flowers/)).toBeNull();
  expect(screen.getByRole('img', { name: /North sent 3 to west \(1 blind\)/ })).toBeTruthy();
});

test('the chart has its numbers in a table too', async () => {
  fakeApi(answers);
  renderAt('/replays/x1');
  await screen.findByRole('heading', { name: 'Replay: Harbor Lane Tuesday' });
  const table = screen.getByRole('table', { name: 'Tiles away per seat at each step' });
  expect(within(table).getAllByRole('row')).toHaveLength(1 + 6);
});

test('a replay the viewer may not open says why', async () => {
  fakeApi({ ...signedInAs('player'), 'GET /api/exchanges/x2/replay': { status: 403, body: { error: { code: 'FORBIDDEN', message: 'Only the players, the host and admins can replay this exchange.' } } } });
  renderAt('/replays/x2');
  expect((await screen.findByRole('alert')).textContent).toContain('Only the players');
});

test('the replay judges every rack by the table’s own pattern list, not the starter list', async () => {
  // A one-pattern list of the table's own: every "Nearest" names it.
  const own = { id: 'l1', name: 'Ruth’s list', patterns: [{ ...dto.patternList.patterns[0], id: 'own-1', name: 'Ruth’s only hand' }] };
  fakeApi({ ...answers, 'GET /api/exchanges/x1/replay': { status: 200, body: { replay: { ...dto, final: undefined, patternList: own } } } });
  renderAt('/replays/x1');
  await screen.findByRole('heading', { name: 'Replay: Harbor Lane Tuesday' });
  const nearest = screen.getAllByText(/^Nearest:/);
  expect(nearest).toHaveLength(4);
  for (const line of nearest) expect(line.textContent).toContain('Ruth’s only hand');
});

test('the replay shows each seat’s odds of finishing at every step', async () => {
  fakeApi(answers);
  renderAt('/replays/x1');
  await screen.findByRole('heading', { name: 'Replay: Harbor Lane Tuesday' });
  const table = await screen.findByRole('region', { name: 'Odds by step' }, { timeout: 10_000 });
  // One row a step, one figure a seat.
  expect(within(table).getAllByRole('row')).toHaveLength(1 + replaySteps(dto).length);
  expect(within(table).getAllByRole('cell').every((c) => /^(\d+%|under 1%)$/.test(c.textContent ?? ''))).toBe(true);
  expect(screen.getAllByText(/^Odds of finishing/).length).toBeGreaterThanOrEqual(4);
});

import { act as reactAct, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, expect, test, vi } from 'vitest';
import { act, createExchange, viewFor } from '../../shared/exchange';
import type { TableStateDto } from '../../shared/protocol';
import { useTableStore } from '../../src/features/table/api/table-store';
import { fakeApi, renderAt, signedInAs } from './render';
import { fresh, must, OPTIONS, passAll, tableState } from './fake-table';

const socket = vi.hoisted(() => ({
  send: vi.fn(async (..._args: unknown[]) => ({ ok: true }) as const),
  joinTable: vi.fn(async () => ({ ok: true }) as const),
  leaveTable: vi.fn(),
}));
vi.mock('../../src/features/table/api/socket', () => socket);

beforeEach(() => {
  // Picks are kept in the tab per table and step; every test starts a fresh tab.
  sessionStorage.clear();
  useTableStore.getState().reset();
  socket.send.mockClear();
  socket.joinTable.mockClear();
});

async function showTable(state: TableStateDto) {
  fakeApi(signedInAs('player'));
  const utils = renderAt('/tables/t1');
  await waitFor(() => expect(socket.joinTable).toHaveBeenCalledWith('t1', undefined));
  reactAct(() => useTableStore.getState().stateArrived(state));
  await screen.findByRole('heading', { name: state.name });
  return utils;
}
const push = (state: TableStateDto) => reactAct(() => useTableStore.getState().stateArrived(state));
const lastSend = () => socket.send.mock.calls.at(-1);

test('in the lobby a player sits at an empty seat; the host seats a bot and starts only when all four are filled', async () => {
  const lobby = tableState(null, null, { isHost: true });
  lobby.seats.north.occupant = null;
  await showTable(lobby);
  await userEvent.click(await screen.findByRole('button', { name: 'Sit at north' }));
  expect(lastSend()).toEqual(['table:sit', { seat: 'north' }]);
  expect((screen.getByRole('button', { name: 'Deal and start the Charleston' }) as HTMLButtonElement).disabled).toBe(true);
  await userEvent.selectOptions(screen.getByLabelText('Bot for north'), 'multiples');
  await userEvent.click(screen.getByRole('button', { name: 'Seat a bot at north' }));
  expect(lastSend()).toEqual(['table:bot', { seat: 'north', strategy: 'multiples' }]);
});

test('the first pass is drawn as an arrow to the right, and three picked tiles are sent with the version', async () => {
  await showTable(tableState(fresh(), 'west', {}, 7));
  expect(screen.getByRole('img', { name: 'Pass 3 to your right (north)' })).toBeTruthy();
  const rack = screen.getByRole('group', { name: 'Your rack' });
  const send = screen.getByRole('button', { name: 'Send 3 tiles' }) as HTMLButtonElement;
  expect(send.disabled).toBe(true);
  const tiles = within(rack).getAllByRole('button').filter((b) => !b.getAttribute('aria-label')!.startsWith('joker'));
  for (const tile of tiles.slice(0, 3)) await userEvent.click(tile);
  expect(screen.getByText('Ready to send. Press Enter on the rack or the button.')).toBeTruthy();
  await userEvent.click(send);
  const [event, payload] = lastSend()!;
  expect(event).toBe('exchange:act');
  expect(payload).toEqual({ action: { type: 'pass', tiles: tiles.slice(0, 3).map((t) => t.dataset.tileId) }, version: 7 });
});

test('the table refuses a joker and says why', async () => {
  const state = createExchange({ seed: OPTIONS.seed, racks: { east: ['joker', 'bam1', 'bam2', 'bam3', 'dot1', 'dot2', 'dot3', 'crack1', 'crack2', 'crack3', 'flower', 'wind-n', 'wind-e', 'wind-s'] } });
  await showTable(tableState(state, 'east'));
  await userEvent.click(screen.getByRole('button', { name: "joker, can't be passed" }));
  expect(screen.getByText("Jokers can't be passed. Pick another tile.")).toBeTruthy();
  expect(within(screen.getByRole('group', { name: 'Your rack' })).queryAllByRole('button', { pressed: true })).toHaveLength(0);
});

test('committed seats show as ready, and my own committed pass can be taken back', async () => {
  let state = fresh();
  const mine = state.racks.south.filter((t) => t.kind !== 'joker').slice(0, 3).map((t) => t.id);
  state = must(act(state, 'south', { type: 'pass', tiles: mine }));
  state = must(act(state, 'east', { type: 'pass', tiles: state.racks.east.filter((t) => t.kind !== 'joker').slice(0, 3).map((t) => t.id) }));
  await showTable(tableState(state, 'south', {}, 3));
  expect(within(screen.getByRole('region', { name: /^East/ })).getByText('Ready')).toBeTruthy();
  expect(within(screen.getByRole('region', { name: /^West/ })).getByText('Choosing')).toBeTruthy();
  expect(screen.getAllByRole('button', { name: /in your committed pass/ })).toHaveLength(3);
  expect(screen.getByText(/Waiting for 2 more seats/)).toBeTruthy();
  await userEvent.click(screen.getByRole('button', { name: 'Take back my choice' }));
  expect(lastSend()).toEqual(['exchange:act', { action: { type: 'withdraw' }, version: 3 }]);
});

test('tiles that arrive are marked and announced with where they came from', async () => {
  const before = fresh();
  await showTable(tableState(before, 'east', {}, 1));
  const after = passAll(before);
  push(tableState(after, 'east', {}, 2));
  // East receives the first-right pass from north, its left.
  const news = await screen.findByText(/^You received 3 tiles from your left \(north\): /);
  expect(news.getAttribute('role')).toBe('status');
  expect(screen.getAllByRole('button', { name: /just received/ })).toHaveLength(3);
  expect(screen.getByRole('img', { name: 'Pass 3 across (west)' })).toBeTruthy();
});

test('blind passing is offered only on the last pass of a Charleston, and sends fewer own tiles', async () => {
  let state = passAll(fresh());
  await showTable(tableState(state, 'north', {}, 2));
  expect(screen.queryByRole('group', { name: /Pass any tiles blind/ })).toBeNull();
  state = passAll(state);
  push(tableState(state, 'north', {}, 3));
  expect(await screen.findByRole('group', { name: /Pass any tiles blind/ })).toBeTruthy();
  await userEvent.click(screen.getByRole('radio', { name: '2 blind' }));
  const tiles = within(screen.getByRole('group', { name: 'Your rack' })).getAllByRole('button').filter((b) => !b.getAttribute('aria-label')!.startsWith('joker'));
  await userEvent.click(tiles[0]);
  await userEvent.click(tiles[1]);
  expect(within(screen.getByRole('group', { name: 'Your rack' })).getAllByRole('button', { pressed: true })).toHaveLength(1);
  await userEvent.click(screen.getByRole('button', { name: 'Send 3 tiles' }));
  expect(lastSend()).toEqual(['exchange:act', { action: { type: 'pass', tiles: [tiles[0].dataset.tileId], blind: 2 }, version: 3 }]);
});

test('the stop vote is two clear choices', async () => {
  const state = passAll(passAll(passAll(fresh())));
  expect(state.phase).toBe('vote');
  await showTable(tableState(state, 'east', {}, 4));
  expect(screen.getByRole('button', { name: 'Play a second Charleston' })).toBeTruthy();
  await userEvent.click(screen.getByRole('button', { name: 'Stop after this round' }));
  expect(lastSend()).toEqual(['exchange:act', { action: { type: 'vote', stop: true }, version: 4 }]);
});

test('the courtesy ask is a choice of 0 to 3 tiles', async () => {
  const state = must(act(passAll(passAll(passAll(fresh()))), 'south', { type: 'vote', stop: true }));
  expect(state.phase).toBe('courtesy-ask');
  await showTable(tableState(state, 'east', {}, 5));
  expect(screen.getAllByRole('radio')).toHaveLength(4);
  await userEvent.click(screen.getByRole('radio', { name: '2 tiles' }));
  await userEvent.click(screen.getByRole('button', { name: 'Ask for 2 tiles' }));
  expect(lastSend()).toEqual(['exchange:act', { action: { type: 'courtesy-ask', count: 2 }, version: 5 }]);
});

test('a held pass shows players a banner and the revealed rack; the host gets the controls', async () => {
  const state = fresh();
  const revealed = { west: { rack: state.racks.west, pass: { tiles: state.racks.west.slice(0, 3).map((t) => t.id), blind: 0 } } };
  const huddle = { open: true, revealed, notes: [{ id: 1, passIndex: 0, phase: 'first-right' as const, seat: 'west' as const, authorName: 'Ruth Adeyemi', text: 'Why break the pair of dots?', createdAt: '' }] };
  await showTable(tableState(state, 'south', { huddle }));
  expect(screen.getByRole('heading', { name: /This pass is on hold/ })).toBeTruthy();
  expect(screen.getByText(/may take back your pass/)).toBeTruthy();
  expect(screen.getByRole('group', { name: 'Rack of Theo Brandt' })).toBeTruthy();
  expect(screen.getByText(/Why break the pair of dots/)).toBeTruthy();
  expect(screen.queryByRole('button', { name: 'Let the pass go' })).toBeNull();

  push(tableState(state, 'east', { huddle }, 2));
  await userEvent.click(await screen.findByRole('button', { name: 'Show north' }));
  expect(lastSend()).toEqual(['huddle:reveal', { seat: 'north' }]);
  await userEvent.type(screen.getByLabelText('Note for the table'), 'Keep the flowers.');
  await userEvent.click(screen.getByRole('button', { name: 'Add note' }));
  expect(lastSend()).toEqual(['huddle:note', { text: 'Keep the flowers.', seat: undefined }]);
  await userEvent.click(screen.getByRole('button', { name: 'Let the pass go' }));
  expect(lastSend()).toEqual(['huddle:release', {}]);
});

test('advice sits beside the rack and can be hidden, or is hidden by the host for the table', async () => {
  await showTable(tableState(fresh(), 'west'));
  expect(screen.getByRole('heading', { name: 'Nearest patterns' })).toBeTruthy();
  expect(screen.getByRole('heading', { name: 'Advised passes' })).toBeTruthy();
  // Worked out off the page's thread: the choices arrive a moment later.
  expect((await screen.findAllByRole('img', { name: /^Choice \d: pass / }, { timeout: 10_000 })).length).toBeGreaterThan(1);
  await userEvent.click(screen.getByRole('button', { name: 'Hide advice' }));
  expect(screen.getByText(/Advice is hidden/)).toBeTruthy();
  push(tableState(fresh(), 'west', { options: { ...OPTIONS, hideAdvice: true } }, 2));
  expect(await screen.findByText(/The host has hidden advice/)).toBeTruthy();
});

test('chat messages appear in a log and the box sends', async () => {
  await showTable(tableState(fresh(), 'west'));
  reactAct(() => useTableStore.getState().chatArrived({ id: 'm1', tableId: 't1', userId: 1, displayName: 'Ruth Adeyemi', seat: 'east', text: 'Good luck all', at: '' }));
  expect(within(screen.getByRole('log')).getByText(/Good luck all/)).toBeTruthy();
  await userEvent.type(screen.getByLabelText('Message to the table'), 'Thanks!');
  await userEvent.click(screen.getByRole('button', { name: 'Send' }));
  expect(lastSend()).toEqual(['chat:send', { text: 'Thanks!' }]);
});

test('an older state never replaces a newer one', () => {
  const store = useTableStore.getState();
  store.stateArrived(tableState(fresh(), 'east', {}, 5));
  store.stateArrived(tableState(null, 'east', {}, 4));
  expect(useTableStore.getState().table?.version).toBe(5);
});

test('once a tab joins a table, states of another table are ignored', () => {
  const store = useTableStore.getState();
  store.watch('t2');
  store.stateArrived(tableState(fresh(), 'east', {}, 9));
  expect(useTableStore.getState().table).toBeNull();
  store.stateArrived({ ...tableState(fresh(), 'east', {}, 1), tableId: 't2' });
  expect(useTableStore.getState().table?.tableId).toBe('t2');
});

test('a seat whose pair agreed on no courtesy tiles is told it has nothing to send', async () => {
  let state = must(act(passAll(passAll(passAll(fresh()))), 'south', { type: 'vote', stop: true }));
  const asks = { east: 0, west: 0, south: 2, north: 3 } as const;
  for (const seat of ['east', 'south', 'west', 'north'] as const) state = must(act(state, seat, { type: 'courtesy-ask', count: asks[seat] }));
  expect(state.phase).toBe('courtesy-pass');
  await showTable(tableState(state, 'east', {}, 6));
  expect(screen.getByText(/Your pair agreed on no tiles/)).toBeTruthy();
  push(tableState(state, 'south', {}, 7));
  expect(await screen.findByRole('button', { name: 'Send 2 tiles' })).toBeTruthy();
});

test('when the Charleston is over the table links to its replay', async () => {
  let state = passAll(passAll(passAll(fresh())));
  state = must(act(state, 'south', { type: 'vote', stop: true }));
  for (const seat of ['east', 'south', 'west', 'north'] as const) state = must(act(state, seat, { type: 'courtesy-ask', count: 0 }));
  expect(state.phase).toBe('done');
  await showTable(tableState(state, 'east', {}, 9));
  expect(screen.getByRole('link', { name: 'Replay this exchange pass by pass' }).getAttribute('href')).toBe('/replays/x1');
});

test('the vote shows every seat’s vote as it comes, and afterwards who stopped', async () => {
  let s = passAll(passAll(passAll(fresh())));
  s = must(act(s, 'west', { type: 'vote', stop: false }));
  await showTable(tableState(s, 'west'));
  const tally = screen.getByRole('list', { name: 'Votes so far' });
  expect(within(tally).getByText('West (you):').nextSibling!.textContent).toBe('go on');
  expect(within(tally).getByText('North (bot):').nextSibling!.textContent).toBe('not voted yet');
  push(tableState(must(act(s, 'north', { type: 'vote', stop: true })), 'west', {}, 2));
  expect(await screen.findByText('North (bot) voted to stop: no second Charleston.')).toBeTruthy();
});

test('at the end the host deals again or closes the table; a player is told the host deals the next one', async () => {
  let s = passAll(passAll(passAll(fresh())));
  s = must(act(s, 'south', { type: 'vote', stop: true }));
  for (const seat of ['east', 'south', 'west', 'north'] as const) s = must(act(s, seat, { type: 'courtesy-ask', count: 0 }));
  expect(s.phase).toBe('done');
  await showTable(tableState(s, 'east', { isHost: true }));
  await userEvent.click(screen.getByRole('button', { name: 'Deal again' }));
  expect(lastSend()).toEqual(['table:start', {}]);
  await userEvent.click(screen.getByRole('button', { name: 'Close the table' }));
  expect(lastSend()).toEqual(['table:close', {}]);
  push(tableState(s, 'west', { isHost: false }, 3));
  expect(await screen.findByText('The same seats play the next deal when the host deals again.')).toBeTruthy();
  expect(screen.queryByRole('button', { name: 'Deal again' })).toBeNull();
});

test('a spectator sees compass names on the seats, never “you” or “your left”', async () => {
  const watching: TableStateDto = { ...tableState(fresh(), 'east'), mySeat: null, myRack: [], isHost: false, view: viewFor(fresh(), 'spectator') };
  await showTable(watching);
  const top = screen.getByRole('group', { name: 'The table, seen from above' });
  expect(within(top).queryByText(/you/i)).toBeNull();
  expect(within(top).getByText('East')).toBeTruthy();
});

test('a message said during one pass is gone when the next pass begins', async () => {
  const first = fresh();
  await showTable(tableState(first, 'west', {}, 1));
  const rack = screen.getByRole('group', { name: 'Your rack' });
  const tiles = within(rack).getAllByRole('button').filter((b) => !b.getAttribute('aria-label')!.startsWith('joker'));
  for (const tile of tiles.slice(0, 4)) await userEvent.click(tile);
  expect(screen.getByText(/You have picked 3 already/)).toBeTruthy();
  push(tableState(passAll(first), 'west', {}, 2));
  await waitFor(() => expect(screen.queryByText(/You have picked 3 already/)).toBeNull());
});

test('picks of a pass survive leaving the page and coming back until the pass resolves', async () => {
  sessionStorage.clear();
  const state = tableState(fresh(), 'west', {}, 4);
  const first = await showTable(state);
  const tiles = () => within(screen.getByRole('group', { name: 'Your rack' })).getAllByRole('button').filter((b) => !b.getAttribute('aria-label')!.startsWith('joker'));
  await userEvent.click(tiles()[0]);
  await userEvent.click(tiles()[1]);
  const chosen = tiles().slice(0, 2).map((t) => t.dataset.tileId);
  first.unmount();
  useTableStore.getState().reset();

  await showTable(state);
  const pressed = tiles().filter((t) => t.getAttribute('aria-pressed') === 'true').map((t) => t.dataset.tileId);
  expect(pressed.sort()).toEqual(chosen.sort());
  // Once the pass has resolved, the old picks are gone.
  push(tableState(passAll(fresh()), 'west', {}, 5));
  await waitFor(() => expect(tiles().filter((t) => t.getAttribute('aria-pressed') === 'true')).toHaveLength(0));
});

test('the host can hand an away player’s seat to a bot, and the player returning is offered the seat back', async () => {
  const playing = tableState(fresh(), 'east', { isHost: true });
  playing.seats.west.occupant = { kind: 'user', userId: 2, displayName: 'Theo Brandt', connected: false, awaySince: '2026-12-01T18:00:00Z' };
  await showTable(playing);
  await userEvent.click(screen.getByRole('button', { name: 'Hand the west seat to a bot' }));
  expect(lastSend()).toEqual(['table:bot', { seat: 'west', strategy: 'advised' }]);

  // Ruth (user 1, signed in) comes back to find a bot keeping her seat.
  const back: TableStateDto = { ...tableState(fresh(), 'east'), mySeat: null, myRack: [], isHost: false, view: viewFor(fresh(), 'spectator') };
  back.seats.east.occupant = { kind: 'bot', strategy: 'advised', displayName: 'Coach (bot, for Ruth Adeyemi)', standsInFor: { userId: 1, displayName: 'Ruth Adeyemi' } };
  push({ ...back, version: 9 });
  await userEvent.click(await screen.findByRole('button', { name: 'Take back your seat' }));
  expect(lastSend()).toEqual(['table:sit', { seat: 'east' }]);
});

test('the panel says where to lean, with odds, pros and drawbacks apart, and “Pick these” picks an advised pass on the rack', async () => {
  await showTable(tableState(fresh(), 'west'));
  const first = (await screen.findAllByRole('img', { name: /^Choice 1: pass / }, { timeout: 10_000 }))[0];
  const choice = first.closest('li')!;
  expect(within(choice).getByText(/Odds of finishing/)).toBeTruthy();
  expect(within(choice).getAllByText(/^(For|Against|Risk):$/).length).toBeGreaterThan(0);
  expect(screen.getByRole('heading', { name: 'Where to lean' })).toBeTruthy();
  expect(screen.getAllByText(/to finish$/).length).toBeGreaterThan(0);
  expect(screen.getByText('What the words mean')).toBeTruthy();
  await userEvent.click(within(choice).getByRole('button', { name: /^Pick these/ }));
  const rack = screen.getByRole('group', { name: 'Your rack' });
  await waitFor(() => expect(within(rack).getAllByRole('button', { pressed: true })).toHaveLength(3));
  expect(screen.getByText('Ready to send. Press Enter on the rack or the button.')).toBeTruthy();
});

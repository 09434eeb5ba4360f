import { expect, test } from 'vitest';
import { act, createExchange, resolve, viewFor, type ExchangeState } from '../../../shared/exchange';
import { SEATS, type Seat } from '../../../shared/seats';
import { advanceTo, askAll, commitAll, firstPassable, must, passAll } from './helpers';

const seed = 'harbor-lane-week-01';
const start = () => createExchange({ seed });
const othersOf = (seat: Seat) => SEATS.filter((s) => s !== seat);
const ids = (state: ExchangeState, seat: Seat) => state.racks[seat].map((tile) => tile.id);

test('a seat sees its own rack', () => {
  const state = start();
  expect(viewFor(state, 'south').racks).toEqual({ south: state.racks.south });
});

test('a seat never sees another rack', () => {
  const state = passAll(start());
  const seen = JSON.stringify(viewFor(state, 'south'));
  for (const seat of othersOf('south')) {
    const unknown = ids(state, seat).filter((id) => !state.history[0].sent.south.includes(id));
    expect(unknown.length).toBeGreaterThan(0);
    for (const id of unknown) expect(seen).not.toContain(`"${id}"`);
  }
});

test('a seat sees the rack size of every seat', () => {
  const view = viewFor(start(), 'west');
  expect(SEATS.map((seat) => view.seats[seat].rackSize)).toEqual([14, 13, 13, 13]);
});

test('a seat sees who has committed, but not what', () => {
  const state = must(act(start(), 'east', { type: 'pass', tiles: firstPassable(start(), 'east') }));
  const view = viewFor(state, 'north');
  expect(view.seats.east.committed).toBe(true);
  expect(view.seats.north.committed).toBe(false);
  expect(view.pending).toEqual({});
  expect(viewFor(state, 'east').pending).toEqual({ east: state.pending.east });
});

test('a seat sees what it received once the pass resolves', () => {
  const before = commitAll(start());
  const after = must(resolve(before));
  const view = viewFor(after, 'south');
  expect(view.received.south!.map((tile) => tile.id)).toEqual(before.pending.east!.tiles);
  expect(view.received.south!.map((tile) => tile.kind)).toEqual(
    before.pending.east!.tiles.map((id) => before.racks.east.find((tile) => tile.id === id)!.kind),
  );
  expect(Object.keys(view.received)).toEqual(['south']);
});

test('a seat never sees the seed, the wall or the options', () => {
  const state = createExchange({ seed: 'secret-seed-xyz', racks: { east: ['bam1'] } });
  for (const viewer of [...SEATS, 'host', 'spectator', 'replay'] as const) {
    const view = viewFor(state, viewer);
    expect(JSON.stringify(view)).not.toContain('secret-seed-xyz');
    expect(view).not.toHaveProperty('wall');
    expect(view).not.toHaveProperty('options');
    expect(view).not.toHaveProperty('log');
  }
});

test('a seat’s history holds its own sent and received tiles only', () => {
  const state = passAll(start());
  const record = viewFor(state, 'west').history[0];
  expect(record.sent.west).toEqual(state.history[0].sent.west);
  expect(record.received.west).toEqual(state.history[0].received.west);
  for (const seat of othersOf('west')) {
    expect(record.sent[seat]).toEqual([]);
    expect(record.received[seat]).toEqual([]);
  }
});

test('a seat never sees the tiles it forwarded blind, in the view or its history', () => {
  const state = must(resolve(commitAll(advanceTo(start(), 'first-left'), { north: 3, west: 1 })));
  for (const seat of ['north', 'west'] as const) {
    const seen = JSON.stringify(viewFor(state, seat));
    expect(state.history[2].forwarded[seat].length).toBeGreaterThan(0);
    for (const id of state.history[2].forwarded[seat]) expect(seen).not.toContain(`"${id}"`);
    expect(viewFor(state, seat).history[2].forwarded[seat]).toEqual([]);
  }
  expect(viewFor(state, 'north').history[2].blind.north).toBe(3);
});

test('the kinds legend names exactly the tiles the view mentions', () => {
  const state = passAll(start());
  const view = viewFor(state, 'east');
  const mentioned = new Set([...ids(state, 'east'), ...state.history[0].sent.east]);
  expect(new Set(Object.keys(view.kinds))).toEqual(mentioned);
});

test('a seat sees its pass size and whether blind is allowed', () => {
  expect(viewFor(start(), 'east')).toMatchObject({ passSize: 3, blindAllowed: false });
  expect(viewFor(advanceTo(start(), 'first-left'), 'east')).toMatchObject({ passSize: 3, blindAllowed: true });
  expect(viewFor(advanceTo(start(), 'vote'), 'east')).toMatchObject({ passSize: 0, blindAllowed: false });
});

test('every vote is seen as it comes, by every seat and spectator', () => {
  let state = advanceTo(start(), 'vote');
  state = must(act(state, 'east', { type: 'vote', stop: false }));
  expect(viewFor(state, 'south').votes).toEqual({ east: false });
  expect(viewFor(state, 'spectator').votes).toEqual({ east: false });
  expect(viewFor(state, 'host').votes).toEqual({ east: false });
  state = must(act(state, 'south', { type: 'vote', stop: true }));
  expect(viewFor(state, 'west').votes).toEqual({ east: false, south: true });
});

test('other seats’ courtesy asks stay hidden until the asks settle', () => {
  let state = advanceTo(createExchange({ seed, secondCharleston: false }), 'courtesy-ask');
  state = must(act(state, 'east', { type: 'courtesy-ask', count: 2 }));
  expect(viewFor(state, 'west').asks).toEqual({});
  expect(viewFor(state, 'east').asks).toEqual({ east: 2 });
  state = askAll(advanceTo(createExchange({ seed, secondCharleston: false }), 'courtesy-ask'), { east: 2, south: 1, west: 3, north: 0 });
  expect(viewFor(state, 'west').asks).toEqual({ east: 2, south: 1, west: 3, north: 0 });
  expect(viewFor(state, 'west').agreed).toEqual({ east: 2, south: 0, west: 2, north: 0 });
  expect(viewFor(state, 'west').passSize).toBe(2);
  expect(viewFor(state, 'south').seats.south.committed).toBe(true);
});

test('the host sees every rack, pass and forwarded tile', () => {
  const before = commitAll(advanceTo(start(), 'first-left'), { south: 2 });
  expect(viewFor(before, 'host').racks).toEqual(before.racks);
  expect(viewFor(before, 'host').pending).toEqual(before.pending);
  const after = must(resolve(before));
  expect(viewFor(after, 'host').history).toEqual(after.history);
  expect(viewFor(after, 'host').passSize).toBe(0);
});

test('the replay view sees everything the host sees', () => {
  const state = advanceTo(start(), 'done');
  expect({ ...viewFor(state, 'replay'), viewer: 'host' }).toEqual(viewFor(state, 'host'));
  expect(viewFor(state, 'replay').history).toEqual(state.history);
});

test('a spectator sees counts only', () => {
  const state = must(act(passAll(start()), 'east', { type: 'pass', tiles: firstPassable(passAll(start()), 'east') }));
  const view = viewFor(state, 'spectator');
  expect(view.racks).toEqual({});
  expect(view.pending).toEqual({});
  expect(view.received).toEqual({});
  expect(view.kinds).toEqual({});
  expect(view.votes).toEqual({});
  expect(view.seats.east).toEqual({ rackSize: 14, committed: true });
  expect(view.history[0].sent).toEqual({ east: [], south: [], west: [], north: [] });
});

test('a view is plain JSON and a copy', () => {
  const state = passAll(start());
  const view = viewFor(state, 'host');
  expect(JSON.parse(JSON.stringify(view))).toStrictEqual(view);
  view.racks.east!.pop();
  view.history[0].sent.east.pop();
  expect(state.racks.east).toHaveLength(14);
  expect(state.history[0].sent.east).toHaveLength(3);
});

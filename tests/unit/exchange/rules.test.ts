import { expect, test } from 'vitest';
import { act, canResolve, createExchange, resolve, type Action, type ExchangeState } from '../../../shared/exchange';
import { SEATS } from '../../../shared/seats';
import { advanceTo, commitAll, deepFreeze, firstPassable, jokerOf, must, passAll } from './helpers';

const seed = 'harbor-lane-week-01';
/** East is sure to hold a joker. */
const start = () => deepFreeze(createExchange({ seed, racks: { east: ['joker'] } }));

function refused(state: ExchangeState, seat: Parameters<typeof act>[1], action: Action) {
  const before = JSON.stringify(state);
  const result = act(state, seat, action);
  expect(JSON.stringify(state)).toBe(before);
  if (result.ok) throw new Error('expected a refusal');
  return result;
}

test('three tiles from the rack make a pass', () => {
  const state = start();
  const next = must(act(state, 'south', { type: 'pass', tiles: firstPassable(state, 'south') }));
  expect(next.pending.south).toEqual({ tiles: firstPassable(state, 'south'), blind: 0 });
});

test('committing moves no tile', () => {
  const state = commitAll(start());
  expect(state.racks).toEqual(start().racks);
});

test('a pass right sends each seat’s tiles to the next seat in turn order', () => {
  const state = commitAll(start());
  const next = must(resolve(state));
  expect(next.history[0].received.south).toEqual(state.pending.east!.tiles);
  expect(next.history[0].received.east).toEqual(state.pending.north!.tiles);
  expect(next.racks.south.map((t) => t.id)).toEqual(expect.arrayContaining(state.pending.east!.tiles));
  expect(next.racks.east.map((t) => t.id)).not.toEqual(expect.arrayContaining(state.pending.east!.tiles));
});

test('a pass across swaps tiles between facing seats', () => {
  const state = commitAll(advanceTo(start(), 'first-across'));
  const record = must(resolve(state)).history[1];
  expect(record.received.west).toEqual(state.pending.east!.tiles);
  expect(record.received.east).toEqual(state.pending.west!.tiles);
  expect(record.received.north).toEqual(state.pending.south!.tiles);
});

test('a pass left sends each seat’s tiles three seats on', () => {
  const state = commitAll(advanceTo(start(), 'first-left'));
  const record = must(resolve(state)).history[2];
  expect(record.received.north).toEqual(state.pending.east!.tiles);
  expect(record.received.east).toEqual(state.pending.south!.tiles);
});

test('racks keep 14 and 13 after a pass', () => {
  const next = passAll(start());
  expect(SEATS.map((seat) => next.racks[seat].length)).toEqual([14, 13, 13, 13]);
});

test('the first Charleston goes right, across, left', () => {
  let state: ExchangeState = start();
  const seen = [state.phase];
  for (let i = 0; i < 3; i++) seen.push((state = passAll(state)).phase);
  expect(seen).toEqual(['first-right', 'first-across', 'first-left', 'vote']); // common practice, from memory
});

test('WRONG_PHASE: a pass during the vote', () => {
  const state = advanceTo(start(), 'vote');
  const result = refused(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east') });
  expect(result).toEqual({ ok: false, code: 'WRONG_PHASE', message: "You can't pass tiles now: the table is voting on a second Charleston." });
});

test('WRONG_PHASE: a vote during a pass', () => {
  const result = refused(start(), 'east', { type: 'vote', stop: true });
  expect(result.code).toBe('WRONG_PHASE');
  expect(result.message).toBe("You can't vote now: the first Charleston is passing right.");
});

test('WRONG_PHASE: a courtesy ask during a pass', () => {
  expect(refused(start(), 'north', { type: 'courtesy-ask', count: 1 }).code).toBe('WRONG_PHASE');
});

test('WRONG_PHASE: anything once the exchange is done', () => {
  const done = advanceTo(createExchange({ seed, secondCharleston: false, courtesy: false }), 'done');
  expect(refused(done, 'east', { type: 'pass', tiles: firstPassable(done, 'east') }).code).toBe('WRONG_PHASE');
  expect(refused(done, 'east', { type: 'withdraw' }).code).toBe('WRONG_PHASE');
  expect(refused(done, 'east', { type: 'vote', stop: false }).code).toBe('WRONG_PHASE');
});

test('WRONG_PHASE: resolve during the vote', () => {
  const result = resolve(advanceTo(start(), 'vote'));
  expect(result).toMatchObject({ ok: false, code: 'WRONG_PHASE' });
});

test('WRONG_COUNT: a fourth tile', () => {
  const state = start();
  const result = refused(state, 'south', { type: 'pass', tiles: firstPassable(state, 'south', 4) });
  expect(result).toEqual({ ok: false, code: 'WRONG_COUNT', message: 'Send exactly 3 tiles (you chose 4).' });
});

test('WRONG_COUNT: two tiles', () => {
  const state = start();
  expect(refused(state, 'south', { type: 'pass', tiles: firstPassable(state, 'south', 2) }).message).toBe('Send exactly 3 tiles (you chose 2).');
});

test('WRONG_COUNT: an empty pass', () => {
  expect(refused(start(), 'south', { type: 'pass', tiles: [] }).code).toBe('WRONG_COUNT');
});

test('WRONG_COUNT: a blind count of 4', () => {
  const state = advanceTo(start(), 'first-left');
  const result = refused(state, 'west', { type: 'pass', tiles: [], blind: 4 });
  expect(result).toEqual({ ok: false, code: 'WRONG_COUNT', message: 'A blind pass forwards 1, 2 or 3 tiles (you chose 4).' });
});

test('WRONG_COUNT: a negative blind count', () => {
  const state = advanceTo(start(), 'first-left');
  expect(refused(state, 'west', { type: 'pass', tiles: firstPassable(state, 'west', 4), blind: -1 }).code).toBe('WRONG_COUNT');
});

test('WRONG_COUNT: own tiles and blind that do not make three', () => {
  const state = advanceTo(start(), 'first-left');
  const result = refused(state, 'west', { type: 'pass', tiles: firstPassable(state, 'west', 2), blind: 2 });
  expect(result.message).toBe('Send exactly 3 tiles (you chose 2 of your own and 2 blind).');
});

test('JOKER_NOT_PASSABLE: a joker in a pass', () => {
  const state = start();
  const joker = jokerOf(state, 'east')!;
  const result = refused(state, 'east', { type: 'pass', tiles: [joker.id, ...firstPassable(state, 'east', 2)] });
  expect(result).toEqual({ ok: false, code: 'JOKER_NOT_PASSABLE', message: "Jokers can't be passed. Pick another tile." });
});

test('NOT_YOUR_TILE: a tile from another rack', () => {
  const state = start();
  const foreign = state.racks.west[0].id;
  const result = refused(state, 'east', { type: 'pass', tiles: [foreign, ...firstPassable(state, 'east', 2)] });
  expect(result).toEqual({ ok: false, code: 'NOT_YOUR_TILE', message: "That tile isn't in your rack. Pick tiles from your own rack." });
});

test('NOT_YOUR_TILE: a tile from the wall', () => {
  const state = start();
  expect(refused(state, 'east', { type: 'pass', tiles: [state.wall[0].id, ...firstPassable(state, 'east', 2)] }).code).toBe('NOT_YOUR_TILE');
});

test('NOT_YOUR_TILE: an id that does not exist', () => {
  const state = start();
  expect(refused(state, 'east', { type: 'pass', tiles: ['t999', ...firstPassable(state, 'east', 2)] }).code).toBe('NOT_YOUR_TILE');
});

test('DUPLICATE_TILE: the same id twice', () => {
  const state = start();
  const [a, b] = firstPassable(state, 'east', 2);
  const result = refused(state, 'east', { type: 'pass', tiles: [a, a, b] });
  expect(result).toEqual({ ok: false, code: 'DUPLICATE_TILE', message: 'You picked the same tile twice. Pick different tiles.' });
});

test('BLIND_NOT_ALLOWED: a blind pass on the first right', () => {
  const state = start();
  const result = refused(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east', 2), blind: 1 });
  expect(result).toEqual({
    ok: false,
    code: 'BLIND_NOT_ALLOWED',
    message: 'A blind pass is only allowed on the first left and the second right. Pick 3 of your own tiles.',
  });
});

test('BLIND_NOT_ALLOWED: a blind pass on the first across', () => {
  const state = advanceTo(start(), 'first-across');
  expect(refused(state, 'east', { type: 'pass', tiles: [], blind: 3 }).code).toBe('BLIND_NOT_ALLOWED');
});

test('BLIND_NOT_ALLOWED: a blind pass on the second left and second across', () => {
  let state = advanceTo(start(), 'second-left');
  expect(refused(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east', 1), blind: 2 }).code).toBe('BLIND_NOT_ALLOWED');
  state = advanceTo(state, 'second-across');
  expect(refused(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east', 1), blind: 2 }).code).toBe('BLIND_NOT_ALLOWED');
});

test('BLIND_NOT_ALLOWED: a blind count of 4 outside the blind passes', () => {
  expect(refused(start(), 'east', { type: 'pass', tiles: [], blind: 4 }).code).toBe('BLIND_NOT_ALLOWED');
});

test('blind passes of 1, 2 and 3 are accepted on the first left and the second right', () => {
  for (const phase of ['first-left', 'second-right'] as const) {
    const state = advanceTo(start(), phase);
    for (const blind of [1, 2, 3]) {
      expect(act(state, 'south', { type: 'pass', tiles: firstPassable(state, 'south', 3 - blind), blind }).ok).toBe(true);
    }
  }
});

test('ALREADY_COMMITTED: a second commit', () => {
  const state = must(act(start(), 'south', { type: 'pass', tiles: firstPassable(start(), 'south') }));
  const result = refused(state, 'south', { type: 'pass', tiles: firstPassable(state, 'south', 6).slice(3) });
  expect(result).toEqual({
    ok: false,
    code: 'ALREADY_COMMITTED',
    message: 'You have already committed this pass. Take it back first if you want to change it.',
  });
});

test('ALREADY_COMMITTED: a second vote', () => {
  const state = must(act(advanceTo(start(), 'vote'), 'west', { type: 'vote', stop: false }));
  expect(refused(state, 'west', { type: 'vote', stop: true }).code).toBe('ALREADY_COMMITTED');
});

test('a committed pass can be withdrawn before it resolves and committed again', () => {
  const first = must(act(start(), 'south', { type: 'pass', tiles: firstPassable(start(), 'south') }));
  const withdrawn = must(act(first, 'south', { type: 'withdraw' }));
  expect(withdrawn.pending.south).toBeUndefined();
  const other = firstPassable(withdrawn, 'south', 6).slice(3);
  expect(must(act(withdrawn, 'south', { type: 'pass', tiles: other })).pending.south!.tiles).toEqual(other);
});

test('a withdrawn pass can no longer resolve', () => {
  const state = must(act(commitAll(start()), 'west', { type: 'withdraw' }));
  expect(canResolve(state)).toBe(false);
});

test('NOT_COMMITTED: withdraw after the pass resolved', () => {
  const resolved = passAll(start());
  const result = refused(resolved, 'south', { type: 'withdraw' });
  expect(result).toEqual({ ok: false, code: 'NOT_COMMITTED', message: 'You have nothing committed to take back in this step.' });
});

test('NOT_COMMITTED: withdraw with nothing committed', () => {
  expect(refused(start(), 'north', { type: 'withdraw' }).code).toBe('NOT_COMMITTED');
});

test('NOT_READY: resolve before everyone committed', () => {
  const state = must(act(start(), 'east', { type: 'pass', tiles: firstPassable(start(), 'east') }));
  expect(canResolve(state)).toBe(false);
  expect(resolve(state)).toEqual({
    ok: false,
    code: 'NOT_READY',
    message: 'Waiting for South, West and North to commit before the pass can go through.',
  });
});

test('NOT_READY: resolve with one seat missing names that seat', () => {
  const state = must(act(commitAll(start()), 'north', { type: 'withdraw' }));
  const result = resolve(state);
  expect(result.ok === false && result.message).toBe('Waiting for North to commit before the pass can go through.');
});

test('BAD_ACTION: an action of unknown type', () => {
  const result = refused(start(), 'east', { type: 'swap' } as unknown as Action);
  expect(result).toEqual({ ok: false, code: 'BAD_ACTION', message: '"swap" is not something a seat can do. Choose pass, take back, vote or ask.' });
});

test('BAD_ACTION: no action at all', () => {
  expect(refused(start(), 'east', null as unknown as Action).code).toBe('BAD_ACTION');
});

test('BAD_ACTION: a pass without a tile list', () => {
  expect(refused(start(), 'east', { type: 'pass', tiles: 't1' } as unknown as Action).code).toBe('BAD_ACTION');
  expect(refused(start(), 'east', { type: 'pass', tiles: [1, 2, 3] } as unknown as Action).code).toBe('BAD_ACTION');
});

test('BAD_ACTION: a blind count that is not a whole number', () => {
  const state = advanceTo(start(), 'first-left');
  expect(refused(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east', 2), blind: 0.5 }).code).toBe('BAD_ACTION');
  expect(refused(state, 'east', { type: 'pass', tiles: [], blind: '3' } as unknown as Action).code).toBe('BAD_ACTION');
});

test('BAD_ACTION: a vote that is neither stop nor continue', () => {
  expect(refused(advanceTo(start(), 'vote'), 'east', { type: 'vote', stop: 'yes' } as unknown as Action).code).toBe('BAD_ACTION');
});

test('BAD_ACTION: a courtesy ask that is not a number', () => {
  const state = advanceTo(createExchange({ seed, secondCharleston: false }), 'courtesy-ask');
  expect(refused(state, 'east', { type: 'courtesy-ask', count: 'two' } as unknown as Action).code).toBe('BAD_ACTION');
});

test('BAD_ACTION: a seat that does not exist', () => {
  expect(refused(start(), 'centre' as 'east', { type: 'withdraw' }).code).toBe('BAD_ACTION');
});

test('a legal action leaves the state it was given unchanged', () => {
  const state = start(); // frozen: any write would throw
  const before = JSON.stringify(state);
  must(act(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east') }));
  expect(JSON.stringify(state)).toBe(before);
});

test('resolve leaves the state it was given unchanged', () => {
  const state = deepFreeze(commitAll(advanceTo(start(), 'first-left'), { east: 1, south: 3 }));
  const before = JSON.stringify(state);
  must(resolve(state));
  expect(JSON.stringify(state)).toBe(before);
});

test('a refused resolve leaves the state unchanged', () => {
  const state = start();
  const before = JSON.stringify(state);
  expect(resolve(state).ok).toBe(false);
  expect(JSON.stringify(state)).toBe(before);
});

test('the log holds every accepted action and resolution, and nothing refused', () => {
  let state: ExchangeState = start();
  refused(state, 'east', { type: 'vote', stop: true });
  state = passAll(state);
  expect(state.log).toHaveLength(5);
  expect(state.log[4]).toEqual({ resolve: true });
  expect(state.log[0]).toEqual({ seat: 'east', action: { type: 'pass', tiles: expect.any(Array), blind: 0 } });
});

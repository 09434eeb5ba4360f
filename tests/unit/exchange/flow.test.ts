import { expect, test } from 'vitest';
import {
  BLIND_PHASES,
  COURTESY_MAX,
  PASS_DIRECTION,
  PASS_SIZE,
  PHASES,
  act,
  canResolve,
  createExchange,
  isCommitted,
  legalPassSize,
  resolve,
  type ExchangeOptions,
  type ExchangeState,
} from '../../../shared/exchange';
import { SEATS } from '../../../shared/seats';
import { advanceTo, askAll, firstPassable, jokerOf, must, passAll, voteAll } from './helpers';

const seed = 'harbor-lane-week-01';
const begin = (options: Partial<ExchangeOptions> = {}) => createExchange({ seed, ...options });

test('a Charleston pass is three tiles', () => {
  expect(PASS_SIZE).toBe(3); // common practice, from memory
  expect(legalPassSize(begin(), 'east')).toBe(3);
});

test('a courtesy ask is at most three', () => {
  expect(COURTESY_MAX).toBe(3); // common practice, from memory
});

test('the phases come in their fixed order', () => {
  expect(PHASES).toEqual([
    'first-right',
    'first-across',
    'first-left',
    'vote',
    'second-left',
    'second-across',
    'second-right',
    'courtesy-ask',
    'courtesy-pass',
    'done',
  ]); // common practice, from memory: right, across, left; then left, across, right
});

test('blind passes belong to the last pass of each Charleston', () => {
  expect(BLIND_PHASES).toEqual(['first-left', 'second-right']); // common practice, from memory
});

test('each pass goes its own way', () => {
  expect(PASS_DIRECTION).toEqual({
    'first-right': 'right',
    'first-across': 'across',
    'first-left': 'left',
    'second-left': 'left',
    'second-across': 'across',
    'second-right': 'right',
    'courtesy-pass': 'across',
  });
});

test('the vote follows the first Charleston', () => {
  expect(advanceTo(begin(), 'vote').history.map((r) => r.phase)).toEqual(['first-right', 'first-across', 'first-left']);
});

test('one stop vote skips the second Charleston', () => {
  const vote = advanceTo(begin(), 'vote');
  const next = must(act(must(act(vote, 'east', { type: 'vote', stop: false })), 'south', { type: 'vote', stop: true }));
  expect(next.phase).toBe('courtesy-ask');
});

test('a stop vote settles at once, without resolve', () => {
  const next = must(act(advanceTo(begin(), 'vote'), 'north', { type: 'vote', stop: true }));
  expect(next.phase).toBe('courtesy-ask');
  expect(next.log[next.log.length - 1]).toEqual({ seat: 'north', action: { type: 'vote', stop: true } });
});

test('a stop vote with courtesy off ends the exchange', () => {
  expect(must(act(advanceTo(begin({ courtesy: false }), 'vote'), 'west', { type: 'vote', stop: true })).phase).toBe('done');
});

test('three continue votes keep waiting for the fourth', () => {
  let state = advanceTo(begin(), 'vote');
  for (const seat of ['east', 'south', 'west'] as const) state = must(act(state, seat, { type: 'vote', stop: false }));
  expect(state.phase).toBe('vote');
  expect(isCommitted(state, 'west')).toBe(true);
  expect(isCommitted(state, 'north')).toBe(false);
});

test('four continue votes start the second Charleston', () => {
  expect(voteAll(advanceTo(begin(), 'vote'), false).phase).toBe('second-left');
});

test('a continue vote can be taken back before the vote settles', () => {
  const state = must(act(advanceTo(begin(), 'vote'), 'east', { type: 'vote', stop: false }));
  expect(must(act(state, 'east', { type: 'withdraw' })).votes).toEqual({});
});

test('the second Charleston goes left, across, right', () => {
  let state = voteAll(advanceTo(begin(), 'vote'), false);
  const seen = [state.phase];
  for (let i = 0; i < 3; i++) seen.push((state = passAll(state)).phase);
  expect(seen).toEqual(['second-left', 'second-across', 'second-right', 'courtesy-ask']); // common practice, from memory
});

test('without a second Charleston the first left leads to the courtesy asks', () => {
  const state = advanceTo(begin({ secondCharleston: false }), 'first-left');
  expect(passAll(state).phase).toBe('courtesy-ask');
});

test('without a second Charleston and without courtesy the first left ends the exchange', () => {
  expect(passAll(advanceTo(begin({ secondCharleston: false, courtesy: false }), 'first-left')).phase).toBe('done');
});

test('without courtesy the second right ends the exchange', () => {
  expect(passAll(advanceTo(begin({ courtesy: false }), 'second-right')).phase).toBe('done');
});

const courtesyAsk = () => advanceTo(begin({ secondCharleston: false }), 'courtesy-ask');

test('courtesy asks settle by themselves once all four have asked', () => {
  const state = askAll(courtesyAsk(), { east: 2, south: 1, west: 3, north: 1 });
  expect(state.phase).toBe('courtesy-pass');
  expect(canResolve(state)).toBe(false);
});

test('each across pair exchanges the lower of its two asks', () => {
  const state = askAll(courtesyAsk(), { east: 2, south: 3, west: 1, north: 0 });
  expect(state.agreed).toEqual({ east: 1, west: 1, south: 0, north: 0 }); // common practice, from memory
  expect(legalPassSize(state, 'east')).toBe(1);
  expect(legalPassSize(state, 'south')).toBe(0);
});

test('a seat whose pair agreed on 0 has nothing to commit and counts as committed', () => {
  const state = askAll(courtesyAsk(), { east: 2, south: 3, west: 1, north: 0 });
  expect(isCommitted(state, 'south')).toBe(true);
  expect(isCommitted(state, 'north')).toBe(true);
  const result = act(state, 'south', { type: 'pass', tiles: [] });
  expect(result).toEqual({ ok: false, code: 'ALREADY_COMMITTED', message: 'You and North agreed on no courtesy tiles, so you have nothing to pass.' });
});

test('the courtesy pass resolves once the pairs with something to send have committed', () => {
  let state = askAll(courtesyAsk(), { east: 2, south: 3, west: 1, north: 0 });
  state = must(act(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east', 1) }));
  expect(canResolve(state)).toBe(false);
  state = must(act(state, 'west', { type: 'pass', tiles: firstPassable(state, 'west', 1) }));
  expect(canResolve(state)).toBe(true);
  const done = must(resolve(state));
  expect(done.phase).toBe('done');
  expect(done.history[done.history.length - 1].received).toEqual({
    east: state.pending.west!.tiles,
    west: state.pending.east!.tiles,
    south: [],
    north: [],
  });
  expect(SEATS.map((seat) => done.racks[seat].length)).toEqual([14, 13, 13, 13]);
});

test('when both pairs agree on 0 the courtesy pass is skipped', () => {
  expect(askAll(courtesyAsk(), { east: 0, south: 2, west: 3, north: 0 }).phase).toBe('done');
});

test('a courtesy pass sends exactly the agreed count', () => {
  const state = askAll(courtesyAsk(), { east: 2, south: 2, west: 2, north: 2 });
  const result = act(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east', 3) });
  expect(result).toEqual({ ok: false, code: 'WRONG_COUNT', message: 'Send exactly 2 tiles (you chose 3).' });
  expect(act(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east', 2) }).ok).toBe(true);
});

test('a courtesy pass of one says tile, not tiles', () => {
  const state = askAll(courtesyAsk(), { east: 1, south: 0, west: 1, north: 0 });
  const result = act(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east', 2) });
  expect(result.ok === false && result.message).toBe('Send exactly 1 tile (you chose 2).');
});

test('a courtesy pass cannot be blind', () => {
  const state = askAll(courtesyAsk(), { east: 2, south: 2, west: 2, north: 2 });
  const result = act(state, 'east', { type: 'pass', tiles: firstPassable(state, 'east', 1), blind: 1 });
  expect(result).toEqual({ ok: false, code: 'BLIND_NOT_ALLOWED', message: "The courtesy pass can't be blind. Pick 2 of your own tiles." });
});

test('a courtesy pass cannot hold a joker', () => {
  let state: ExchangeState = createExchange({ seed, secondCharleston: false, racks: { east: ['joker'] } });
  state = askAll(advanceTo(state, 'courtesy-ask'), { east: 1, south: 1, west: 1, north: 1 });
  const result = act(state, 'east', { type: 'pass', tiles: [jokerOf(state, 'east')!.id] });
  expect(result.ok === false && result.code).toBe('JOKER_NOT_PASSABLE');
});

test('WRONG_COUNT: a courtesy ask of four', () => {
  const result = act(courtesyAsk(), 'east', { type: 'courtesy-ask', count: 4 as 3 });
  expect(result).toEqual({ ok: false, code: 'WRONG_COUNT', message: 'Ask for 0, 1, 2 or 3 courtesy tiles (you asked for 4).' });
});

test('ALREADY_COMMITTED: a second courtesy ask', () => {
  const state = must(act(courtesyAsk(), 'east', { type: 'courtesy-ask', count: 2 }));
  const result = act(state, 'east', { type: 'courtesy-ask', count: 1 });
  expect(result.ok === false && result.code).toBe('ALREADY_COMMITTED');
});

test('a courtesy ask can be taken back before the asks settle', () => {
  const state = must(act(courtesyAsk(), 'east', { type: 'courtesy-ask', count: 2 }));
  expect(must(act(state, 'east', { type: 'withdraw' })).asks).toEqual({});
});

test('the full exchange ends in done', () => {
  const done = advanceTo(begin(), 'done');
  expect(done.history.map((record) => record.phase)).toEqual([
    'first-right',
    'first-across',
    'first-left',
    'second-left',
    'second-across',
    'second-right',
    'courtesy-pass',
  ]);
  expect(canResolve(done)).toBe(false);
});

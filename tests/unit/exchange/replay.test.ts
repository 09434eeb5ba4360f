import { expect, test } from 'vitest';
import { act, createExchange, replay, resolve } from '../../../shared/exchange';
import { rngFor } from '../../../shared/random';
import { advanceTo, commitAll, firstPassable, must, playToEnd } from './helpers';

const options = { seed: 'harbor-lane-week-01' };

test('replay of an empty log is the deal', () => {
  expect(replay(options, [])).toStrictEqual(createExchange(options));
});

test('replay of a finished exchange gives the same state', () => {
  const done = playToEnd(createExchange(options), rngFor('players', 1));
  expect(done.phase).toBe('done');
  expect(replay(options, done.log)).toStrictEqual(done);
});

test('replay repeats the blind picks', () => {
  let state = must(resolve(commitAll(advanceTo(createExchange(options), 'first-left'), { east: 2, west: 1, north: 3 })));
  state = must(resolve(commitAll(advanceTo(state, 'second-right'), { south: 1, north: 2 })));
  expect(state.history.filter((record) => record.forwarded.north.length > 0)).toHaveLength(2);
  expect(replay(options, state.log)).toStrictEqual(state);
});

test('replay works from the JSON of a stored log', () => {
  const done = playToEnd(createExchange({ ...options, jokers: false, courtesy: true }), rngFor('players', 2));
  const stored = JSON.parse(JSON.stringify({ options: done.options, log: done.log }));
  expect(replay(stored.options, stored.log)).toStrictEqual(done);
});

test('replay of a preset drill gives the same state', () => {
  const drill = { seed: 'drill-7', racks: { east: ['joker' as const, 'flower' as const, 'bam1' as const] } };
  const done = playToEnd(createExchange(drill), rngFor('players', 3));
  expect(replay(done.options, done.log)).toStrictEqual(done);
});

test('a finished state is plain JSON', () => {
  const done = playToEnd(createExchange(options), rngFor('players', 4));
  expect(JSON.parse(JSON.stringify(done))).toStrictEqual(done);
});

test('replay refuses a log that does not fit', () => {
  const state = must(act(createExchange(options), 'east', { type: 'pass', tiles: firstPassable(createExchange(options), 'east') }));
  expect(() => replay({ seed: 'another-seed' }, state.log)).toThrow(
    "Entry 1 of the log can't be replayed: That tile isn't in your rack. Pick tiles from your own rack.",
  );
  expect(() => replay(options, [{ resolve: true }])).toThrow("Entry 1 of the log can't be replayed: Waiting for");
});

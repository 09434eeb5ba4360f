import fc from 'fast-check';
import { expect, test } from 'vitest';
import { act, canResolve, createExchange, replay, resolve, viewFor, type ExchangeState, type Result } from '../../../shared/exchange';
import { rngFor } from '../../../shared/random';
import { SEATS, dealtRackSize } from '../../../shared/seats';
import { fullSet } from '../../../shared/tiles';
import { allIds, allKinds, illegalAction, jokerCounts, legalAction } from './helpers';

const options = fc.record({
  seed: fc.string({ maxLength: 24 }),
  jokers: fc.boolean(),
  secondCharleston: fc.boolean(),
  courtesy: fc.boolean(),
});

const step = fc.record({
  kind: fc.constantFrom('legal', 'legal', 'legal', 'illegal', 'resolve'),
  seat: fc.constantFrom(...SEATS),
  salt: fc.nat(),
});

/** Long enough to reach the end of most exchanges. */
const steps = fc.array(step, { minLength: 20, maxLength: 160, size: 'max' });

/** Pinned so a run repeats; set FC_SEED to explore other inputs. */
const seed = Number(process.env.FC_SEED ?? 3_141_592);
const runs = { numRuns: 120, seed };

/** What an attempt the engine refused was tried on, and what the driver holds after it. */
interface Refusal {
  kind: 'illegal' | 'resolve';
  /** A deep copy of the state the action was tried on, taken before the attempt. */
  triedOn: ExchangeState;
  /** The state the driver goes on from after the refusal. */
  after: ExchangeState;
  result: Result;
}

/**
 * Applies a random mix of legal actions, illegal actions and resolve calls, checking `check`
 * after each and handing every refused attempt to `refused` (with a deep copy of what it was
 * tried on, taken only when `refused` is given: copying every step is slow).
 */
function drive(
  opts: { seed: string; jokers: boolean; secondCharleston: boolean; courtesy: boolean },
  steps: { kind: string; seat: (typeof SEATS)[number]; salt: number }[],
  check: (state: ExchangeState) => void,
  refused?: (refusal: Refusal) => void,
): ExchangeState {
  let state = createExchange({ ...opts, seed: opts.seed || 'blank' });
  steps.forEach(({ kind, seat, salt }, index) => {
    const rng = rngFor('property', salt, index);
    const before = state;
    const snapshot = JSON.stringify(state);
    if (kind === 'resolve') {
      const triedOn = refused ? structuredClone(state) : state;
      const result = resolve(state);
      expect(result.ok).toBe(canResolve(before));
      if (result.ok) state = result.state;
      else refused?.({ kind: 'resolve', triedOn, after: state, result });
    } else if (kind === 'illegal') {
      const triedOn = refused ? structuredClone(state) : state;
      const action = illegalAction(state, seat, rng);
      const result = act(state, seat, action);
      expect(result.ok, JSON.stringify(action)).toBe(false);
      refused?.({ kind: 'illegal', triedOn, after: state, result });
    } else {
      // The named seat acts if it has something to do, else the next seat that has.
      const order = [...SEATS.slice(SEATS.indexOf(seat)), ...SEATS.slice(0, SEATS.indexOf(seat))];
      let actor = seat;
      let action = null;
      for (const candidate of order) {
        action = legalAction(state, candidate, rng);
        actor = candidate;
        if (action) break;
      }
      if (!action) return;
      const result = act(state, actor, action);
      if (!result.ok) throw new Error(`${result.code}: ${result.message} for ${JSON.stringify(action)}`);
      state = result.state;
    }
    // No step, accepted or refused, changes the state it was given.
    expect(JSON.stringify(before)).toBe(snapshot);
    check(state);
  });
  return state;
}

test('every tile is present exactly once across the racks and the wall', () => {
  fc.assert(
    fc.property(options, steps, (opts, steps) => {
      const expected = fullSet(opts.jokers).sort();
      drive(opts, steps, (state) => {
        expect(allKinds(state)).toEqual(expected);
        expect(new Set(allIds(state)).size).toBe(expected.length);
      });
    }),
    runs,
  );
});

test('racks stay at 14 and 13 through every pass', () => {
  fc.assert(
    fc.property(options, steps, (opts, steps) => {
      drive(opts, steps, (state) => {
        for (const seat of SEATS) expect(state.racks[seat]).toHaveLength(dealtRackSize(seat));
      });
    }),
    runs,
  );
});

test('jokers never change seat', () => {
  fc.assert(
    fc.property(options, steps, (opts, steps) => {
      const jokers = jokerCounts(createExchange({ ...opts, seed: opts.seed || 'blank' }));
      const jokerIds = (state: ExchangeState) =>
        SEATS.map((seat) => state.racks[seat].filter((tile) => tile.kind === 'joker').map((tile) => tile.id).sort());
      const start = jokerIds(createExchange({ ...opts, seed: opts.seed || 'blank' }));
      drive(opts, steps, (state) => {
        expect(jokerCounts(state)).toEqual(jokers);
        expect(jokerIds(state)).toEqual(start);
      });
    }),
    runs,
  );
});

test('an illegal action never changes the state', () => {
  const seen = { illegal: 0, resolve: 0 };
  fc.assert(
    fc.property(options, steps, (opts, steps) => {
      drive(
        opts,
        steps,
        () => {},
        ({ kind, triedOn, after, result }) => {
          seen[kind]++;
          expect(result).toEqual({ ok: false, code: expect.any(String), message: expect.any(String) });
          // The state play goes on from is, deep down, the one the attempt was tried on.
          expect(after).toStrictEqual(triedOn);
        },
      );
    }),
    runs,
  );
  // Both kinds of refusal came up, so the check above ran on each.
  expect(seen.illegal).toBeGreaterThan(0);
  expect(seen.resolve).toBeGreaterThan(0);
});

test('replay reproduces the state', () => {
  fc.assert(
    fc.property(options, steps, (opts, steps) => {
      const state = drive(opts, steps, () => {});
      expect(replay(state.options, state.log)).toStrictEqual(state);
      expect(JSON.parse(JSON.stringify(state))).toStrictEqual(state);
    }),
    runs,
  );
});

test('a seat’s view never shows another rack or a tile it forwarded blind', () => {
  let hiddenChecked = 0;
  fc.assert(
    fc.property(options, steps, (opts, steps) => {
      const state = drive(opts, steps, () => {});
      for (const seat of SEATS) {
        const view = viewFor(state, seat);
        expect(Object.keys(view.racks)).toEqual([seat]);
        const allowed = new Set([
          ...state.racks[seat].map((tile) => tile.id),
          ...state.history.flatMap((record) => [...record.sent[seat], ...record.received[seat]]),
        ]);
        expect(Object.keys(view.kinds).length).toBeGreaterThan(0);
        for (const id of Object.keys(view.kinds)) expect(allowed.has(id)).toBe(true);
        // A tile forwarded blind shows only if the seat knows it in the open: in its rack,
        // or sent or received by it in some pass.
        const seen = JSON.stringify(view);
        state.history.forEach((record, index) => {
          const hidden = record.forwarded[seat].filter((id) => !allowed.has(id));
          hiddenChecked += hidden.length;
          for (const id of hidden) expect(seen).not.toContain(`"${id}"`);
          expect(view.history[index].forwarded[seat]).toEqual([]);
        });
      }
    }),
    runs,
  );
  // Some runs forwarded tiles the seat never saw, so the check above ran.
  expect(hiddenChecked).toBeGreaterThan(0);
});

test('four random legal players always finish the exchange', () => {
  fc.assert(
    fc.property(options, fc.nat(), (opts, salt) => {
      let state = createExchange({ ...opts, seed: opts.seed || 'blank' });
      const rng = rngFor('players', salt);
      for (let guard = 0; state.phase !== 'done'; guard++) {
        expect(guard).toBeLessThan(2000);
        if (canResolve(state)) {
          state = (resolve(state) as { state: ExchangeState }).state;
          continue;
        }
        for (const seat of SEATS) {
          const action = legalAction(state, seat, rng);
          if (!action) continue;
          const result = act(state, seat, action);
          if (result.ok) state = result.state;
          if (state.phase === 'done') break;
        }
      }
      expect(replay(state.options, state.log)).toStrictEqual(state);
    }),
    { numRuns: 100, seed },
  );
});

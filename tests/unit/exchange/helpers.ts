/** Test helpers: drive an exchange, freeze states, random legal and illegal players. */
import { act, canResolve, isCommitted, legalPassSize, passableTiles, resolve } from '../../../shared/exchange';
import type { Action, ExchangeState, Result } from '../../../shared/exchange';
import { pickSome, randomInt, type Rng } from '../../../shared/random';
import { SEATS, seatTo, type Seat } from '../../../shared/seats';
import type { Tile, TileKind } from '../../../shared/tiles';

export function must(result: Result): ExchangeState {
  if (!result.ok) throw new Error(`${result.code}: ${result.message}`);
  return result.state;
}

export function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const inner of Object.values(value)) deepFreeze(inner);
  }
  return value;
}

/** The first `count` passable tiles of a seat's rack, as ids. */
export function firstPassable(state: ExchangeState, seat: Seat, count = 3): string[] {
  return passableTiles(state, seat)
    .slice(0, count)
    .map((tile) => tile.id);
}

export function jokerOf(state: ExchangeState, seat: Seat): Tile | undefined {
  return state.racks[seat].find((tile) => tile.kind === 'joker');
}

/** Every seat commits its first passable tiles (or what `blind` says), without resolving. */
export function commitAll(state: ExchangeState, blind: Partial<Record<Seat, number>> = {}): ExchangeState {
  let next = state;
  for (const seat of SEATS) {
    const b = blind[seat] ?? 0;
    next = must(act(next, seat, { type: 'pass', tiles: firstPassable(next, seat, legalPassSize(next, seat) - b), blind: b }));
  }
  return next;
}

/** Commits for every seat that still has to, and resolves. */
export function passAll(state: ExchangeState, blind: Partial<Record<Seat, number>> = {}): ExchangeState {
  let next = state;
  for (const seat of SEATS) {
    if (isCommitted(next, seat)) continue;
    const b = blind[seat] ?? 0;
    next = must(act(next, seat, { type: 'pass', tiles: firstPassable(next, seat, legalPassSize(next, seat) - b), blind: b }));
  }
  return must(resolve(next));
}

export function voteAll(state: ExchangeState, stop: boolean): ExchangeState {
  let next = state;
  for (const seat of SEATS) if (next.phase === 'vote') next = must(act(next, seat, { type: 'vote', stop }));
  return next;
}

export function askAll(state: ExchangeState, counts: Record<Seat, 0 | 1 | 2 | 3>): ExchangeState {
  let next = state;
  for (const seat of SEATS) next = must(act(next, seat, { type: 'courtesy-ask', count: counts[seat] }));
  return next;
}

/** Kinds of every tile on the table and in the wall, sorted: the set's make-up. */
export function allKinds(state: ExchangeState): TileKind[] {
  return [...SEATS.flatMap((seat) => state.racks[seat]), ...state.wall].map((tile) => tile.kind).sort();
}

export function allIds(state: ExchangeState): string[] {
  return [...SEATS.flatMap((seat) => state.racks[seat]), ...state.wall].map((tile) => tile.id);
}

export function jokerCounts(state: ExchangeState): Record<Seat, number> {
  const count = (seat: Seat) => state.racks[seat].filter((tile) => tile.kind === 'joker').length;
  return { east: count('east'), south: count('south'), west: count('west'), north: count('north') };
}

/** A legal action for `seat` now, or null when it has nothing to do. */
export function legalAction(state: ExchangeState, seat: Seat, rng: Rng): Action | null {
  const committed = isCommitted(state, seat);
  switch (state.phase) {
    case 'vote':
      if (committed) return rng() < 0.1 ? { type: 'withdraw' } : null;
      return { type: 'vote', stop: rng() < 0.3 };
    case 'courtesy-ask':
      if (committed) return rng() < 0.1 ? { type: 'withdraw' } : null;
      return { type: 'courtesy-ask', count: randomInt(rng, 4) as 0 | 1 | 2 | 3 };
    case 'done':
      return null;
    default: {
      if (committed) return state.pending[seat] && rng() < 0.1 ? { type: 'withdraw' } : null;
      const size = legalPassSize(state, seat);
      const blind = state.phase === 'first-left' || state.phase === 'second-right' ? randomInt(rng, 4) : 0;
      const { chosen } = pickSome(passableTiles(state, seat), size - blind, rng);
      return { type: 'pass', tiles: chosen.map((tile) => tile.id), blind };
    }
  }
}

/** An action that is illegal for `seat` now, whatever the state. */
export function illegalAction(state: ExchangeState, seat: Seat, rng: Rng): Action {
  const rack = state.racks[seat];
  const other = state.racks[seatTo(seat, 'across')];
  const own = passableTiles(state, seat).map((tile) => tile.id);
  const options: Action[] = [{ type: 'shuffle' } as unknown as Action, { type: 'pass', tiles: 'all' } as unknown as Action];
  switch (state.phase) {
    case 'vote':
      options.push({ type: 'pass', tiles: own.slice(0, 3) }, { type: 'courtesy-ask', count: 1 });
      if (isCommitted(state, seat)) options.push({ type: 'vote', stop: false });
      else options.push({ type: 'withdraw' });
      break;
    case 'courtesy-ask':
      options.push({ type: 'vote', stop: true }, { type: 'pass', tiles: own.slice(0, 3) });
      if (isCommitted(state, seat)) options.push({ type: 'courtesy-ask', count: 2 });
      else options.push({ type: 'courtesy-ask', count: 4 as 3 }, { type: 'withdraw' });
      break;
    case 'done':
      options.push({ type: 'withdraw' }, { type: 'vote', stop: false }, { type: 'pass', tiles: own.slice(0, 3) });
      break;
    default: {
      options.push({ type: 'vote', stop: true }, { type: 'courtesy-ask', count: 0 });
      if (isCommitted(state, seat)) {
        options.push({ type: 'pass', tiles: own.slice(0, legalPassSize(state, seat)) });
        break;
      }
      options.push({ type: 'withdraw' });
      const size = legalPassSize(state, seat);
      options.push({ type: 'pass', tiles: own.slice(0, size + 1) });
      options.push({ type: 'pass', tiles: [other[0].id, ...own.slice(0, size - 1)] });
      options.push({ type: 'pass', tiles: ['no-such-tile', ...own.slice(0, size - 1)] });
      if (size >= 2) options.push({ type: 'pass', tiles: [own[0], own[0], ...own.slice(1, size - 1)] });
      const joker = rack.find((tile) => tile.kind === 'joker');
      if (joker) options.push({ type: 'pass', tiles: [joker.id, ...own.slice(0, size - 1)] });
      if (state.phase === 'first-left' || state.phase === 'second-right') {
        options.push({ type: 'pass', tiles: [], blind: 4 }, { type: 'pass', tiles: own.slice(0, 1), blind: 1 });
      } else {
        options.push({ type: 'pass', tiles: own.slice(0, size - 1), blind: 1 });
      }
    }
  }
  return options[randomInt(rng, options.length)];
}

/** Four random legal players take the exchange to 'done'. Returns the final state. */
export function playToEnd(state: ExchangeState, rng: Rng): ExchangeState {
  let next = state;
  for (let guard = 0; next.phase !== 'done'; guard++) {
    if (guard > 1000) throw new Error('The exchange did not finish');
    if (canResolve(next) && rng() < 0.5) {
      next = must(resolve(next));
      continue;
    }
    const seat = SEATS[randomInt(rng, 4)];
    const action = legalAction(next, seat, rng);
    if (action) next = must(act(next, seat, action));
  }
  return next;
}

/** Plays the simplest legal way (first passable tiles, everyone continues, everyone asks 3) until `phase`. */
export function advanceTo(state: ExchangeState, phase: ExchangeState['phase']): ExchangeState {
  let next = state;
  for (let guard = 0; next.phase !== phase; guard++) {
    if (guard > 20) throw new Error(`Never reached ${phase}`);
    if (next.phase === 'vote') next = voteAll(next, false);
    else if (next.phase === 'courtesy-ask') next = askAll(next, { east: 3, south: 3, west: 3, north: 3 });
    else next = passAll(next);
  }
  return next;
}

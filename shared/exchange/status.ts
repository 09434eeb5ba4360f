import type { Seat } from '../seats';
import type { Tile } from '../tiles';
import { PASS_SIZE, isCharlestonPass, isPassPhase } from './constants';
import type { ExchangeState, Phase, RuleCode } from './types';

export type Failure = { ok: false; code: RuleCode; message: string };

export function fail(code: RuleCode, message: string): Failure {
  return { ok: false, code, message };
}

export function phaseOf(state: ExchangeState): Phase {
  return state.phase;
}

/** A copy of a seat's rack. */
export function rackOf(state: ExchangeState, seat: Seat): Tile[] {
  return state.racks[seat].slice();
}

/** How many tiles `seat` must send now: 3 in a Charleston pass, the agreed count in the courtesy pass, else 0. */
export function legalPassSize(state: ExchangeState, seat: Seat): number {
  if (isCharlestonPass(state.phase)) return PASS_SIZE;
  if (state.phase === 'courtesy-pass') return state.agreed[seat] ?? 0;
  return 0;
}

/** Tiles of the seat's rack that may go into a pass (every tile but the jokers). */
export function passableTiles(state: ExchangeState, seat: Seat): Tile[] {
  return state.racks[seat].filter((tile) => tile.kind !== 'joker');
}

/**
 * Whether the seat has done what this step asks of it: committed a pass, voted, or asked.
 * In the courtesy pass a seat whose agreed count is 0 has nothing to send and counts as
 * committed from the start, so the table never waits on it.
 */
export function isCommitted(state: ExchangeState, seat: Seat): boolean {
  switch (state.phase) {
    case 'vote':
      return state.votes[seat] !== undefined;
    case 'courtesy-ask':
      return state.asks[seat] !== undefined;
    case 'courtesy-pass':
      return state.pending[seat] !== undefined || (state.agreed[seat] ?? 0) === 0;
    case 'done':
      return false;
    default:
      return isPassPhase(state.phase) && state.pending[seat] !== undefined;
  }
}

/** What the table is doing, for messages. */
export function describePhase(phase: Phase): string {
  switch (phase) {
    case 'vote':
      return 'the table is voting on a second Charleston';
    case 'courtesy-ask':
      return 'the table is asking for courtesy tiles';
    case 'courtesy-pass':
      return 'the table is making the courtesy pass';
    case 'done':
      return 'the Charleston is over';
    default: {
      const [round, direction] = phase.split('-');
      return `the ${round} Charleston is passing ${direction}`;
    }
  }
}

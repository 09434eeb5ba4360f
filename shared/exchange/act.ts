import { SEATS, isSeat, seatTo, type Seat } from '../seats';
import { COURTESY_MAX, PASS_SIZE, isBlindPhase, isPassPhase } from './constants';
import { afterCharleston } from './flow';
import { seatLabel } from './options';
import { describePhase, fail, isCommitted, legalPassSize, type Failure } from './status';
import type { Action, CourtesyCount, ExchangeState, Phase, Result } from './types';

const ACTION_TYPES = ['pass', 'withdraw', 'vote', 'courtesy-ask'];

/** Checks the shape of what arrived (the server parses too, but the engine trusts nobody) and returns a clean copy. */
function parseAction(action: unknown): Action | Failure {
  if (typeof action !== 'object' || action === null) return fail('BAD_ACTION', 'That action is empty. Choose pass, take back, vote or ask.');
  const a = action as Record<string, unknown>;
  if (typeof a.type !== 'string' || !ACTION_TYPES.includes(a.type)) {
    return fail('BAD_ACTION', `"${String(a.type)}" is not something a seat can do. Choose pass, take back, vote or ask.`);
  }
  switch (a.type) {
    case 'pass': {
      if (!Array.isArray(a.tiles) || !a.tiles.every((id) => typeof id === 'string')) {
        return fail('BAD_ACTION', 'A pass needs a list of tiles from your rack.');
      }
      const blind = a.blind ?? 0;
      if (typeof blind !== 'number' || !Number.isInteger(blind)) {
        return fail('BAD_ACTION', 'The number of blind tiles must be a whole number.');
      }
      return { type: 'pass', tiles: a.tiles.slice() as string[], blind };
    }
    case 'vote':
      if (typeof a.stop !== 'boolean') return fail('BAD_ACTION', 'A vote is either stop or continue.');
      return { type: 'vote', stop: a.stop };
    case 'courtesy-ask':
      if (typeof a.count !== 'number' || !Number.isInteger(a.count)) {
        return fail('BAD_ACTION', 'Ask for a whole number of courtesy tiles: 0, 1, 2 or 3.');
      }
      return { type: 'courtesy-ask', count: a.count as CourtesyCount };
    default:
      return { type: 'withdraw' };
  }
}

function isFailure(value: unknown): value is Failure {
  return (value as Failure).ok === false;
}

/**
 * A seat's action. Checks, in order: the seat and the action's shape, the phase, whether the
 * seat already committed, then the action's own rules. Never moves tiles (resolve does) and
 * never changes the state it is given: a legal action returns a new state, an illegal one a
 * rule code and a message for the player.
 */
export function act(state: ExchangeState, seat: Seat, action: Action): Result {
  if (!isSeat(seat)) return fail('BAD_ACTION', `"${String(seat)}" is not a seat. Use east, south, west or north.`);
  const parsed = parseAction(action);
  if (isFailure(parsed)) return parsed;
  switch (parsed.type) {
    case 'pass':
      return commitPass(state, seat, parsed.tiles, parsed.blind ?? 0);
    case 'withdraw':
      return withdraw(state, seat);
    case 'vote':
      return vote(state, seat, parsed.stop);
    case 'courtesy-ask':
      return ask(state, seat, parsed.count);
  }
}

function logged(state: ExchangeState, seat: Seat, action: Action): ExchangeState['log'] {
  return [...state.log, { seat, action }];
}

function commitPass(state: ExchangeState, seat: Seat, ids: string[], blind: number): Result {
  const { phase } = state;
  if (!isPassPhase(phase)) return fail('WRONG_PHASE', `You can't pass tiles now: ${describePhase(phase)}.`);
  const courtesy = phase === 'courtesy-pass';
  const size = legalPassSize(state, seat);
  if (courtesy && size === 0) {
    const partner = seatLabel(seatTo(seat, 'across'));
    return fail('ALREADY_COMMITTED', `You and ${partner} agreed on no courtesy tiles, so you have nothing to pass.`);
  }
  if (state.pending[seat]) {
    return fail('ALREADY_COMMITTED', 'You have already committed this pass. Take it back first if you want to change it.');
  }
  if (blind !== 0 && !isBlindPhase(phase)) {
    const instead = courtesy ? `Pick ${size} of your own tiles.` : `Pick ${PASS_SIZE} of your own tiles.`;
    const where = courtesy ? "The courtesy pass can't be blind." : 'A blind pass is only allowed on the first left and the second right.';
    return fail('BLIND_NOT_ALLOWED', `${where} ${instead}`);
  }
  if (blind < 0 || blind > PASS_SIZE) {
    return fail('WRONG_COUNT', `A blind pass forwards 1, 2 or 3 tiles (you chose ${blind}).`);
  }
  if (ids.length + blind !== size) {
    const chosen = blind > 0 ? `${ids.length} of your own and ${blind} blind` : `${ids.length}`;
    return fail('WRONG_COUNT', `Send exactly ${size} ${size === 1 ? 'tile' : 'tiles'} (you chose ${chosen}).`);
  }
  if (new Set(ids).size !== ids.length) {
    return fail('DUPLICATE_TILE', 'You picked the same tile twice. Pick different tiles.');
  }
  const rack = state.racks[seat];
  for (const id of ids) {
    const tile = rack.find((candidate) => candidate.id === id);
    if (!tile) return fail('NOT_YOUR_TILE', "That tile isn't in your rack. Pick tiles from your own rack.");
    if (tile.kind === 'joker') return fail('JOKER_NOT_PASSABLE', "Jokers can't be passed. Pick another tile.");
  }
  return {
    ok: true,
    state: {
      ...state,
      pending: { ...state.pending, [seat]: { tiles: ids, blind } },
      log: logged(state, seat, { type: 'pass', tiles: ids, blind }),
    },
  };
}

function without<K extends string, V>(record: Partial<Record<K, V>>, key: K): Partial<Record<K, V>> {
  const copy = { ...record };
  delete copy[key];
  return copy;
}

/** Takes back a committed pass, a "continue" vote or a courtesy ask, as long as it has not resolved. */
function withdraw(state: ExchangeState, seat: Seat): Result {
  const { phase } = state;
  if (phase === 'done') return fail('WRONG_PHASE', 'The Charleston is over; there is nothing to take back.');
  const nothing = fail('NOT_COMMITTED', 'You have nothing committed to take back in this step.');
  const log = logged(state, seat, { type: 'withdraw' });
  if (phase === 'vote') {
    if (state.votes[seat] === undefined) return nothing;
    return { ok: true, state: { ...state, votes: without(state.votes, seat), log } };
  }
  if (phase === 'courtesy-ask') {
    if (state.asks[seat] === undefined) return nothing;
    return { ok: true, state: { ...state, asks: without(state.asks, seat), log } };
  }
  if (!state.pending[seat]) return nothing;
  return { ok: true, state: { ...state, pending: without(state.pending, seat), log } };
}

/** A vote settles by itself: the first stop skips the second Charleston, the fourth "continue" starts it. */
function vote(state: ExchangeState, seat: Seat, stop: boolean): Result {
  if (state.phase !== 'vote') return fail('WRONG_PHASE', `You can't vote now: ${describePhase(state.phase)}.`);
  if (state.votes[seat] !== undefined) return fail('ALREADY_COMMITTED', 'You have already voted.');
  const votes = { ...state.votes, [seat]: stop };
  let phase: Phase = state.phase;
  if (stop) phase = afterCharleston(state.options);
  else if (SEATS.every((s) => votes[s] === false)) phase = 'second-left';
  return { ok: true, state: { ...state, phase, votes, log: logged(state, seat, { type: 'vote', stop }) } };
}

/**
 * Courtesy asks settle by themselves once all four have asked: each across pair exchanges
 * the lower of its two asks. When both pairs settle on 0 the courtesy pass is skipped.
 */
function ask(state: ExchangeState, seat: Seat, count: number): Result {
  if (state.phase !== 'courtesy-ask') {
    return fail('WRONG_PHASE', `You can't ask for courtesy tiles now: ${describePhase(state.phase)}.`);
  }
  if (state.asks[seat] !== undefined) return fail('ALREADY_COMMITTED', 'You have already asked. Take it back first if you want to change it.');
  if (count < 0 || count > COURTESY_MAX) {
    return fail('WRONG_COUNT', `Ask for 0, 1, 2 or 3 courtesy tiles (you asked for ${count}).`);
  }
  const asks = { ...state.asks, [seat]: count as CourtesyCount };
  const log = logged(state, seat, { type: 'courtesy-ask', count: count as CourtesyCount });
  if (!SEATS.every((s) => asks[s] !== undefined)) return { ok: true, state: { ...state, asks, log } };
  const agreed: ExchangeState['agreed'] = {};
  for (const s of SEATS) agreed[s] = Math.min(asks[s]!, asks[seatTo(s, 'across')]!) as CourtesyCount;
  const phase = SEATS.some((s) => agreed[s]! > 0) ? 'courtesy-pass' : 'done';
  return { ok: true, state: { ...state, phase, asks, agreed, log } };
}

/** Whether every seat has committed in a phase where tiles move. */
export function canResolve(state: ExchangeState): boolean {
  return isPassPhase(state.phase) && SEATS.every((seat) => isCommitted(state, seat));
}

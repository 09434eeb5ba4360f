import { pickSome, rngFor, type Rng } from '../random';
import { SEATS, seatTo, type Direction, type Seat } from '../seats';
import type { Tile } from '../tiles';
import { PASS_DIRECTION } from './constants';
import { canResolve } from './act';
import { afterPass } from './flow';
import { seatLabel } from './options';
import { describePhase, fail, isCommitted } from './status';
import type { ExchangeState, PassRecord, Result } from './types';

type BySeat<T> = Record<Seat, T>;

function bySeat<T>(make: (seat: Seat) => T): BySeat<T> {
  return { east: make('east'), south: make('south'), west: make('west'), north: make('north') };
}

function listSeats(seats: Seat[]): string {
  const names = seats.map(seatLabel);
  return names.length <= 1 ? names.join('') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

interface Movement {
  received: BySeat<Tile[]>;
  forwarded: BySeat<Tile[]>;
}

/** Every seat's own tiles go straight to the seat in the pass direction. */
function moveDirect(own: BySeat<Tile[]>, direction: Direction): Movement {
  const received = bySeat<Tile[]>(() => []);
  for (const seat of SEATS) received[seatTo(seat, direction)] = own[seat];
  return { received, forwarded: bySeat(() => []) };
}

/**
 * A pass in which some seats forward arriving tiles blind. The rule, which is well defined
 * and always finishes:
 *
 * - Seat s gives k(s) tiles of its own (3 minus its blind count) and keeps exactly k(s) of
 *   the tiles that reach it, so every rack keeps its size.
 * - The tiles travel as one packet around the ring of four seats. Its size c is the largest
 *   own count at the table: 3 whenever anyone passes without blind, which is the everyday
 *   case, and less only when all four pass blind (0 when all four pass all three blind, and
 *   then no tiles move at all).
 * - The first seat in turn order with the largest own count starts: it sends its own tiles
 *   and forwards nothing. Each following seat, in the pass direction, takes the packet that
 *   reaches it; the seeded generator picks c − k(s) of those tiles for it to forward unseen,
 *   it keeps the rest, and sends its own tiles with the forwarded ones. The packet that
 *   comes back to the starting seat it keeps whole (it is exactly k tiles).
 *
 * So each tile goes at most once round, nobody forwards a tile it sent, and when one seat
 * passes without blind every other seat forwards exactly its blind count from the three
 * tiles arriving to it. The generator is seeded with the exchange seed and the position of
 * this resolution in the log, so replay repeats the same picks.
 */
function moveBlind(own: BySeat<Tile[]>, direction: Direction, rng: () => Rng): Movement {
  const received = bySeat<Tile[]>(() => []);
  const forwarded = bySeat<Tile[]>(() => []);
  const size = Math.max(...SEATS.map((seat) => own[seat].length));
  if (size === 0) return { received, forwarded };
  const start = SEATS.find((seat) => own[seat].length === size)!;
  let packet = own[start];
  let seat = seatTo(start, direction);
  while (seat !== start) {
    const forwardCount = size - own[seat].length;
    let keep = packet;
    let onward: Tile[] = [];
    if (forwardCount === packet.length) {
      keep = [];
      onward = packet;
    } else if (forwardCount > 0) {
      const { chosen, rest } = pickSome(packet, forwardCount, rng());
      onward = chosen;
      keep = rest;
    }
    received[seat] = keep;
    forwarded[seat] = onward;
    packet = [...own[seat], ...onward];
    seat = seatTo(seat, direction);
  }
  received[start] = packet;
  return { received, forwarded };
}

const ids = (tiles: Tile[]) => tiles.map((tile) => tile.id);

/** Moves the committed tiles and advances the phase. Only when every seat has committed. */
export function resolve(state: ExchangeState): Result {
  const direction = PASS_DIRECTION[state.phase];
  if (!direction) {
    const why = state.phase === 'done' ? '' : ' Votes and courtesy asks settle by themselves.';
    return fail('WRONG_PHASE', `There is no pass to resolve now: ${describePhase(state.phase)}.${why}`);
  }
  if (!canResolve(state)) {
    const waiting = SEATS.filter((seat) => !isCommitted(state, seat));
    return fail('NOT_READY', `Waiting for ${listSeats(waiting)} to commit before the pass can go through.`);
  }

  const own = bySeat((seat) => {
    const chosen = new Set(state.pending[seat]?.tiles ?? []);
    return state.racks[seat].filter((tile) => chosen.has(tile.id));
  });
  const blind = bySeat((seat) => state.pending[seat]?.blind ?? 0);
  const anyBlind = SEATS.some((seat) => blind[seat] > 0);
  let generator: Rng | undefined;
  const rng = () => (generator ??= rngFor(state.options.seed, 'blind', state.log.length));
  const { received, forwarded } = anyBlind ? moveBlind(own, direction, rng) : moveDirect(own, direction);

  const racks = bySeat((seat) => {
    const gone = new Set(ids(own[seat]));
    return [...state.racks[seat].filter((tile) => !gone.has(tile.id)), ...received[seat]];
  });
  const record: PassRecord = {
    phase: state.phase,
    sent: bySeat((seat) => ids(own[seat])),
    forwarded: bySeat((seat) => ids(forwarded[seat])),
    received: bySeat((seat) => ids(received[seat])),
    blind,
  };
  return {
    ok: true,
    state: {
      ...state,
      phase: afterPass(state.phase, state.options),
      racks,
      pending: {},
      history: [...state.history, record],
      log: [...state.log, { resolve: true }],
    },
  };
}

import { opaqueIds, rngFor, shuffle } from '../random';
import { SEATS, dealtRackSize, type Seat } from '../seats';
import { fullSet, type Tile } from '../tiles';
import { normalizeOptions, validateOptions } from './options';
import type { ExchangeOptions, ExchangeState } from './types';

/**
 * Deals a new exchange. The set gets seeded opaque ids; preset tiles are taken out first,
 * the rest is shuffled into the wall, and each seat is filled up to its dealt size from the
 * front of the wall, east first. Throws an Error with a readable message for impossible options.
 */
export function createExchange(options: ExchangeOptions): ExchangeState {
  const problem = validateOptions(options);
  if (problem) throw new Error(problem);
  const normal = normalizeOptions(options);

  const kinds = fullSet(normal.jokers);
  const ids = opaqueIds(normal.seed, kinds.length);
  const set: Tile[] = kinds.map((kind, index) => ({ id: ids[index], kind }));

  const racks = { east: [], south: [], west: [], north: [] } as Record<Seat, Tile[]>;
  const taken = new Set<Tile>();
  for (const seat of SEATS) {
    for (const kind of normal.racks?.[seat] ?? []) {
      const tile = set.find((candidate) => candidate.kind === kind && !taken.has(candidate));
      // validateOptions has checked that every preset fits in the set.
      taken.add(tile!);
      racks[seat].push(tile!);
    }
  }

  const wall = shuffle(
    set.filter((tile) => !taken.has(tile)),
    rngFor(normal.seed, 'deal'),
  );
  let next = 0;
  for (const seat of SEATS) {
    while (racks[seat].length < dealtRackSize(seat)) racks[seat].push(wall[next++]);
  }

  return {
    options: normal,
    phase: 'first-right',
    racks,
    wall: wall.slice(next),
    pending: {},
    votes: {},
    asks: {},
    agreed: {},
    history: [],
    log: [],
  };
}

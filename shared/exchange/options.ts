import { SEATS, dealtRackSize, isSeat, type Seat } from '../seats';
import { copiesInSet, isTileKind, tileName, type TileKind } from '../tiles';
import type { ExchangeOptions, ExchangeState } from './types';

export type NormalOptions = ExchangeState['options'];

export function seatLabel(seat: Seat): string {
  return seat[0].toUpperCase() + seat.slice(1);
}

function plural(count: number, word: string): string {
  return `${count} ${word}${count === 1 ? '' : 's'}`;
}

/**
 * Why these options cannot make an exchange, in words for the person who wrote them, or
 * null when they can. A preset rack may be partial (the engine fills it from the wall) but
 * never longer than the seat's dealt rack, and all presets together must fit in the set.
 */
export function validateOptions(options: unknown): string | null {
  if (typeof options !== 'object' || options === null) return 'Options are missing.';
  const o = options as Record<string, unknown>;
  if (typeof o.seed !== 'string' || o.seed.length === 0) return 'Give the exchange a seed (any text).';
  for (const flag of ['jokers', 'secondCharleston', 'courtesy'] as const) {
    if (o[flag] !== undefined && typeof o[flag] !== 'boolean') return `The option "${flag}" must be true or false.`;
  }
  if (o.racks === undefined) return null;
  if (typeof o.racks !== 'object' || o.racks === null || Array.isArray(o.racks)) {
    return 'Preset racks must name seats (east, south, west, north) with a list of tiles each.';
  }
  const jokers = o.jokers !== false;
  const used = new Map<TileKind, number>();
  for (const [seat, rack] of Object.entries(o.racks)) {
    if (!isSeat(seat)) return `"${seat}" is not a seat. Use east, south, west or north.`;
    if (rack === undefined) continue;
    if (!Array.isArray(rack)) return `${seatLabel(seat)}'s preset rack must be a list of tiles.`;
    const size = dealtRackSize(seat);
    if (rack.length > size) {
      return `${seatLabel(seat)}'s preset rack has ${rack.length} tiles; ${seat} holds ${size}. Remove ${plural(rack.length - size, 'tile')}.`;
    }
    for (const kind of rack) {
      if (!isTileKind(kind)) return `${seatLabel(seat)}'s preset rack lists "${String(kind)}", which is not a tile.`;
      if (kind === 'joker' && !jokers) {
        return `This exchange is dealt without jokers, but ${seat}'s preset rack holds one. Remove it or turn jokers on.`;
      }
      used.set(kind, (used.get(kind) ?? 0) + 1);
    }
  }
  for (const [kind, count] of used) {
    const available = copiesInSet(kind, jokers);
    if (count > available) {
      return `The preset racks hold ${count} × ${tileName(kind)}, but the set has only ${available}.`;
    }
  }
  return null;
}

/** Options with defaults filled in and presets copied, as the state keeps them. */
export function normalizeOptions(options: ExchangeOptions): NormalOptions {
  const normal: NormalOptions = {
    seed: options.seed,
    jokers: options.jokers !== false,
    secondCharleston: options.secondCharleston !== false,
    courtesy: options.courtesy !== false,
  };
  if (options.racks) {
    const racks: Partial<Record<Seat, TileKind[]>> = {};
    for (const seat of SEATS) {
      const rack = options.racks[seat];
      if (rack) racks[seat] = rack.slice();
    }
    normal.racks = racks;
  }
  return normal;
}

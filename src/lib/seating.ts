import { SEATS, type Direction, type Seat } from '../../shared/seats';

export type Side = 'bottom' | 'right' | 'top' | 'left';
const SIDES: readonly Side[] = ['bottom', 'right', 'top', 'left'];

/** Where a seat sits on the table drawn from above, with the viewer at the bottom (east for a watcher). */
export function sideOf(viewer: Seat | null, seat: Seat): Side {
  const me = SEATS.indexOf(viewer ?? 'east');
  return SIDES[(SEATS.indexOf(seat) - me + SEATS.length) % SEATS.length];
}

export const SIDE_WORDS: Record<Side, string> = { bottom: 'you', right: 'your right', top: 'across', left: 'your left' };
export const DIRECTION_SIDE: Record<Direction, Side> = { right: 'right', across: 'top', left: 'left' };

export function capitalise(word: string) {
  return word.charAt(0).toUpperCase() + word.slice(1);
}

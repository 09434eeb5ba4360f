/** Seats and pass directions: the one place that knows who sits where. */

/** Turn order. East is the dealer. */
export const SEATS = ['east', 'south', 'west', 'north'] as const;
export type Seat = (typeof SEATS)[number];

export type Direction = 'right' | 'across' | 'left';

/** How many seats on in turn order each direction lands. */
const STEPS: Readonly<Record<Direction, number>> = { right: 1, across: 2, left: 3 };

export function isSeat(value: unknown): value is Seat {
  return typeof value === 'string' && (SEATS as readonly string[]).includes(value);
}

/** The seat that receives what `from` passes in `direction`. */
export function seatTo(from: Seat, direction: Direction): Seat {
  return SEATS[(SEATS.indexOf(from) + STEPS[direction]) % SEATS.length];
}

/** The seat whose pass in `direction` lands at `to`. */
export function seatFrom(to: Seat, direction: Direction): Seat {
  return SEATS[(SEATS.indexOf(to) - STEPS[direction] + SEATS.length) % SEATS.length];
}

/** Rack sizes at the deal: east 14, every other seat 13. */
export const DEALER: Seat = 'east';
export const DEALER_RACK_SIZE = 14;
export const RACK_SIZE = 13;
export function dealtRackSize(seat: Seat): number {
  return seat === DEALER ? DEALER_RACK_SIZE : RACK_SIZE;
}

/** The seat a user sits in, or null: the one answer to "where is this person" for any seats record. */
export function seatOfUser(seats: Readonly<Partial<Record<Seat, { kind: string; userId?: number } | null>>>, userId: number): Seat | null {
  return SEATS.find((seat) => {
    const occupant = seats[seat];
    return occupant?.kind === 'user' && occupant.userId === userId;
  }) ?? null;
}

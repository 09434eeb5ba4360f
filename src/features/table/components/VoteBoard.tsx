import type { TableStateDto } from '../../../../shared/protocol';
import { SEATS, type Seat } from '../../../../shared/seats';
import { capitalise } from '../../../lib/seating';

/** "North (bot)", "South (Mina Castellanos)", "East (you)". */
export function seatLabel(table: TableStateDto, seat: Seat): string {
  const who = table.seats[seat].occupant;
  const name = seat === table.mySeat ? 'you' : who?.kind === 'bot' ? 'bot' : (who?.displayName ?? 'empty');
  return `${capitalise(seat)} (${name})`;
}

/** What the table decided at the vote, once it has: who stopped, or that everyone went on. */
export function voteResult(table: TableStateDto): string | null {
  const view = table.view;
  if (!view || view.phase === 'vote') return null;
  const votes = view.votes;
  const stoppers = SEATS.filter((s) => votes[s] === true);
  if (stoppers.length) return `${stoppers.map((s) => seatLabel(table, s)).join(' and ')} voted to stop: no second Charleston.`;
  if (SEATS.every((s) => votes[s] === false)) return 'Everyone voted to go on: the second Charleston passes left, across, then right.';
  return null;
}

/** Every seat's vote as it comes. */
export function VoteTally({ table }: { table: TableStateDto }) {
  const votes = table.view?.votes ?? {};
  return (
    <ul aria-label="Votes so far" className="flex flex-col gap-1">
      {SEATS.map((s) => (
        <li key={s} className="flex flex-wrap gap-x-2">
          <span className="font-semibold">{seatLabel(table, s)}:</span>
          <span>{votes[s] === undefined ? 'not voted yet' : votes[s] ? 'stop' : 'go on'}</span>
        </li>
      ))}
    </ul>
  );
}

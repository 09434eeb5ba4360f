import { SEATS, type Seat } from '../../shared/seats';
import type { TableStateDto } from '../../shared/protocol';
import { sideOf, type Side } from '../realtime/seating';
import { SeatCard } from './SeatCard';

/** Whole class strings, so Tailwind can see them. */
const AREA: Record<Side, string> = {
  top: 'sm:col-start-2 sm:row-start-1',
  left: 'sm:col-start-1 sm:row-start-2',
  right: 'sm:col-start-3 sm:row-start-2',
  bottom: 'sm:col-start-2 sm:row-start-3',
};
const READING_ORDER: readonly Side[] = ['top', 'left', 'right', 'bottom'];

/** The table from above: the viewer's seat at the bottom, the others where they sit, the pass in the middle. */
export function TableTop({ table, centre, seatExtra }: { table: TableStateDto; centre?: React.ReactNode; seatExtra?: (seat: Seat) => React.ReactNode }) {
  const playing = table.status === 'playing' && table.phase !== 'lobby' && table.phase !== 'done';
  const bySide = new Map(SEATS.map((seat) => [sideOf(table.mySeat, seat), seat]));
  const card = (side: Side) => {
    const seat = bySide.get(side)!;
    return (
      <div key={seat} className={AREA[side]}>
        <SeatCard seat={seat} side={side} viewerSeated={table.mySeat !== null} state={table.seats[seat]} playing={playing}>
          {seatExtra?.(seat)}
        </SeatCard>
      </div>
    );
  };
  return (
    <div role="group" aria-label="The table, seen from above" className="grid grid-cols-1 gap-2 rounded-card bg-accent-soft/60 p-2 sm:grid-cols-[1fr_minmax(8rem,auto)_1fr] sm:p-3">
      {READING_ORDER.slice(0, 3).map(card)}
      {centre && <div className="flex items-center justify-center sm:col-start-2 sm:row-start-2">{centre}</div>}
      {card('bottom')}
    </div>
  );
}

import { SEATS, type Seat } from '../../../../shared/seats';
import type { TableStateDto } from '../../../../shared/protocol';
import { sideOf, type Side } from '../../../lib/seating';
import { SeatCard } from './SeatCard';

/**
 * Whole class strings, so Tailwind can see them. The table spreads into three columns by its own
 * width in rem (a container query), so at a larger text size it stacks sooner instead of clipping seats.
 */
const AREA: Record<Side, string> = {
  top: '@lg:col-start-2 @lg:row-start-1',
  left: '@lg:col-start-1 @lg:row-start-2',
  right: '@lg:col-start-3 @lg:row-start-2',
  bottom: '@lg:col-start-2 @lg:row-start-3',
};
const READING_ORDER: readonly Side[] = ['top', 'left', 'right', 'bottom'];

/** The table from above: the viewer's seat at the bottom, the others where they sit, the pass in the middle. */
export function TableTop({ table, centre, seatExtra }: { table: TableStateDto; centre?: React.ReactNode; seatExtra?: (seat: Seat) => React.ReactNode }) {
  const playing = table.status === 'playing' && table.phase !== 'lobby' && table.phase !== 'done';
  const bySide = new Map(SEATS.map((seat) => [sideOf(table.mySeat, seat), seat]));
  const card = (side: Side) => {
    const seat = bySide.get(side)!;
    return (
      <div key={seat} className={`min-w-0 ${AREA[side]}`}>
        <SeatCard seat={seat} side={side} viewerSeated={table.mySeat !== null} state={table.seats[seat]} playing={playing}>
          {seatExtra?.(seat)}
        </SeatCard>
      </div>
    );
  };
  return (
    <div className="@container">
      <div role="group" aria-label="The table, seen from above" className="grid grid-cols-1 gap-2 rounded-card bg-accent-soft/60 p-2 sm:p-3 @lg:grid-cols-[minmax(0,1fr)_minmax(7rem,12rem)_minmax(0,1fr)]">
        {READING_ORDER.slice(0, 3).map(card)}
        {centre && <div className="flex min-w-0 items-center justify-center @lg:col-start-2 @lg:row-start-2">{centre}</div>}
        {card('bottom')}
      </div>
    </div>
  );
}

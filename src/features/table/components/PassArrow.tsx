import type { Direction, Seat } from '../../../../shared/seats';
import { DIRECTION_SIDE, SIDE_WORDS } from '../../../lib/seating';

const PATHS: Record<Direction, string> = {
  right: 'M50 88 C 70 80, 84 68, 88 50',
  across: 'M50 88 L 50 14',
  left: 'M50 88 C 30 80, 16 68, 12 50',
};

/** The way the tiles go, drawn across the table from the viewer at the bottom, and named in words. */
export function PassArrow({ direction, to, count }: { direction: Direction; to: Seat | null; count: number }) {
  const side = SIDE_WORDS[DIRECTION_SIDE[direction]];
  const words = `Pass ${count} ${direction === 'across' ? 'across' : `to ${side}`}${to ? ` (${to})` : ''}`;
  return (
    <figure className="flex flex-col items-center gap-1" aria-label={words} role="img">
      <svg viewBox="0 0 100 100" className="h-20 w-20 sm:h-24 sm:w-24" aria-hidden="true">
        <defs>
          <marker id={`head-${direction}`} viewBox="0 0 10 10" refX="5" refY="5" markerWidth="4" markerHeight="4" orient="auto-start-reverse">
            <path d="M0 0 L10 5 L0 10 z" fill="var(--color-accent)" />
          </marker>
        </defs>
        <path d={PATHS[direction]} fill="none" stroke="var(--color-accent)" strokeWidth={7} strokeLinecap="round" markerEnd={`url(#head-${direction})`} />
      </svg>
      <figcaption className="text-center font-semibold">{words}</figcaption>
    </figure>
  );
}

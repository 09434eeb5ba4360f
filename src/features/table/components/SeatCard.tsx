import type { SeatStateDto } from '../../../../shared/protocol';
import type { Seat } from '../../../../shared/seats';
import { capitalise, SIDE_WORDS, type Side } from '../../../lib/seating';
import { tilesWord } from '../../../lib/phase-words';

interface Props {
  seat: Seat;
  side: Side;
  /** Whether the viewer sits at this table: only then do "you" and "your left" mean anything. */
  viewerSeated: boolean;
  state: SeatStateDto;
  /** Show whether the seat has done this step (false in the lobby). */
  playing: boolean;
  children?: React.ReactNode;
}

/** One seat at the table: who sits there, where they are from the viewer, and whether they have committed. */
export function SeatCard({ seat, side, viewerSeated, state, playing, children }: Props) {
  const who = state.occupant;
  const where = !viewerSeated ? null : side === 'bottom' ? 'You' : capitalise(SIDE_WORDS[side]);
  return (
    <section aria-label={`${capitalise(seat)}: ${who?.displayName ?? 'empty seat'}`} className="flex min-w-0 flex-col gap-1 rounded-card border-2 border-line/50 bg-card px-3 py-2">
      <p className="text-sm font-semibold uppercase tracking-wide text-ink-soft">
        {capitalise(seat)}
        {where && ` · ${where}`}
      </p>
      <p className="font-semibold break-words [overflow-wrap:anywhere]">
        {who ? who.displayName : <span className="text-ink-soft">Empty seat</span>}
        {who?.kind === 'bot' && <span className="ml-2 rounded-md border border-line px-1.5 text-sm font-medium text-ink-soft">bot</span>}
        {who?.kind === 'user' && !who.connected && <span className="ml-2 text-sm font-medium text-ink-soft">(away)</span>}
      </p>
      {playing && (
        <p className="flex flex-wrap items-center gap-x-3 text-sm">
          <span>{tilesWord(state.rackSize)}</span>
          {state.committed ? (
            <span className="inline-flex items-center gap-1 rounded-md bg-accent-soft px-1.5 font-semibold text-ink">
              <span aria-hidden="true">✓</span> Ready
            </span>
          ) : (
            <span className="inline-flex items-center gap-1 text-ink-soft">
              <span aria-hidden="true">…</span> Choosing
            </span>
          )}
        </p>
      )}
      {children}
    </section>
  );
}

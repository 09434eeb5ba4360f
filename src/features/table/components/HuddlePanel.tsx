import { useState } from 'react';
import type { TableStateDto } from '../../../../shared/protocol';
import { SEATS, type Seat } from '../../../../shared/seats';
import { Button } from '../../../components/ui/Button';
import { Rack } from '../../../components/ui/Rack';
import { capitalise } from '../../../lib/seating';

interface Props {
  table: TableStateDto;
  busy: boolean;
  onCall: () => void;
  onReveal: (seat: Seat) => void;
  onNote: (text: string, seat?: Seat) => Promise<boolean>;
  onRelease: () => void;
}

function nameOf(table: TableStateDto, seat: Seat) {
  return table.seats[seat].occupant?.displayName ?? capitalise(seat);
}

/** The huddle: a banner for everyone while a pass is held, the revealed racks, the notes, and the host's controls. */
export function HuddlePanel({ table, busy, onCall, onReveal, onNote, onRelease }: Props) {
  const [text, setText] = useState('');
  const [about, setAbout] = useState<Seat | ''>('');
  const huddle = table.huddle;
  const passing = table.view && !['vote', 'courtesy-ask', 'done'].includes(table.view.phase);
  if (!huddle.open && !(table.isHost && passing) && huddle.notes.length === 0) return null;

  return (
    <section aria-labelledby="huddle-title" className={`flex flex-col gap-3 rounded-card border-2 p-4 ${huddle.open ? 'border-received bg-received-soft' : 'border-line/60 bg-card'}`}>
      <h2 id="huddle-title" className="flex items-center gap-2 text-lead font-semibold">
        {huddle.open && (
          <svg aria-hidden="true" viewBox="0 0 20 20" className="h-6 w-6">
            <rect x={4} y={3} width={4} height={14} rx={1} fill="currentColor" />
            <rect x={12} y={3} width={4} height={14} rx={1} fill="currentColor" />
          </svg>
        )}
        {huddle.open ? 'This pass is on hold' : table.isHost && passing ? 'Hold this pass' : 'Notes from the huddle'}
      </h2>
      {huddle.open ? (
        <p role="status">
          {table.isHost
            ? 'No tiles move until you let the pass go. Show a seat to the table, write a note, and let players take back a pass to revise it.'
            : 'The host has paused the table to talk this pass over before any tiles move. You may take back your pass and choose again until the host lets it go.'}
        </p>
      ) : (
        table.isHost && <p>Pause before the tiles move, to look at each seat's choice together.</p>
      )}

      {SEATS.filter((s) => huddle.revealed[s]).map((seat) => {
        const shown = huddle.revealed[seat]!;
        return (
          <div key={seat} className="flex flex-col gap-1">
            <h3 className="font-semibold">
              {nameOf(table, seat)} ({seat}){shown.pass ? ` is passing ${shown.pass.tiles.length} of their own${shown.pass.blind ? ` and ${shown.pass.blind} blind` : ''}` : ' has not chosen yet'}
            </h3>
            <Rack label={`Rack of ${nameOf(table, seat)}`} tiles={shown.rack} sending={shown.pass?.tiles ?? []} size="small" />
          </div>
        );
      })}

      {huddle.notes.length > 0 && (
        <div>
          <h3 className="font-semibold">Notes</h3>
          <ul className="flex flex-col gap-1">
            {huddle.notes.map((n) => (
              <li key={n.id} className="rounded-md bg-card px-2 py-1">
                <span className="font-semibold">{n.authorName}</span>
                {n.seat && <span className="text-ink-soft"> on {n.seat}</span>}: {n.text}
              </li>
            ))}
          </ul>
        </div>
      )}

      {table.isHost && !huddle.open && passing && (
        <div>
          <Button onClick={onCall} disabled={busy}>
            Hold this pass
          </Button>
        </div>
      )}
      {table.isHost && huddle.open && (
        <div className="flex flex-col gap-3">
          <div role="group" aria-label="Show a seat to the table" className="flex flex-wrap gap-2">
            {SEATS.map((seat) => (
              <Button key={seat} onClick={() => onReveal(seat)} disabled={busy || Boolean(huddle.revealed[seat])} aria-pressed={Boolean(huddle.revealed[seat])}>
                {huddle.revealed[seat] ? `${capitalise(seat)} shown` : `Show ${seat}`}
              </Button>
            ))}
          </div>
          <form
            className="flex flex-col gap-2"
            onSubmit={async (e) => {
              e.preventDefault();
              if (await onNote(text, about || undefined)) setText('');
            }}
          >
            <label htmlFor="huddle-note" className="font-medium">
              Note for the table
            </label>
            <textarea id="huddle-note" value={text} onChange={(e) => setText(e.target.value)} rows={2} className="rounded-lg border-2 border-line bg-card px-3 py-2" />
            <div className="flex flex-wrap items-end gap-2">
              <label className="flex flex-col gap-1 font-medium">
                About
                <select value={about} onChange={(e) => setAbout(e.target.value as Seat | '')} className="min-h-11 rounded-lg border-2 border-line bg-card px-2">
                  <option value="">The whole table</option>
                  {SEATS.map((s) => (
                    <option key={s} value={s}>
                      {capitalise(s)}
                    </option>
                  ))}
                </select>
              </label>
              <Button type="submit" disabled={busy || !text.trim()}>
                Add note
              </Button>
            </div>
          </form>
          <div>
            <Button kind="primary" onClick={onRelease} disabled={busy}>
              Let the pass go
            </Button>
          </div>
        </div>
      )}
    </section>
  );
}

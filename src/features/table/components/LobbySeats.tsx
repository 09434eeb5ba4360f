import { useState } from 'react';
import { BOT_STRATEGIES } from '../../../../shared/analysis';
import type { TableStateDto } from '../../../../shared/protocol';
import { SEATS, type Seat } from '../../../../shared/seats';
import { capitalise } from '../../../lib/seating';
import { Button } from '../../../components/ui/Button';
import { TableTop } from './TableTop';

interface Props {
  table: TableStateDto;
  busy: boolean;
  onSit: (seat: Seat) => void;
  onStand: () => void;
  onBot: (seat: Seat, strategy: string) => void;
  onStart: () => void;
}

function BotPicker({ seat, busy, onBot }: { seat: Seat; busy: boolean; onBot: Props['onBot'] }) {
  const [strategy, setStrategy] = useState(BOT_STRATEGIES[BOT_STRATEGIES.length - 1].id);
  return (
    <div className="flex flex-wrap items-end gap-2">
      <label className="flex flex-col text-sm font-medium">
        Bot for {seat}
        <select value={strategy} onChange={(e) => setStrategy(e.target.value as typeof strategy)} className="min-h-11 rounded-lg border-2 border-line bg-card px-2 text-base">
          {BOT_STRATEGIES.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </label>
      <Button onClick={() => onBot(seat, strategy)} disabled={busy} aria-label={`Seat a bot at ${seat}`}>
        Seat a bot
      </Button>
    </div>
  );
}

/** Before the deal: pick a seat, the host fills empty seats with bots and starts. */
export function LobbySeats({ table, busy, onSit, onStand, onBot, onStart }: Props) {
  const full = SEATS.every((s) => table.seats[s].occupant);
  const link = `${window.location.origin}/tables/${table.tableId}${table.inviteCode ? `?invite=${table.inviteCode}` : ''}`;
  return (
    <div className="flex flex-col gap-4">
      <TableTop
        table={table}
        centre={<p className="text-center font-semibold text-ink-soft">{full ? 'All four seats are taken.' : 'Pick a seat.'}</p>}
        seatExtra={(seat) => {
          const occupant = table.seats[seat].occupant;
          if (table.mySeat === seat)
            return (
              <Button onClick={onStand} disabled={busy}>
                Stand up
              </Button>
            );
          if (occupant) return null;
          return (
            <div className="flex flex-col gap-2">
              {!table.mySeat && (
                <Button onClick={() => onSit(seat)} disabled={busy} aria-label={`Sit at ${seat}`}>
                  Sit here
                </Button>
              )}
              {table.isHost && <BotPicker seat={seat} busy={busy} onBot={onBot} />}
            </div>
          );
        }}
      />
      <p className="break-all">
        <span className="font-semibold">{table.inviteCode ? 'Invite link (this table is private): ' : 'Link to this table: '}</span>
        <a href={link}>{link}</a>
      </p>
      {table.isHost ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button kind="primary" onClick={onStart} disabled={busy || !full}>
            Deal and start the Charleston
          </Button>
          {!full && <p className="text-ink-soft">Fill every seat, with players or bots, to start.</p>}
        </div>
      ) : (
        <p className="text-ink-soft">The host deals once all four seats are filled.</p>
      )}
      <p className="sr-only" aria-live="polite">
        {SEATS.map((s) => `${capitalise(s)}: ${table.seats[s].occupant?.displayName ?? 'empty'}`).join('. ')}
      </p>
    </div>
  );
}

import { useId } from 'react';
import type { CourtesyCount } from '../../../../shared/exchange';
import type { TableStateDto } from '../../../../shared/protocol';
import { SEATS } from '../../../../shared/seats';
import { Button } from '../../../components/ui/Button';
import { tilesWord } from '../../../lib/phase-words';

export interface PassHandlers {
  onSend: () => void;
  onWithdraw: () => void;
  onVote: (stop: boolean) => void;
  onAsk: (count: CourtesyCount) => void;
  onBlind: (blind: number) => void;
}

interface Props extends PassHandlers {
  table: TableStateDto;
  picked: readonly string[];
  blind: number;
  ask: CourtesyCount | null;
  onAskChoice: (count: CourtesyCount) => void;
  busy: boolean;
}

function Waiting({ table, what, onWithdraw, busy, canWithdraw = true }: { table: TableStateDto; what: string; onWithdraw: () => void; busy: boolean; canWithdraw?: boolean }) {
  const left = SEATS.filter((s) => !table.seats[s].committed).length;
  return (
    <div className="flex flex-col gap-3">
      <p className="flex items-center gap-2 font-semibold">
        <span aria-hidden="true" className="inline-flex h-7 w-7 items-center justify-center rounded-full bg-accent-soft">✓</span>
        {what} {left > 0 ? `Waiting for ${left} more ${left === 1 ? 'seat' : 'seats'}.` : 'Everyone is ready.'}
      </p>
      {canWithdraw && (
        <div>
          <Button onClick={onWithdraw} disabled={busy}>
            Take back my choice
          </Button>
        </div>
      )}
    </div>
  );
}

function Choice({ name, legend, value, options, onChange, hint }: { name: string; legend: string; value: number; options: { value: number; label: string }[]; onChange: (n: number) => void; hint?: string }) {
  const id = useId();
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={hint ? `${id}-hint` : undefined}>
      <legend className="font-semibold">{legend}</legend>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-ink-soft">
          {hint}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        {options.map((o) => (
          <label key={o.value} className={`flex min-h-11 cursor-pointer items-center gap-2 rounded-lg border-2 px-3 ${value === o.value ? 'border-ink bg-paper font-semibold' : 'border-line/60'}`}>
            <input type="radio" name={name} value={o.value} checked={value === o.value} onChange={() => onChange(o.value)} className="h-5 w-5 accent-accent" />
            {o.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** What the viewer can do in this step: send a pass, vote, ask for courtesy tiles, or wait. */
export function PassPanel({ table, picked, blind, ask, onAskChoice, busy, onSend, onWithdraw, onVote, onAsk, onBlind }: Props) {
  const view = table.view;
  const me = table.mySeat;
  if (!view || !me) return <p className="text-ink-soft">You are watching this table.</p>;
  const committed = table.seats[me].committed;
  const phase = view.phase;

  if (phase === 'done') return null;

  if (phase === 'vote') {
    if (committed) {
      const stop = view.votes[me];
      return <Waiting table={table} what={stop ? 'You asked to stop after this round.' : 'You voted for a second Charleston.'} onWithdraw={onWithdraw} busy={busy} canWithdraw={stop === false} />;
    }
    return (
      <div className="flex flex-col gap-3">
        <p>The first Charleston is done. One vote to stop ends it; otherwise the second Charleston passes left, across, then right.</p>
        <div className="flex flex-wrap gap-3">
          <Button onClick={() => onVote(true)} disabled={busy}>
            Stop after this round
          </Button>
          <Button onClick={() => onVote(false)} disabled={busy}>
            Play a second Charleston
          </Button>
        </div>
      </div>
    );
  }

  if (phase === 'courtesy-ask') {
    if (committed) return <Waiting table={table} what={`You asked for ${tilesWord(view.asks[me] ?? 0)}.`} onWithdraw={onWithdraw} busy={busy} />;
    const value = ask ?? 0;
    return (
      <div className="flex flex-col gap-3">
        <Choice
          name="courtesy-ask"
          legend="How many tiles would you like to swap with the seat across?"
          hint="You and the seat across each ask; the lower number is swapped. No jokers."
          value={value}
          options={[0, 1, 2, 3].map((n) => ({ value: n, label: n === 0 ? 'None' : tilesWord(n) }))}
          onChange={(n) => onAskChoice(n as CourtesyCount)}
        />
        <div>
          <Button kind="primary" onClick={() => onAsk(value)} disabled={busy}>
            Ask for {value === 0 ? 'no tiles' : tilesWord(value)}
          </Button>
        </div>
      </div>
    );
  }

  const size = view.passSize;
  if (size === 0) return <p className="font-semibold">Your pair agreed on no tiles, so you have nothing to send. Waiting for the other pair.</p>;
  if (committed) {
    const mine = view.pending[me];
    const what = mine && mine.blind > 0 ? `Your pass is in: ${tilesWord(mine.tiles.length)} of yours and ${mine.blind} blind.` : 'Your pass is in.';
    return <Waiting table={table} what={what} onWithdraw={onWithdraw} busy={busy} />;
  }
  const own = size - blind;
  const missing = own - picked.length;
  return (
    <div className="flex flex-col gap-3">
      {view.blindAllowed && (
        <Choice
          name="blind"
          legend="Pass any tiles blind?"
          hint="On this pass you may send on 1, 2 or 3 of the tiles arriving now, unseen, and fewer of your own."
          value={blind}
          options={[0, 1, 2, 3].map((n) => ({ value: n, label: n === 0 ? 'No, all mine' : `${n} blind` }))}
          onChange={onBlind}
        />
      )}
      <p aria-live="polite" className="font-medium">
        {own === 0 ? 'All three go blind: nothing to pick.' : missing > 0 ? `Pick ${missing} more ${missing === 1 ? 'tile' : 'tiles'} from your rack.` : 'Ready to send. Press Enter on the rack or the button.'}
      </p>
      <div>
        <Button kind="primary" onClick={onSend} disabled={busy || missing !== 0}>
          Send {tilesWord(size)}
        </Button>
      </div>
    </div>
  );
}

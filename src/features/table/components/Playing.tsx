import { useState } from 'react';
import { Link } from 'react-router-dom';
import { isPassPhase, PASS_DIRECTION, type CourtesyCount } from '../../../../shared/exchange';
import type { TableStateDto } from '../../../../shared/protocol';
import { SEATS, seatTo } from '../../../../shared/seats';
import { Button } from '../../../components/ui/Button';
import { Rack } from '../../../components/ui/Rack';
import { useMe } from '../../../lib/api/auth';
import { useTableStore } from '../api/table-store';
import type { RunTableAction } from '../api/use-table-actions';
import { stepKey, type usePicks } from '../picks';
import { useRackOrder } from '../rack-order';
import { HuddlePanel } from './HuddlePanel';
import { PassArrow } from './PassArrow';
import { PassPanel } from './PassPanel';
import { TableTop } from './TableTop';
import { VoteTally, voteResult } from './VoteBoard';

/** The table once dealt: the vote, the seats around the table, the rack with its picks and the pass, the huddle, and what comes after. */
export function Playing({ table, run, busy, pick, setPick }: { table: TableStateDto; run: RunTableAction; busy: boolean } & ReturnType<typeof usePicks>) {
  const view = table.view!;
  const me = table.mySeat;
  const key = stepKey(table);
  const [ask, setAsk] = useState<CourtesyCount | null>(null);
  const [said, setSaidFor] = useState({ key: '', text: '' });
  // A message belongs to the step it was said in: the next pass starts with none.
  const saidNow = said.key === key ? said.text : '';
  const setSaid = (text: string) => setSaidFor({ key, text });
  const committedNow = me ? table.seats[me].committed : false;
  const picked = pick.key === key && !committedNow ? pick.ids : [];
  const blind = pick.key === key ? pick.blind : 0;
  const order = useRackOrder(table.myRack);
  const announcement = useTableStore((s) => s.announcement);

  const committed = committedNow;
  const passing = isPassPhase(view.phase) && view.passSize > 0;
  const own = view.passSize - blind;
  const canPick = Boolean(me) && passing && !committed && own > 0;
  const direction = PASS_DIRECTION[view.phase];
  const version = table.version;
  const huddle = (
    <HuddlePanel
      table={table}
      busy={busy}
      onCall={() => void run('huddle:call', {})}
      onReveal={(seat) => void run('huddle:reveal', { seat })}
      onNote={(text, seat) => run('huddle:note', { text, seat })}
      onRelease={() => void run('huddle:release', {})}
    />
  );

  const togglePick = (id: string) => {
    setSaid('');
    const ids = picked.includes(id) ? picked.filter((x) => x !== id) : picked.length < own ? [...picked, id] : picked;
    if (ids === picked && !picked.includes(id)) setSaid(`You have picked ${own} already. Put one back first (Space on a picked tile).`);
    setPick({ key, ids, blind });
  };
  const sendPass = () => {
    if (!canPick || picked.length !== own) return;
    void run('exchange:act', { action: { type: 'pass', tiles: picked, blind: blind || undefined }, version });
  };

  const decided = voteResult(table);
  const userId = useMe().data?.id;
  const standIn = table.mySeat ? null : (SEATS.find((s) => { const o = table.seats[s].occupant; return o?.kind === 'bot' && o.standsInFor?.userId === userId; }) ?? null);
  return (
    <div className="flex flex-col gap-4">
      {view.phase === 'vote' && (
        <section aria-labelledby="vote-title" className="flex flex-col gap-2 rounded-card border border-line/60 bg-card p-3 sm:p-4">
          <h2 id="vote-title" className="text-lead font-semibold">
            The vote on a second Charleston
          </h2>
          <VoteTally table={table} />
        </section>
      )}
      {decided && (
        <p role="status" className="rounded-card border-2 border-ink/30 bg-card px-4 py-2 font-semibold">
          {decided}
        </p>
      )}
      {standIn && (
        <div className="flex flex-wrap items-center gap-3 rounded-card border-2 border-accent bg-accent-soft p-3">
          <p className="font-semibold">A bot kept your {standIn} seat while you were away.</p>
          <Button kind="primary" disabled={busy} onClick={() => void run('table:sit', { seat: standIn })}>
            Take back your seat
          </Button>
        </div>
      )}
      <TableTop
        table={table}
        seatExtra={(seat) => {
          const who = table.seats[seat].occupant;
          if (!table.isHost || table.status !== 'playing' || who?.kind !== 'user' || who.connected) return null;
          return (
            <Button disabled={busy} onClick={() => void run('table:bot', { seat, strategy: 'advised' })}>
              Hand the {seat} seat to a bot
            </Button>
          );
        }}
        centre={direction && view.passSize > 0 ? <PassArrow direction={direction} to={me ? seatTo(me, direction) : null} count={view.passSize} /> : null} />
      {table.huddle.open && huddle}
      {me && (
        <section aria-labelledby="rack-title" className="flex flex-col gap-3 rounded-card border border-line/60 bg-card p-3 sm:p-4">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h2 id="rack-title" className="text-lead font-semibold">
              Your rack ({table.myRack.length})
            </h2>
            <div role="group" aria-label="Sort the rack" className="flex gap-2">
              <Button onClick={() => order.sortBy('suit')}>By suit</Button>
              <Button onClick={() => order.sortBy('number')}>By number</Button>
            </div>
          </div>
          <p className="text-sm text-ink-soft">
            {canPick ? 'Arrow keys move along the rack, Space picks a tile, Enter sends, Escape clears. Shift with an arrow moves a tile; you can also drag.' : 'Shift with an arrow, or dragging, moves a tile.'}
          </p>
          <Rack
            label="Your rack"
            tiles={order.tiles}
            picked={picked}
            received={view.received[me]?.map((t) => t.id) ?? []}
            sending={view.pending[me]?.tiles ?? []}
            canPick={canPick}
            onPick={togglePick}
            onCommit={sendPass}
            onClear={() => setPick({ key, ids: [], blind })}
            onMove={order.move}
            onSay={setSaid}
          />
          <p role="status" className="min-h-6 font-medium">
            {saidNow}
          </p>
          <p role="status" className="font-medium text-received">
            {announcement}
          </p>
          <PassPanel
            table={table}
            picked={picked}
            blind={blind}
            ask={ask}
            onAskChoice={setAsk}
            busy={busy}
            onSend={sendPass}
            onWithdraw={() => void run('exchange:act', { action: { type: 'withdraw' }, version })}
            onVote={(stop) => void run('exchange:act', { action: { type: 'vote', stop }, version })}
            onAsk={(count) => void run('exchange:act', { action: { type: 'courtesy-ask', count }, version })}
            onBlind={(n) => setPick({ key, ids: picked.slice(0, view.passSize - n), blind: n })}
          />
        </section>
      )}
      {!me && SEATS.some((s) => view.racks[s]) && (
        <section aria-labelledby="all-racks" className="flex flex-col gap-3 rounded-card border border-line/60 bg-card p-3 sm:p-4">
          <h2 id="all-racks" className="text-lead font-semibold">
            Every rack
          </h2>
          {SEATS.filter((s) => view.racks[s]).map((s) => (
            <div key={s} className="flex flex-col gap-1">
              <h3 className="font-semibold">
                {table.seats[s].occupant?.displayName ?? s} ({s})
              </h3>
              <Rack label={`Rack of ${table.seats[s].occupant?.displayName ?? s}`} tiles={view.racks[s]!} sending={view.pending[s]?.tiles ?? []} received={view.received[s]?.map((t) => t.id) ?? []} size="small" />
            </div>
          ))}
        </section>
      )}
      {!table.huddle.open && huddle}
      {view.phase === 'done' && table.exchangeId && (
        <div className="flex flex-col gap-3 rounded-card border-2 border-accent bg-accent-soft p-4">
          <p className="font-semibold">
            The Charleston is over. <Link to={`/replays/${table.exchangeId}`}>Replay this exchange pass by pass</Link>
          </p>
          {table.status === 'closed' ? (
            <p>
              The host closed this table. Its exchanges are in <Link to="/history">My exchanges</Link>.
            </p>
          ) : table.isHost ? (
            <div className="flex flex-wrap gap-3">
              <Button kind="primary" disabled={busy} onClick={() => void run('table:start', {})}>
                Deal again
              </Button>
              <Button disabled={busy} onClick={() => void run('table:close', {})}>
                Close the table
              </Button>
            </div>
          ) : (
            <p>The same seats play the next deal when the host deals again.</p>
          )}
        </div>
      )}
    </div>
  );
}

/**
 * The table page: joining, the lobby, play (picks kept per tab, the vote, deal again, hand-offs)
 * and the panel beside the rack. Long because play and the page share one file for now.
 */
import { useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useShallow } from 'zustand/react/shallow';
import { isPassPhase, PASS_DIRECTION, type CourtesyCount } from '../../../../shared/exchange';
import type { ClientEventName, ClientPayload, TableStateDto } from '../../../../shared/protocol';
import type { TileKind } from '../../../../shared/tiles';
import { SEATS, seatTo } from '../../../../shared/seats';
import { useMe } from '../../../lib/api/auth';
import { tablePatternsQuery } from '../api/table-patterns';
import { AnalysisPanel } from '../components/AnalysisPanel';
import { Button } from '../../../components/ui/Button';
import { Chat } from '../components/Chat';
import { FormMessage } from '../../../components/ui/FormMessage';
import { HuddlePanel } from '../components/HuddlePanel';
import { LobbySeats } from '../components/LobbySeats';
import { PassArrow } from '../components/PassArrow';
import { PassPanel } from '../components/PassPanel';
import { PHASE_TITLES } from '../../../lib/phase-words';
import { Rack } from '../../../components/ui/Rack';
import { useRackOrder } from '../rack-order';
import { TableTop } from '../components/TableTop';
import { joinTable, leaveTable, send } from '../api/socket';
import { useTableStore } from '../api/table-store';
import { VoteTally, voteResult } from '../components/VoteBoard';
import { SignInFirst } from '../../../components/ui/SignInFirst';

function stepKey(table: TableStateDto) {
  return `${table.exchangeId}:${table.view?.phase}:${table.view?.history.length}`;
}

interface Picks {
  key: string;
  ids: string[];
  blind: number;
}

const picksKey = (tableId: string) => `rackside:picks:${tableId}`;

function storedPicks(tableId: string): Picks {
  try {
    const raw = JSON.parse(sessionStorage.getItem(picksKey(tableId)) ?? 'null') as Partial<Picks> | null;
    if (raw && typeof raw.key === 'string' && Array.isArray(raw.ids) && raw.ids.every((x) => typeof x === 'string') && typeof raw.blind === 'number') {
      return { key: raw.key, ids: raw.ids, blind: raw.blind };
    }
  } catch {
    // Nothing kept, or something unreadable: start with no picks.
  }
  return { key: '', ids: [], blind: 0 };
}

function keepPicks(tableId: string, picks: Picks) {
  try {
    sessionStorage.setItem(picksKey(tableId), JSON.stringify(picks));
  } catch {
    // Storage full or off: the picks live only on this page.
  }
}

function useActions() {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function run<E extends ClientEventName>(event: E, payload: ClientPayload<E>): Promise<boolean> {
    setBusy(true);
    setError(null);
    const ack = await send(event, payload);
    setBusy(false);
    if (!ack.ok) setError(ack.message);
    return ack.ok;
  }
  return { busy, error, run };
}

/** The picks of a pass, kept in this browser tab until it resolves: a refresh or the back button keeps them. */
function usePicks(tableId: string) {
  const [pick, setPickState] = useState<Picks>(() => storedPicks(tableId));
  const setPick = (next: Picks) => {
    setPickState(next);
    keepPicks(tableId, next);
  };
  return { pick, setPick };
}

/** The rack's tile ids for an advised pass's kinds (never a joker, each tile once). */
function idsFor(rack: TableStateDto['myRack'], kinds: readonly TileKind[]): string[] {
  const used = new Set<string>();
  return kinds.flatMap((kind) => {
    const tile = rack.find((t) => t.kind === kind && t.kind !== 'joker' && !used.has(t.id));
    if (!tile) return [];
    used.add(tile.id);
    return [tile.id];
  });
}

function Playing({ table, run, busy, pick, setPick }: { table: TableStateDto; run: ReturnType<typeof useActions>['run']; busy: boolean } & ReturnType<typeof usePicks>) {
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

export function TablePage() {
  const { id = '' } = useParams();
  const [params] = useSearchParams();
  const invite = params.get('invite') ?? undefined;
  const { data: me, isPending } = useMe();
  const userId = me?.id;
  const { table, chat, connection, problem } = useTableStore(useShallow((s) => ({ table: s.table, chat: s.chat, connection: s.connection, problem: s.problem })));
  const [joinError, setJoinError] = useState<string | null>(null);
  const { busy, error, run } = useActions();
  const { pick, setPick } = usePicks(id);
  // The table's own list; the panel judges by the starter list until it loads.
  const list = useQuery({ ...tablePatternsQuery(id, invite), enabled: Boolean(userId && id) });

  useEffect(() => {
    if (!userId || !id) return;
    let live = true;
    void joinTable(id, invite).then((ack) => {
      if (live && !ack.ok) setJoinError(ack.message);
    });
    return () => {
      live = false;
      leaveTable();
    };
  }, [userId, id, invite]);

  if (isPending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  if (joinError) return <FormMessage error>{joinError}</FormMessage>;
  if (!table || table.tableId !== id) return <p role="status">{problem ?? 'Joining the table…'}</p>;

  const hand = table.myRack.map((t) => t.kind);
  const view = table.view;
  const adviceHidden = table.options.hideAdvice && !table.isHost;
  return (
    <div className="flex flex-col gap-4">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-title font-semibold">{table.name}</h1>
        <p className="flex flex-wrap items-center gap-3">
          <span className="rounded-md border-2 border-ink/20 px-2 font-semibold">{PHASE_TITLES[table.phase]}</span>
          {connection !== 'online' && <span role="status" className="text-danger">{problem ?? 'Connecting…'}</span>}
        </p>
      </header>
      {error && <FormMessage error>{error}</FormMessage>}
      {table.options.teaching && (
        <p role="note" className="rounded-card border-2 border-ink/30 bg-card px-4 py-2 font-medium">
          {table.isHost ? 'Teaching table: you see every rack, and every seat is told so.' : 'Teaching table: the host sees every rack at this table, yours included.'}
        </p>
      )}
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0">
          {table.status === 'lobby' || !view ? (
            <LobbySeats
              table={table}
              busy={busy}
              onSit={(seat) => void run('table:sit', { seat })}
              onStand={() => void run('table:stand', {})}
              onBot={(seat, strategy) => void run('table:bot', { seat, strategy })}
              onStart={() => void run('table:start', {})}
            />
          ) : (
            <Playing table={table} run={run} busy={busy} pick={pick} setPick={setPick} />
          )}
        </div>
        <aside className="flex min-w-0 flex-col gap-4" aria-label="Beside the table">
          {view && hand.length > 0 && (
            <AnalysisPanel
              hand={hand}
              adviceHidden={adviceHidden}
              patterns={list.data?.patterns}
              seen={table.mySeat ? { seat: table.mySeat, history: view.history, kinds: view.kinds } : undefined}
              onPick={
                table.mySeat && !table.seats[table.mySeat].committed
                  ? (kinds, blind) => setPick({ key: stepKey(table), ids: idsFor(table.myRack, kinds), blind })
                  : undefined
              }
              pass={isPassPhase(view.phase) && view.passSize > 0 && !(table.mySeat && table.seats[table.mySeat].committed) ? { phase: view.phase, blindAllowed: view.blindAllowed, count: view.passSize } : null}
            />
          )}
          {table.isHost && view && (
            <label className="flex min-h-12 items-center gap-3 rounded-card border border-line/60 bg-card px-4 py-2">
              <input
                type="checkbox"
                className="size-6"
                checked={table.options.hideAdvice}
                disabled={busy}
                onChange={(e) => void run('table:advice', { hidden: e.target.checked })}
              />
              <span>Hide the advice from the players</span>
            </label>
          )}
          <Chat messages={chat} onSend={(text) => run('chat:send', { text })} />
        </aside>
      </div>
    </div>
  );
}

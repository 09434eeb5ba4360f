import { useQuery } from '@tanstack/react-query';
import { useParams, useSearchParams } from 'react-router-dom';
import { useShallow } from 'zustand/react/shallow';
import { isPassPhase } from '../../../../shared/exchange';
import { FormMessage } from '../../../components/ui/FormMessage';
import { SignInFirst } from '../../../components/ui/SignInFirst';
import { useMe } from '../../../lib/api/auth';
import { PHASE_TITLES } from '../../../lib/phase-words';
import { tablePatternsQuery } from '../api/table-patterns';
import { useTableStore } from '../api/table-store';
import { useJoinedTable } from '../api/use-joined-table';
import { useTableActions } from '../api/use-table-actions';
import { AnalysisPanel } from '../components/AnalysisPanel';
import { Chat } from '../components/Chat';
import { LobbySeats } from '../components/LobbySeats';
import { Playing } from '../components/Playing';
import { idsFor, stepKey, usePicks } from '../picks';

/** The table page: joining over the socket, then the lobby or play, with the analysis and the chat beside. */
export function TablePage() {
  const { id = '' } = useParams();
  const [params] = useSearchParams();
  const invite = params.get('invite') ?? undefined;
  const { data: me, isPending } = useMe();
  const userId = me?.id;
  const { table, chat, connection, problem } = useTableStore(useShallow((s) => ({ table: s.table, chat: s.chat, connection: s.connection, problem: s.problem })));
  const { busy, error, run } = useTableActions();
  const { pick, setPick } = usePicks(id);
  // The table's own list; the panel judges by the starter list until it loads.
  const list = useQuery({ ...tablePatternsQuery(id, invite), enabled: Boolean(userId && id) });
  const joinError = useJoinedTable(userId, id, invite);

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

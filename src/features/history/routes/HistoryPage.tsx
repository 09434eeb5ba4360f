import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import type { ExchangeSummaryDto } from '../../../../shared/protocol';
import { useMe } from '../../../lib/api/auth';
import { useExchanges } from '../api/exchanges';
import { Button } from '../../../components/ui/Button';
import { SignInFirst } from '../../../components/ui/SignInFirst';
import { oddsWord } from '../../../lib/phase-words';

const PAGE_SIZE = 10;

interface Row {
  summary: ExchangeSummaryDto;
  before: number | null;
  after: number | null;
  nearest: string | null;
}

type Column = 'date' | 'table' | 'seat' | 'before' | 'after' | 'nearest';
const COLUMNS: { key: Column; label: string }[] = [
  { key: 'date', label: 'Date' },
  { key: 'table', label: 'Table' },
  { key: 'seat', label: 'Seat' },
  { key: 'before', label: 'Tiles away at the deal' },
  { key: 'after', label: 'Tiles away at the end' },
  { key: 'nearest', label: 'Ended nearest' },
];

function valueOf(row: Row, column: Column): string | number {
  switch (column) {
    case 'date':
      return row.summary.startedAt;
    case 'table':
      return row.summary.tableName.toLowerCase();
    case 'seat':
      return row.summary.seat ?? '';
    case 'before':
      return row.before ?? 99;
    case 'after':
      return row.after ?? 99;
    case 'nearest':
      return row.nearest ?? '~';
  }
}

/** "8 · 3% to finish": tiles away, and the odds of finishing the likeliest pattern. */
function withOdds(away: number | null, odds: number | null | undefined) {
  if (away === null) return '—';
  if (odds === null || odds === undefined) return String(away);
  return `${away} · ${oddsWord(odds)} to finish`;
}

export function HistoryPage() {
  const { data: me, isPending: mePending } = useMe();
  const exchanges = useExchanges();
  const [sort, setSort] = useState<{ column: Column; descending: boolean }>({ column: 'date', descending: true });
  const [page, setPage] = useState(0);
  // The server works out the figures with each table's own pattern list.
  const rows = useMemo(
    () => (exchanges.data ?? []).map((summary): Row => ({ summary, before: summary.awayBefore ?? null, after: summary.awayAfter ?? null, nearest: summary.nearestPattern ?? null })),
    [exchanges.data],
  );

  if (mePending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  if (exchanges.isPending) return <p role="status">Loading your exchanges…</p>;
  if (exchanges.error) return <p role="alert">Your exchanges could not be loaded. Please reload the page.</p>;

  const sorted = rows.slice().sort((a, b) => {
    const x = valueOf(a, sort.column);
    const y = valueOf(b, sort.column);
    const order = x < y ? -1 : x > y ? 1 : 0;
    return sort.descending ? -order : order;
  });
  const pages = Math.max(1, Math.ceil(sorted.length / PAGE_SIZE));
  const current = Math.min(page, pages - 1);
  const shown = sorted.slice(current * PAGE_SIZE, current * PAGE_SIZE + PAGE_SIZE);
  const sortBy = (column: Column) => {
    setSort((s) => ({ column, descending: s.column === column ? !s.descending : column === 'date' }));
    setPage(0);
  };

  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-title font-semibold">My exchanges</h1>
      {rows.length === 0 ? (
        <p>
          No exchanges yet. <Link to="/">Sit at a table</Link> to play one.
        </p>
      ) : (
        <>
          <div role="region" aria-label="My exchanges (scrolls sideways on a narrow screen)" tabIndex={0} className="relative max-w-full overflow-x-auto rounded-card border border-line/60 bg-card">
            <table className="w-full text-left text-base">
              <caption className="sr-only">My exchanges, sorted by {COLUMNS.find((c) => c.key === sort.column)!.label.toLowerCase()}</caption>
              <thead>
                <tr className="border-b-2 border-line/60">
                  {COLUMNS.map((c) => (
                    <th key={c.key} scope="col" aria-sort={sort.column === c.key ? (sort.descending ? 'descending' : 'ascending') : undefined} className="p-2">
                      <button type="button" onClick={() => sortBy(c.key)} className="min-h-10 rounded-md px-1 text-left font-semibold hover:bg-accent-soft">
                        {c.label}
                        <span aria-hidden="true">{sort.column === c.key ? (sort.descending ? ' ▼' : ' ▲') : ''}</span>
                      </button>
                    </th>
                  ))}
                  <th scope="col" className="p-2">
                    <span className="sr-only">Replay and compare</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {shown.map((row) => (
                  <tr key={row.summary.id} className="border-b border-line/30">
                    <td className="p-2">{new Date(row.summary.startedAt).toLocaleDateString()}</td>
                    <td className="min-w-[8rem] p-2 break-words [overflow-wrap:anywhere]">{row.summary.tableName}</td>
                    <td className="p-2">{row.summary.seat ?? 'host'}</td>
                    <td className="p-2">{withOdds(row.before, row.summary.oddsBefore)}</td>
                    <td className="p-2">{withOdds(row.after, row.summary.oddsAfter)}</td>
                    <td className="p-2">{row.nearest ?? '—'}</td>
                    <td className="p-2">
                      {row.summary.status === 'done' ? (
                        <span className="flex flex-wrap gap-x-3">
                          <Link to={`/replays/${row.summary.id}`} aria-label={`Replay ${row.summary.tableName}, ${new Date(row.summary.startedAt).toLocaleDateString()}`}>
                            Replay
                          </Link>
                          {row.summary.sameDeal === 1 ? (
                            // One table on this deal: a comparison would set the table beside itself.
                            <span className="text-ink-soft">No other table has played this deal yet</span>
                          ) : (
                            <Link to={`/compare/exchanges/${row.summary.id}`} aria-label={`Compare ${row.summary.tableName} with other tables on the same deal`}>
                              Compare
                            </Link>
                          )}
                        </span>
                      ) : (
                        <Link to={`/tables/${row.summary.tableId}`}>Still passing</Link>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <nav aria-label="Pages" className="flex flex-wrap items-center gap-3">
            <Button onClick={() => setPage(current - 1)} disabled={current === 0}>
              Previous page
            </Button>
            <span aria-live="polite">
              Page {current + 1} of {pages}
            </span>
            <Button onClick={() => setPage(current + 1)} disabled={current >= pages - 1}>
              Next page
            </Button>
          </nav>
        </>
      )}
    </div>
  );
}

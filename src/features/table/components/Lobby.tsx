import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { TableDto } from '../../../../shared/protocol';
import { SEATS } from '../../../../shared/seats';
import { useTables } from '../../../lib/api/tables';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { CreateTableForm } from './CreateTableForm';
import { TextField } from '../../../components/ui/TextField';

const STATUS_WORDS = { lobby: 'Seating', playing: 'Passing', done: 'Finished', closed: 'Closed' } as const;

function TableRow({ table }: { table: TableDto }) {
  const filled = SEATS.filter((s) => table.seats[s]).length;
  const href = `/tables/${table.id}${table.inviteCode ? `?invite=${table.inviteCode}` : ''}`;
  return (
    <li className="flex flex-wrap items-center justify-between gap-3 border-t border-line/40 py-3 first:border-t-0">
      <div className="min-w-0 break-words [overflow-wrap:anywhere]">
        <Link to={href} className="text-lead font-semibold">
          {table.name}
        </Link>
        <p className="text-base text-ink-soft">
          Host {table.hostName} · {STATUS_WORDS[table.status]} · {filled} of 4 seats filled
          {table.private ? ' · private' : ''}
          {table.options.hideAdvice ? ' · no advice' : ''}
          {table.options.teaching ? ' · teaching table: the host sees every rack' : ''}
        </p>
      </div>
    </li>
  );
}

function TableList({ title, tables, empty }: { title: string; tables: TableDto[]; empty: string }) {
  return (
    <Card>
      <h2 className="mb-2 text-lead font-semibold">{title}</h2>
      {tables.length === 0 ? <p className="text-ink-soft">{empty}</p> : <ul>{tables.map((t) => <TableRow key={t.id} table={t} />)}</ul>}
    </Card>
  );
}

/** Reads a pasted invite link (or a bare table path) and opens that table. */
function JoinByLink() {
  const navigate = useNavigate();
  const [link, setLink] = useState('');
  const [error, setError] = useState<string | undefined>();
  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    const url = URL.canParse(link.trim(), window.location.origin) ? new URL(link.trim(), window.location.origin) : null;
    const match = url?.pathname.match(/^\/tables\/([^/]+)\/?$/);
    if (!url || !match) {
      setError('That is not a table link. It looks like …/tables/TABLE?invite=CODE.');
      return;
    }
    setError(undefined);
    navigate(`/tables/${match[1]}${url.search}`);
  };
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-3">
      <h2 className="text-lead font-semibold">Join with an invite link</h2>
      <TextField label="Invite link" value={link} onChange={(e) => setLink(e.target.value)} error={error} />
      <div>
        <Button type="submit">Join the table</Button>
      </div>
    </form>
  );
}

export function Lobby() {
  const { data, isPending, error } = useTables();
  return (
    <div className="flex flex-col gap-6">
      {isPending ? (
        <p role="status">Loading tables…</p>
      ) : error ? (
        <p role="alert">The tables could not be loaded. Please reload the page.</p>
      ) : (
        <div className="grid grid-cols-1 gap-6 md:grid-cols-2">
          <TableList title="My tables" tables={data.mine} empty="You host or sit at no table yet." />
          <TableList title="Open tables" tables={data.open} empty="No open tables right now. Open one below." />
        </div>
      )}
      <div className="grid grid-cols-1 gap-6 md:grid-cols-[3fr_2fr]">
        <Card>
          <CreateTableForm />
        </Card>
        <Card>
          <JoinByLink />
        </Card>
      </div>
    </div>
  );
}

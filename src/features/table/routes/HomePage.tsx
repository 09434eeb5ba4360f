import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { TileKind } from '../../../../shared/tiles';
import { useMe } from '../../../lib/api/auth';
import { api, ApiError } from '../../../lib/api/client';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { LinkButton } from '../../../components/ui/LinkButton';
import { Lobby } from '../components/Lobby';
import { Tile } from '../../../components/ui/Tile';

const ROLE_WORDS = { player: 'Player', teacher: 'Teacher', admin: 'Organiser (admin)' } as const;

/** The viewer's rack in the picture: three of these are on their way to the right. */
const PICTURE_RACK: readonly TileKind[] = ['bam2', 'bam3', 'crack5', 'dot7', 'dot7', 'wind-e', 'flower'];
const PICTURE_PASS = new Set([0, 2, 5]);

function TileBacks({ n, vertical = false }: { n: number; vertical?: boolean }) {
  return (
    <div className={`flex ${vertical ? 'flex-col' : 'flex-row'} gap-0.5`} aria-hidden="true">
      {Array.from({ length: n }, (_, i) => (
        <span key={i} className={`${vertical ? 'h-[1.1em] w-[1.5em]' : 'h-[1.5em] w-[1.1em]'} rounded-sm border border-accent/60 bg-accent/80`} />
      ))}
    </div>
  );
}

/** Our own picture of a table from above: three racks face down, the viewer's face up, three tiles passing to the right. */
function TablePicture() {
  return (
    <figure className="flex flex-col gap-2">
      <div
        role="img"
        aria-label="A table seen from above: three players' racks face down on the far sides, your rack face up at the bottom, and an arrow carrying three of your tiles to the player on your right."
        className="grid grid-cols-[auto_1fr_auto] grid-rows-[auto_1fr_auto] items-center justify-items-center gap-2 rounded-card bg-accent-soft p-3 text-[0.75rem] sm:text-base"
      >
        <div className="col-start-2 row-start-1">
          <TileBacks n={7} />
        </div>
        <div className="col-start-1 row-start-2">
          <TileBacks n={5} vertical />
        </div>
        <svg viewBox="0 0 120 80" className="col-start-2 row-start-2 h-auto w-full max-w-[10em]" aria-hidden="true">
          <defs>
            <marker id="start-arrow-head" viewBox="0 0 10 10" refX="5" refY="5" markerWidth="4" markerHeight="4" orient="auto-start-reverse">
              <path d="M0 0 L10 5 L0 10 z" fill="var(--color-accent)" />
            </marker>
          </defs>
          <path d="M50 74 C 80 70, 100 58, 108 34" fill="none" stroke="var(--color-accent)" strokeWidth={6} strokeLinecap="round" markerEnd="url(#start-arrow-head)" />
          <text x={12} y={30} fontSize={13} fontWeight={600} fill="var(--color-ink)">
            3 to your right
          </text>
        </svg>
        <div className="col-start-3 row-start-2">
          <TileBacks n={5} vertical />
        </div>
        <div className="col-span-3 row-start-3 flex flex-wrap items-end justify-center gap-1" aria-hidden="true">
          {PICTURE_RACK.map((kind, i) => (
            <Tile key={i} kind={kind} decorative className={`w-[2.25em] sm:w-[2.5em] md:w-[3em] ${PICTURE_PASS.has(i) ? '-translate-y-2' : ''}`} />
          ))}
        </div>
      </div>
      <figcaption className="text-base text-ink-soft">Your rack at the bottom, the other three players around the table.</figcaption>
    </figure>
  );
}

/** What a visitor who is not signed in meets: what Rackside is, what a Charleston is, then the way in. */
function StartPage() {
  return (
    <div className="flex flex-col gap-8">
      <div className="grid grid-cols-1 items-center gap-8 md:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <div className="flex min-w-0 flex-col gap-4">
          <h1 className="text-title font-semibold">Rackside: practise the Charleston</h1>
          <p className="sm:text-lead">
            Rackside is a practice room for the Charleston of American-style mahjong. Sit down with friends, with your teacher, or alone with three bots, and pass
            tiles as often as you like, with advice that explains itself.
          </p>
          <h2 className="text-lead font-semibold">What is a Charleston?</h2>
          <p>
            Before a hand is played, each player passes three tiles they do not want: first to the right, then across, then to the left. The table may agree to a
            second round, and the players sitting across from each other may swap a few more. What you pass, and what you keep, shapes the hand you can build.
          </p>
          <div className="flex flex-wrap gap-3">
            <LinkButton kind="primary" to="/sign-in">
              Sign in
            </LinkButton>
            <LinkButton to="/register">Make an account</LinkButton>
          </div>
        </div>
        <div className="min-w-0">
          <TablePicture />
        </div>
      </div>
    </div>
  );
}

/** One click to a table of one's own with three bots already seated. */
function PracticeAlone() {
  const navigate = useNavigate();
  const [state, setState] = useState<{ busy: boolean; error: string | null }>({ busy: false, error: null });
  const start = async () => {
    if (state.busy) return;
    setState({ busy: true, error: null });
    try {
      const { table } = await api<{ table: { id: string } }>('/tables/practice', { method: 'POST', body: {} });
      navigate(`/tables/${table.id}`);
    } catch (err) {
      setState({ busy: false, error: err instanceof ApiError ? err.message : 'The practice table could not be opened. Please try again.' });
    }
  };
  return (
    <Card className="flex flex-col gap-3">
      <h2 className="text-lead font-semibold">Practise on your own</h2>
      <p>A table of your own: you sit in east, a Coach bot takes each other seat, and you deal when you are ready.</p>
      <div>
        <Button kind="primary" onClick={() => void start()} disabled={state.busy}>
          {state.busy ? 'Opening your table…' : 'Try it alone with three bots'}
        </Button>
      </div>
      <FormMessage error>{state.error}</FormMessage>
    </Card>
  );
}

export function HomePage() {
  const { data: me, isPending, error } = useMe();
  if (isPending) return <p role="status">Loading…</p>;
  if (error) return <p role="alert">Rackside cannot be reached just now. Please try again.</p>;
  if (!me) return <StartPage />;
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-title font-semibold break-words [overflow-wrap:anywhere]">Welcome, {me.displayName}</h1>
      <Card>
        <dl className="grid grid-cols-1 gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr] sm:gap-y-2">
          <dt className="font-medium text-ink-soft">Signed in as</dt>
          <dd className="min-w-0 break-all">{me.email}</dd>
          <dt className="font-medium text-ink-soft">Your role</dt>
          <dd>
            <span className="rounded-md border-2 border-accent bg-accent-soft px-2 py-0.5 font-semibold" data-testid="role">
              {ROLE_WORDS[me.role]}
            </span>
          </dd>
        </dl>
      </Card>
      <PracticeAlone />
      {me.role === 'admin' && (
        <p>
          <Link to="/admin/users">Manage people and roles</Link>
        </p>
      )}
      <Lobby />
    </div>
  );
}

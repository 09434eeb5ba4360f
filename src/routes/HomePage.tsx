import { Link, Navigate } from 'react-router-dom';
import { useMe } from '../api/auth';
import { Card } from '../components/Card';
import { Lobby } from '../components/Lobby';

const ROLE_WORDS = { player: 'Player', teacher: 'Teacher', admin: 'Organiser (admin)' } as const;

export function HomePage() {
  const { data: me, isPending, error } = useMe();
  if (isPending) return <p role="status">Loading…</p>;
  if (error) return <p role="alert">Rackside cannot be reached just now. Please try again.</p>;
  if (!me) return <Navigate to="/sign-in" replace />;
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-title font-semibold">Welcome, {me.displayName}</h1>
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
      {me.role === 'admin' && (
        <p>
          <Link to="/admin/users">Manage people and roles</Link>
        </p>
      )}
      <Lobby />
    </div>
  );
}

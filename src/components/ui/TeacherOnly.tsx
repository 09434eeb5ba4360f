import type { ReactNode } from 'react';
import { useMe } from '../../lib/api/auth';
import { Card } from './Card';
import { SignInFirst } from './SignInFirst';

/** Pages for teachers (and admins): others are told why, signed-out visitors go to sign in. */
export function TeacherOnly({ what, children }: { what: string; children: ReactNode }) {
  const { data: me, isPending } = useMe();
  if (isPending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  if (me.role !== 'teacher' && me.role !== 'admin') {
    return (
      <Card className="mx-auto max-w-lg">
        <h1 className="mb-3 text-title font-semibold">{what} are for teachers</h1>
        <p>Ask your club organiser for the teacher role if you run lessons.</p>
      </Card>
    );
  }
  return <>{children}</>;
}

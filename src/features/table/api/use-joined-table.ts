import { useEffect, useState } from 'react';
import { joinTable, leaveTable } from './socket';

/** Joins the table over the socket while a signed-in page shows it, and leaves on the way out; says why a join was refused. */
export function useJoinedTable(userId: number | undefined, id: string, invite: string | undefined): string | null {
  const [joinError, setJoinError] = useState<string | null>(null);
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
  return joinError;
}

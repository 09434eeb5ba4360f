/**
 * A user's live connections follow their account: every socket joins `user:<id>` when it connects
 * (./handshake.ts), so a password reset can close them all and a role change can make them read
 * the user again.
 */
import type { Application } from '../app';
import { sessionRoom, userRoom, type RacksideServer } from './wire';

/** Closes the user's sockets on every process for good (their session is over), except those of `keepSessionId`. */
export function signOutUserSockets(io: RacksideServer, userId: number, keepSessionId?: string) {
  const sockets = keepSessionId ? io.in(userRoom(userId)).except(sessionRoom(keepSessionId)) : io.in(userRoom(userId));
  sockets.disconnectSockets(true);
}

/**
 * Drops the connections of the user's sockets on this process without ending their session: the
 * client reconnects by itself, the handshake reads the user (and role) afresh, and the client joins
 * its table again under the new role. A socket keeps the user it connected as, so this is how a
 * change reaches it.
 */
export function refreshUserSockets(io: RacksideServer, userId: number) {
  const ids = io.of('/').adapter.rooms.get(userRoom(userId));
  for (const id of [...(ids ?? [])]) {
    io.of('/').sockets.get(id)?.conn.close();
  }
}

/** Wires the application's user-session notices to the sockets, on this process and (with Redis) on the others. */
export function bindUserSockets(io: RacksideServer, application: Pick<Application, 'config' | 'userSessions'>) {
  const peers = !!application.config.redisUrl;
  if (peers) {
    io.on('user:refresh', (userId) => {
      if (typeof userId === 'number') refreshUserSockets(io, userId);
    });
  }
  application.userSessions.onEnded((userId, keepSessionId) => signOutUserSockets(io, userId, keepSessionId));
  application.userSessions.onChanged((userId) => {
    refreshUserSockets(io, userId);
    if (peers) io.serverSideEmit('user:refresh', userId);
  });
}

/**
 * A user's live connections follow their account: every socket joins `user:<id>` when it connects
 * (server/realtime/index.ts), so a password reset can close them all and a role change can make
 * them read the user again.
 */
import type { Server, Socket } from 'socket.io';
import type { Application } from '../app';

export const userRoom = (userId: number) => `user:${userId}`;

/** Closes the user's sockets on every process for good (their session is over), except those of `keepSessionId`. */
export function signOutUserSockets(io: Server, userId: number, keepSessionId?: string) {
  const sockets = keepSessionId ? io.in(userRoom(userId)).except(`session:${keepSessionId}`) : io.in(userRoom(userId));
  sockets.disconnectSockets(true);
}

/**
 * Drops the connections of the user's sockets on this process without ending their session: the
 * client reconnects by itself, the handshake reads the user (and role) afresh, and the client joins
 * its table again under the new role. A socket keeps the user it connected as, so this is how a
 * change reaches it.
 */
export function refreshUserSockets(io: Server, userId: number) {
  const ids = io.of('/').adapter.rooms.get(userRoom(userId));
  for (const id of [...(ids ?? [])]) {
    const socket = io.of('/').sockets.get(id) as Socket | undefined;
    socket?.conn.close();
  }
}

/** Wires the application's user-session notices to the sockets, on this process and (with Redis) on the others. */
export function bindUserSockets(io: Server, application: Application) {
  const peers = !!application.config.redisUrl;
  const server = io as unknown as {
    serverSideEmit(event: 'user:refresh', userId: number): void;
    on(event: 'user:refresh', fn: (userId: unknown) => void): void;
  };
  if (peers) {
    server.on('user:refresh', (userId) => {
      if (typeof userId === 'number') refreshUserSockets(io, userId);
    });
  }
  application.userSessions.onEnded((userId, keepSessionId) => signOutUserSockets(io, userId, keepSessionId));
  application.userSessions.onChanged((userId) => {
    refreshUserSockets(io, userId);
    if (peers) server.serverSideEmit('user:refresh', userId);
  });
}

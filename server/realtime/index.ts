/**
 * Socket.IO on the app's HTTP server, put together from its parts: the handshake (who a socket is),
 * the other processes (peers), presence (who is at a table, and what each is shown), the table of
 * client events, and the user's sessions. server/index.ts alone builds it.
 */
import type { Server as HttpServer } from 'node:http';
import type { Application } from '../app';
import { admit, openServer } from './handshake';
import { createGate, createHandlers } from './handlers';
import { connectPeers } from './peers';
import { createPresence } from './presence';
import { bindUserSockets } from './sessions';
import { sessionRoom } from './wire';

/** What the sockets need of the application. */
export type RealtimeDeps = Pick<Application, 'config' | 'logger' | 'session' | 'passport' | 'registry' | 'userSessions' | 'onTableChange' | 'onLogout'>;

/** Socket.IO on the app's HTTP server, sharing its sessions: a socket is the signed-in user of its cookie. */
export function createRealtime(httpServer: HttpServer, deps: RealtimeDeps) {
  const io = openServer(httpServer, deps);
  const gate = createGate();
  const closing = () => gate.closing;
  const peers = connectPeers(io, deps, closing);
  const presence = createPresence(io, deps, peers, closing);
  peers.listen(deps.registry, presence.recount);

  deps.onTableChange((master, fromPeer) => {
    presence.broadcast(master, false);
    if (!fromPeer) peers.tellMoved(master);
  });

  const attach = createHandlers(io, deps, presence, peers, gate);
  io.on('connection', (socket) => {
    admit(socket);
    attach(socket);
  });

  // Signing out ends that session's live connections too; a reset password or a new role reaches the user's sockets.
  deps.onLogout((sessionId) => io.in(sessionRoom(sessionId)).disconnectSockets(true));
  bindUserSockets(io, deps);

  /** Closes the connections to Redis, once the sockets are closed. */
  const closePeers = () => peers.close();
  return Object.assign(io, { drain: gate.drain, closePeers });
}

export type Realtime = ReturnType<typeof createRealtime>;

/**
 * Socket.IO on the app's HTTP server, put together from its parts: the handshake (who a socket is),
 * the other processes (peers), presence (who is at a table, and what each is shown) and the
 * handlers of the client events.
 */
import type { Server as HttpServer } from 'node:http';
import type { Application } from '../app';
import { admit, openServer } from './handshake';
import { createGate, createHandlers } from './handlers';
import { connectPeers } from './peers';
import { createPresence } from './presence';
import { sessionRoom } from './wire';

/** Socket.IO on the app's HTTP server, sharing its sessions: a socket is the signed-in user of its cookie. */
export function attachRealtime(httpServer: HttpServer, application: Application) {
  const io = openServer(httpServer, application);
  const gate = createGate();
  const closing = () => gate.closing;
  const peers = connectPeers(io, application, closing);
  const presence = createPresence(io, application, peers, closing);
  peers.listen(application.registry, presence.recount);

  application.onTableChange((master, fromPeer) => {
    presence.broadcast(master, false);
    if (!fromPeer) peers.tellMoved(master);
  });

  const attach = createHandlers(io, application, presence, peers, gate);
  io.on('connection', (socket) => {
    admit(socket);
    attach(socket);
  });

  // Signing out ends that session's live connections too.
  application.onLogout((sessionId) => {
    io.in(sessionRoom(sessionId)).disconnectSockets(true);
  });

  return Object.assign(io, { drain: gate.drain, closePeers: peers.close });
}

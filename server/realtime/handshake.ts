/**
 * The Socket.IO server on the app's HTTP server, and who a socket is: the handshake shares the app's
 * sessions, so a socket is the signed-in user of its cookie, and a page from another site is refused.
 */
import { ServerResponse, type Server as HttpServer } from 'node:http';
import { EventEmitter } from 'node:events';
import type { RequestHandler, Response } from 'express';
import type { SessionData } from 'express-session';
import { Server } from 'socket.io';
import type { Application } from '../app';
import { pastAbsoluteLifetime } from '../auth/session';
import { isOwnOrigin } from '../security/origin';
import { textOnlyParser } from './text-encoder';
import { sessionRoom, userRoom, type RacksideServer, type RacksideSocket } from './wire';

export type HandshakeDeps = Pick<Application, 'config' | 'session' | 'passport'>;

/** A response for middleware to write to during a WebSocket upgrade: nothing it writes goes anywhere. */
function upgradeStandIn() {
  const headers: Record<string, unknown> = {};
  return Object.assign(new EventEmitter(), {
    setHeader: (name: string, value: unknown) => void (headers[name.toLowerCase()] = value),
    getHeader: (name: string) => headers[name.toLowerCase()],
    removeHeader: (name: string) => void delete headers[name.toLowerCase()],
    writeHead: () => undefined,
    write: () => true,
    end: () => undefined,
    headersSent: false,
  });
}

/** Opens Socket.IO on the HTTP server; only signed-in sockets of Rackside's own pages connect. */
export function openServer(httpServer: HttpServer, { config, session, passport }: HandshakeDeps): RacksideServer {
  const io: RacksideServer = new Server(httpServer, {
    // No client message is near this size; a larger one is dropped before it is parsed.
    maxHttpBufferSize: 64 * 1024,
    serveClient: false,
    parser: textOnlyParser,
    // Behind a balancer without sticky sessions, long-polling (whose requests must all reach one
    // process) is refused; a WebSocket stays on the process it opened on.
    ...(config.websocketOnly ? { transports: ['websocket' as const] } : {}),
    // The handshake of a page from another site is refused, like a state-changing REST request.
    allowRequest: (req, done) => done(isOwnOrigin(req, config) ? null : 'FOREIGN_ORIGIN', isOwnOrigin(req, config)),
  });

  // Run the session and passport on the handshake only (as Socket.IO's passport how-to shows).
  // On a WebSocket upgrade there is no HTTP response to write: the engine hands middleware a stand-in
  // that it keeps until the connection closes, and the session middleware hangs its closures (and so
  // the request, its session and its user) on it. Hand them a stand-in of our own that is dropped once
  // the handshake is read; the session's end-of-response hooks never run on an upgrade either way.
  const onlyHandshake = (middleware: RequestHandler): RequestHandler => (req, res, next) => {
    const isHandshake = (req as unknown as { _query: Record<string, string> })._query?.sid === undefined;
    if (!isHandshake) next();
    else if (res instanceof ServerResponse) middleware(req, res, next);
    else middleware(req, upgradeStandIn() as unknown as Response, next);
  };
  io.engine.use(onlyHandshake(session.middleware));
  io.engine.use(onlyHandshake(passport.session() as RequestHandler));

  io.use((socket, next) => {
    const req = socket.request as unknown as Express.Request & { sessionID?: string };
    if (!req.user || pastAbsoluteLifetime((req as unknown as { session?: SessionData }).session, config)) {
      next(Object.assign(new Error('Please sign in first.'), { data: { code: 'UNAUTHENTICATED' } }));
      return;
    }
    socket.data = { userId: req.user.id, displayName: req.user.displayName, isAdmin: req.user.role === 'admin', sessionId: req.sessionID };
    // Everything needed from the handshake request is now in socket.data and socket.handshake. Socket.IO
    // keeps that request (with its session and parsed headers) for the connection's whole life unless
    // told otherwise (its memory-usage guide); let it go, a few kilobytes per open socket.
    (socket.conn as unknown as { request: unknown }).request = null;
    const held = req as unknown as Record<string, unknown>;
    for (const key of ['user', 'session', 'sessionStore', 'sessionID', 'logIn', 'login']) delete held[key];
    next();
  });
  return io;
}

/** A connected socket joins the rooms of its session and its user, so that signing out or a changed account reaches it. */
export function admit(socket: RacksideSocket) {
  if (socket.data.sessionId) socket.join(sessionRoom(socket.data.sessionId));
  socket.join(userRoom(socket.data.userId)); // see ./sessions.ts
}

import type { Server as HttpServer } from 'node:http';
import type { RequestHandler } from 'express';
import { Server } from 'socket.io';
import type { Application } from '../app';

/** Socket.IO on the app's HTTP server, sharing its sessions: a socket is the signed-in user of its cookie. */
export function attachRealtime(httpServer: HttpServer, application: Application) {
  const io = new Server(httpServer, { maxHttpBufferSize: 64 * 1024, serveClient: false });

  // Run the session and passport on the handshake only (as Socket.IO's passport how-to shows).
  const onlyHandshake = (middleware: RequestHandler): RequestHandler => (req, res, next) => {
    const isHandshake = (req as unknown as { _query: Record<string, string> })._query?.sid === undefined;
    if (isHandshake) middleware(req, res, next);
    else next();
  };
  io.engine.use(onlyHandshake(application.session.middleware));
  io.engine.use(onlyHandshake(application.passport.session() as RequestHandler));

  io.use((socket, next) => {
    const req = socket.request as unknown as Express.Request;
    if (!req.user) {
      next(Object.assign(new Error('Please sign in first.'), { data: { code: 'UNAUTHENTICATED' } }));
      return;
    }
    next();
  });

  io.on('connection', (socket) => {
    const req = socket.request as unknown as Express.Request & { sessionID?: string };
    if (req.sessionID) socket.join(`session:${req.sessionID}`);
    socket.join(`user:${req.user!.id}`);
  });

  // Signing out ends that session's live connections too.
  application.onLogout((sessionId) => {
    io.in(`session:${sessionId}`).disconnectSockets(true);
  });

  return io;
}

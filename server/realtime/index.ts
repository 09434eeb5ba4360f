/**
 * Socket.IO on the app's HTTP server: the handshake, presence, the other processes and one handler
 * per client event. Long because those four still share this file; they are to be split apart.
 */
import { randomUUID } from 'node:crypto';
import { ServerResponse, type Server as HttpServer } from 'node:http';
import { EventEmitter } from 'node:events';
import type { RequestHandler, Response } from 'express';
import { Server, type Socket } from 'socket.io';
import { createAdapter } from '@socket.io/redis-adapter';
import { Redis } from 'ioredis';
import { clientEventSchemas, type Ack, type ClientEventName, type ClientToServerEvents, type ServerToClientEvents } from '../../shared/protocol';
import type { Application } from '../app';
import { TableError, type Member, type TableMaster, type TablePosition } from './table-master';
import { RateLimiterMemory, RateLimiterRedis } from 'rate-limiter-flexible';
import type { SessionData } from 'express-session';
import { pastAbsoluteLifetime } from '../auth/session';
import { isOwnOrigin } from '../security/origin';
import { textOnlyParser } from './text-encoder';
import { controlCharacterAt } from '../security/control-characters';
import { issueMessage } from '../../shared/issue-words';

interface SocketData {
  userId: number;
  displayName: string;
  isAdmin: boolean;
  sessionId?: string;
  tableId?: string;
  as?: 'player' | 'spectator';
}

type RacksideSocket = Socket<ClientToServerEvents, ServerToClientEvents, Record<string, never>, SocketData>;

const room = (tableId: string) => `table:${tableId}`;

/** The two Redis connections the adapter needs (one publishes, one listens); errors are logged, and ioredis reconnects. */
function connectRedis(url: string, application: Application) {
  const pub = new Redis(url, { maxRetriesPerRequest: 2 });
  const sub = pub.duplicate();
  for (const [name, client] of [['publish', pub], ['subscribe', sub]] as const) {
    client.on('error', (err: Error) => application.logger.error({ connection: name, error: err.message }, 'redis connection error'));
  }
  return {
    pub,
    sub,
    close: async () => {
      await Promise.allSettled([pub.quit(), sub.quit()]);
    },
  };
}

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

/** Socket.IO on the app's HTTP server, sharing its sessions: a socket is the signed-in user of its cookie. */
export function attachRealtime(httpServer: HttpServer, application: Application) {
  const { config } = application;
  const io = new Server<ClientToServerEvents, ServerToClientEvents, Record<string, never>, SocketData>(httpServer, {
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
  io.engine.use(onlyHandshake(application.session.middleware));
  io.engine.use(onlyHandshake(application.passport.session() as RequestHandler));

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

  const registry = application.registry;
  // Shutdown: once closing, new messages are answered SHUTTING_DOWN; those already received run to their ack.
  let closing = false;
  let inFlight = 0;
  let settled: (() => void) | null = null;
  // Several processes: Socket.IO's Redis adapter carries room emits and server-side notices between them.
  const redis = config.redisUrl ? connectRedis(config.redisUrl, application) : null;
  if (redis) io.adapter(createAdapter(redis.pub, redis.sub));
  // Limits count across every process when they share a Redis.
  const limiter = (keyPrefix: string, points: number, duration: number) =>
    redis ? new RateLimiterRedis({ storeClient: redis.pub, keyPrefix, points, duration }) : new RateLimiterMemory({ keyPrefix, points, duration });
  const chatLimiter = limiter('chat', config.rateLimits.chatPerMinute, 60);
  const actionLimiter = limiter('act', config.rateLimits.actions.max, Math.max(1, Math.round(config.rateLimits.actions.windowMs / 1000)));

  /** Tells the other processes that a table changed in the database, so that they catch up and show it. */
  function tellPeers(master: TableMaster, whole = false) {
    if (redis && !closing) io.serverSideEmit('table:moved', { tableId: master.id, ...master.position, whole });
  }
  if (redis) {
    (io as unknown as { on(event: 'table:presence', fn: (tableId: string) => void): void }).on('table:presence', (tableId) => {
      if (typeof tableId !== 'string') return;
      registry
        .peek(tableId)
        .then((master) => master && recountPresence(master))
        .catch(() => undefined);
    });
    (io as unknown as { on(event: 'table:moved', fn: (told: TablePosition & { tableId: string; whole: boolean }) => void): void }).on('table:moved', (told) => {
      const tableId = told?.tableId;
      if (typeof tableId !== 'string') return;
      registry
        .peek(tableId)
        .then((master) => master?.catchUp(told))
        .catch((err) => application.logger.error({ err, tableId }, 'catching up with another process failed'));
    });
  }

  application.onTableChange((master, fromPeer) => {
    broadcast(master, false);
    if (!fromPeer) tellPeers(master);
  });

  function member(socket: RacksideSocket): Member {
    return { userId: socket.data.userId, displayName: socket.data.displayName, as: socket.data.as ?? 'player', isAdmin: socket.data.isAdmin };
  }

  /**
   * Sends every socket at the table its own view, then lets the bots think. Without `force`, a
   * table whose shown version was already sent is skipped: one stored group of actions gives each
   * viewer one state, however many of the group's actions are then acked.
   */
  function broadcast(master: TableMaster, force = true) {
    if (!force && master.sentVersion === master.shownVersion && master.sentNotes === master.noteCount) return;
    master.sentVersion = master.shownVersion;
    master.sentNotes = master.noteCount;
    const ids = io.of('/').adapter.rooms.get(room(master.id));
    for (const id of ids ?? []) {
      const socket = io.of('/').sockets.get(id) as RacksideSocket | undefined;
      if (socket) socket.emit('table:state', master.stateFor(member(socket)));
    }
    master.wakeBots();
  }

  function countPresence(master: TableMaster, socket: RacksideSocket, delta: 1 | -1) {
    if (socket.data.as === 'spectator') {
      master.spectators = Math.max(0, master.spectators + delta);
    } else {
      const n = (master.connected.get(socket.data.userId) ?? 0) + delta;
      if (n > 0) master.connected.set(socket.data.userId, n);
      else master.connected.delete(socket.data.userId);
      master.presenceChanged();
    }
    if (redis && !closing) {
      // Who is here counts the sockets of every process: count again here, and have the others do so.
      io.serverSideEmit('table:presence', master.id);
      recountPresence(master);
    }
  }

  /** Counts the table's sockets on every process (through the adapter) and shows the result here. */
  function recountPresence(master: TableMaster) {
    io.in(room(master.id))
      .fetchSockets()
      .then((sockets) => {
        const connected = new Map<number, number>();
        let spectators = 0;
        for (const s of sockets) {
          const data = s.data as Partial<SocketData>;
          if (data.tableId !== master.id || typeof data.userId !== 'number') continue;
          if (data.as === 'spectator') spectators += 1;
          else connected.set(data.userId, (connected.get(data.userId) ?? 0) + 1);
        }
        master.connected.clear();
        connected.forEach((n, userId) => master.connected.set(userId, n));
        master.spectators = spectators;
        master.presenceChanged();
        broadcast(master);
      })
      .catch((err) => application.logger.warn({ tableId: master.id, error: (err as Error).message }, 'counting the sockets of every process failed'));
  }

  async function leaveTable(socket: RacksideSocket) {
    const tableId = socket.data.tableId;
    if (!tableId) return;
    socket.data.tableId = undefined;
    await socket.leave(room(tableId));
    const master = await registry.peek(tableId);
    if (master) {
      countPresence(master, socket, -1);
      broadcast(master);
    }
  }

  io.on('connection', (raw) => {
    const socket = raw as RacksideSocket;
    if (socket.data.sessionId) socket.join(`session:${socket.data.sessionId}`);
    socket.join(`user:${socket.data.userId}`); // see ./sessions.ts

    /** Parses, runs, broadcasts, then acks: a bad payload or a refused action changes nothing. */
    function on<E extends ClientEventName>(event: E, run: (payload: ReturnType<(typeof clientEventSchemas)[E]['parse']>) => Promise<object | void>) {
      socket.on(event as never, async (...args: unknown[]) => {
        const ack = (typeof args[args.length - 1] === 'function' ? args.pop() : () => undefined) as (a: Ack) => void;
        if (closing) {
          ack({ ok: false, code: 'SHUTTING_DOWN', message: 'Rackside is restarting. Your table will be back in a moment; send that again then.' });
          return;
        }
        const at = controlCharacterAt(args[0]);
        if (at) {
          ack({ ok: false, code: 'BAD_INPUT', message: `"${at}" holds a control character (such as NUL), which no Rackside text may hold. Remove it and send again.` });
          return;
        }
        const parsed = clientEventSchemas[event].safeParse(args[0] ?? {});
        if (!parsed.success) {
          const issue = parsed.error.issues[0];
          ack({ ok: false, code: 'BAD_INPUT', message: `That ${event} message is not one Rackside understands: ${issue ? issueMessage(issue) : 'it is empty.'}` });
          return;
        }
        inFlight += 1;
        try {
          const extra = await run(parsed.data as never);
          ack({ ok: true, ...(extra ?? {}) });
        } catch (err) {
          if (err instanceof TableError) ack({ ok: false, code: err.code, message: err.message });
          else {
            console.error(`Unexpected error in ${event}`, err);
            ack({ ok: false, code: 'SERVER_ERROR', message: 'Something went wrong on our side. Please try again.' });
          }
        } finally {
          inFlight -= 1;
          if (inFlight === 0) settled?.();
        }
      });
    }

    async function joined(): Promise<TableMaster> {
      const tableId = socket.data.tableId;
      const master = tableId ? await registry.peek(tableId) : null;
      if (!master) throw new TableError('NOT_JOINED', 'Join a table first.');
      return master;
    }

    /**
     * Waits until the change is stored, makes sure the viewers have it, then the caller acks. An
     * exchange action's stored group has already been shown and told (through the change hook), so
     * it is only sent again if that has not happened; any other change is sent and told here.
     */
    async function after(master: TableMaster, work: Promise<unknown>, hot = false) {
      await work;
      broadcast(master, !hot);
      if (!hot) tellPeers(master, true);
      return { version: master.shownVersion };
    }

    on('table:join', async ({ tableId, as, invite }) => {
      const master = await registry.get(tableId);
      if (!master) throw new TableError('NOT_FOUND', 'There is no table with that id.');
      if (socket.disconnected) throw new TableError('GONE', 'The connection closed before the table was joined.');
      if (master.row.status === 'closed') throw new TableError('TABLE_CLOSED', 'This table is closed. Its exchanges are in your history.');
      const { userId, isAdmin } = socket.data;
      const insider = master.isHost(userId) || master.seatOf(userId) !== null || isAdmin;
      if (master.row.private && !insider && invite !== master.row.inviteCode) {
        throw new TableError('INVITE_REQUIRED', 'This table is private. Open it from the invite link the host shared.');
      }
      if (socket.data.tableId) await leaveTable(socket);
      // With other processes about, this one's copy of the table may be behind (its player may come
      // from a process that just died): read the table again before showing it.
      if (redis) await master.catchUp();
      // The socket may have gone while this join waited: a closed socket never joins or counts.
      if (socket.disconnected) throw new TableError('GONE', 'The connection closed before the table was joined.');
      socket.data.tableId = tableId;
      socket.data.as = as;
      await socket.join(room(tableId));
      countPresence(master, socket, 1);
      broadcast(master);
      return { state: master.stateFor(member(socket)) };
    });

    on('table:sit', async ({ seat }) => {
      const master = await joined();
      return after(master, master.sit(member(socket), seat));
    });
    on('table:stand', async () => {
      const master = await joined();
      return after(master, master.stand(member(socket)));
    });
    on('table:bot', async ({ seat, strategy }) => {
      const master = await joined();
      return after(master, master.seatBot(member(socket), seat, strategy));
    });
    on('table:start', async () => {
      const master = await joined();
      return after(master, master.start(member(socket)));
    });
    on('exchange:act', async ({ action, version }) => {
      const master = await joined();
      try {
        await actionLimiter.consume(`${master.id}:${socket.data.userId}`);
      } catch (err) {
        if (err instanceof Error) throw err;
        throw new TableError('RATE_LIMITED', 'You are moving faster than anyone plays. Wait a moment; nothing of that move was kept.');
      }
      return after(master, master.act(member(socket), action, version, config.rateLimits.actionsPerExchange), true);
    });
    on('huddle:call', async () => {
      const master = await joined();
      return after(master, master.callHuddle(member(socket)));
    });
    on('huddle:reveal', async ({ seat }) => {
      const master = await joined();
      return after(master, master.reveal(member(socket), seat));
    });
    on('huddle:note', async ({ text, seat }) => {
      const master = await joined();
      return after(master, master.note(member(socket), text, seat));
    });
    on('huddle:release', async () => {
      const master = await joined();
      return after(master, master.release(member(socket)));
    });
    on('table:leave', async () => {
      if (!socket.data.tableId) throw new TableError('NOT_JOINED', 'You are not at a table.');
      await leaveTable(socket);
    });
    on('table:advice', async ({ hidden }) => {
      const master = await joined();
      return after(master, master.setAdvice(member(socket), hidden));
    });
    on('table:close', async () => {
      const master = await joined();
      return after(master, master.closeTable(member(socket)));
    });
    on('chat:send', async ({ text }) => {
      const master = await joined();
      try {
        await chatLimiter.consume(String(socket.data.userId));
      } catch (err) {
        if (err instanceof Error) throw err;
        application.logger.warn({ event: 'chat-limited', userId: socket.data.userId, tableId: master.id }, 'chat over the limit');
        throw new TableError('RATE_LIMITED', 'You are sending messages very fast. Wait a moment, then try again.');
      }
      const message = {
        id: randomUUID(),
        tableId: master.id,
        userId: socket.data.userId,
        displayName: socket.data.displayName,
        seat: socket.data.as === 'player' ? master.seatOf(socket.data.userId) : null,
        text,
        at: new Date().toISOString(),
      };
      io.to(room(master.id)).emit('chat:message', message);
      return { id: message.id };
    });

    socket.onAny((event: string, ...args: unknown[]) => {
      // Own keys only: "toString" or "__proto__" are in every object, and are no Rackside message.
      if (typeof event === 'string' && Object.hasOwn(clientEventSchemas, event)) return;
      const ack = args[args.length - 1];
      if (typeof ack === 'function') ack({ ok: false, code: 'UNKNOWN_EVENT', message: `Rackside has no "${String(event).slice(0, 40)}" message.` });
    });

    socket.on('disconnect', () => {
      leaveTable(socket).catch((err) => console.error('Leaving a table failed', err));
    });
  });

  // Signing out ends that session's live connections too.
  application.onLogout((sessionId) => {
    io.in(`session:${sessionId}`).disconnectSockets(true);
  });

  /** Answers every message already received, refuses new ones, then resolves. */
  async function drain(graceMs = 200) {
    closing = true;
    // Messages may already sit in the sockets' buffers: give the event loop a moment to read and answer them.
    await new Promise((resolve) => setTimeout(resolve, graceMs));
    if (inFlight > 0) await new Promise<void>((resolve) => (settled = resolve));
  }

  /** Closes the connections to Redis, once the sockets are closed. */
  async function closePeers() {
    await redis?.close();
  }

  return Object.assign(io, { drain, closePeers });
}

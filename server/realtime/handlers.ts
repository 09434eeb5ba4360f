/** One handler per client event: each parses, checks, calls the table, shows the change, then acks. */
import { randomUUID } from 'node:crypto';
import { clientEventSchemas, type Ack, type ClientEventName } from '../../shared/protocol';
import { issueMessage } from '../../shared/issue-words';
import type { Application } from '../app';
import { controlCharacterAt } from '../security/control-characters';
import type { Peers } from './peers';
import type { Presence } from './presence';
import { TableError, type TableMaster } from './table-master';
import { memberOf as member, tableRoom as room, type RacksideServer, type RacksideSocket } from './wire';

export type HandlersDeps = Pick<Application, 'config' | 'registry' | 'logger'>;

/** Shutdown: once closing, new messages are answered SHUTTING_DOWN; those already received run to their ack. */
export function createGate() {
  let inFlight = 0;
  let settled: (() => void) | null = null;
  const gate = {
    closing: false,
    enter() {
      inFlight += 1;
    },
    exit() {
      inFlight -= 1;
      if (inFlight === 0) settled?.();
    },
    /** Answers every message already received, refuses new ones, then resolves. */
    async drain(graceMs = 200) {
      gate.closing = true;
      // Messages may already sit in the sockets' buffers: give the event loop a moment to read and answer them.
      await new Promise((resolve) => setTimeout(resolve, graceMs));
      if (inFlight > 0) await new Promise<void>((resolve) => (settled = resolve));
    },
  };
  return gate;
}
export type Gate = ReturnType<typeof createGate>;

export function createHandlers(io: RacksideServer, { config, registry, logger }: HandlersDeps, presence: Presence, peers: Peers, gate: Gate) {
  const { broadcast } = presence;
  const chatLimiter = peers.limiter('chat', config.rateLimits.chatPerMinute, 60);
  const actionLimiter = peers.limiter('act', config.rateLimits.actions.max, Math.max(1, Math.round(config.rateLimits.actions.windowMs / 1000)));

  return function attach(socket: RacksideSocket) {
    /** Parses, runs, broadcasts, then acks: a bad payload or a refused action changes nothing. */
    function on<E extends ClientEventName>(event: E, run: (payload: ReturnType<(typeof clientEventSchemas)[E]['parse']>) => Promise<object | void>) {
      socket.on(event as never, async (...args: unknown[]) => {
        const ack = (typeof args[args.length - 1] === 'function' ? args.pop() : () => undefined) as (a: Ack) => void;
        if (gate.closing) {
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
        gate.enter();
        try {
          const extra = await run(parsed.data as never);
          ack({ ok: true, ...(extra ?? {}) });
        } catch (err) {
          if (err instanceof TableError) ack({ ok: false, code: err.code, message: err.message });
          else {
            logger.error({ err, event }, 'unexpected error in a socket handler');
            ack({ ok: false, code: 'SERVER_ERROR', message: 'Something went wrong on our side. Please try again.' });
          }
        } finally {
          gate.exit();
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
      if (!hot) peers.tellMoved(master, true);
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
      if (socket.data.tableId) await presence.leave(socket);
      // With other processes about, this one's copy of the table may be behind (its player may come
      // from a process that just died): read the table again before showing it.
      if (peers.shared) await master.catchUp();
      // The socket may have gone while this join waited: a closed socket never joins or counts.
      if (socket.disconnected) throw new TableError('GONE', 'The connection closed before the table was joined.');
      socket.data.tableId = tableId;
      socket.data.as = as;
      await socket.join(room(tableId));
      presence.count(master, socket, 1);
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
      await presence.leave(socket);
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
        logger.warn({ event: 'chat-limited', userId: socket.data.userId, tableId: master.id }, 'chat over the limit');
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
      presence.leave(socket).catch((err) => logger.error({ err }, 'leaving a table failed'));
    });
  };
}

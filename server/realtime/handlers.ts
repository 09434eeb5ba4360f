/**
 * The client events, one command each, in one table: the payload is checked and parsed with the
 * event's schema from shared/protocol.ts, then its command runs, and what the command returns is the
 * event's ack (`AckPayloads`). A bad payload or a refused command changes nothing.
 */
import { randomUUID } from 'node:crypto';
import type { z } from 'zod';
import { clientEventSchemas, type AckOf, type AckPayloads, type ClientEventName } from '../../shared/protocol';
import { issueMessage } from '../../shared/issue-words';
import type { Application } from '../app';
import { controlCharacterAt } from '../security/control-characters';
import { tableCounters } from './counters';
import type { Peers } from './peers';
import type { Presence } from './presence';
import { TableError, type Member, type TableMaster } from './table-master';
import { memberOf, tableRoom, type RacksideServer, type RacksideSocket } from './wire';

/** An event's payload once parsed (defaults filled in). */
type Payloads = { [E in ClientEventName]: z.output<(typeof clientEventSchemas)[E]> };
const schemas: { [E in ClientEventName]: { safeParse(input: unknown): z.ZodSafeParseResult<Payloads[E]> } } = clientEventSchemas;

type Limiter = ReturnType<Peers['limiter']>;

/** What a command may use besides its socket. */
interface Context extends Pick<Application, 'config' | 'registry' | 'logger'> {
  io: RacksideServer;
  presence: Presence;
  peers: Peers;
  limits: { chat: Limiter; act: Limiter };
}

type Command<E extends ClientEventName> = (payload: Payloads[E], socket: RacksideSocket, ctx: Context) => Promise<AckPayloads[E]>;

/** The table the socket joined. */
async function joined(socket: RacksideSocket, { registry }: Context): Promise<TableMaster> {
  const tableId = socket.data.tableId;
  const master = tableId ? await registry.peek(tableId) : null;
  if (!master) throw new TableError('NOT_JOINED', 'Join a table first.');
  return master;
}

/** Counts one more against the limiter, or refuses with `limited`. */
async function withinLimit(limiter: Limiter, key: string, limited: () => TableError) {
  try {
    await limiter.consume(key);
  } catch (err) {
    if (err instanceof Error) throw err;
    throw limited();
  }
}

/**
 * A change to the joined table, which its master checks and makes; the ack is the table's version.
 * The change is stored, then the viewers are sure to have it, then the ack goes. An exchange action
 * (`hot`) has already been shown and told with its stored group (through the change hook), so it is
 * only sent again if that has not happened; any other change is sent and told here.
 */
function change<P>(call: (master: TableMaster, who: Member, payload: P, ctx: Context) => Promise<unknown>, { hot = false } = {}) {
  return async (payload: P, socket: RacksideSocket, ctx: Context) => {
    const master = await joined(socket, ctx);
    await call(master, memberOf(socket), payload, ctx);
    ctx.presence.broadcast(master, !hot);
    if (!hot) ctx.peers.tellMoved(master, true);
    return { version: master.shownVersion };
  };
}

const join: Command<'table:join'> = async ({ tableId, as, invite }, socket, { io, registry, presence, peers }) => {
  const held = (await registry.peek(tableId)) !== null;
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
  // With other processes about, a copy of the table held here may be behind: while none of its
  // sockets were here, or some are elsewhere, others may have changed it without telling this one
  // (its player may come from a process that just died). Read it again before showing it. A table
  // just read, or one whose sockets are all here, is up to date.
  const alone = (io.of('/').adapter.rooms.get(tableRoom(tableId))?.size ?? 0) === 0;
  if (peers.shared && held && (alone || master.remoteSockets !== 0)) await master.catchUp();
  // The socket may have gone while this join waited: a closed socket never joins or counts.
  if (socket.disconnected) throw new TableError('GONE', 'The connection closed before the table was joined.');
  socket.data.tableId = tableId;
  socket.data.as = as;
  await socket.join(tableRoom(tableId));
  presence.count(master, socket, 1);
  presence.broadcast(master);
  return { state: master.stateFor(memberOf(socket)) };
};

const leave: Command<'table:leave'> = async (_payload, socket, { presence }) => {
  if (!socket.data.tableId) throw new TableError('NOT_JOINED', 'You are not at a table.');
  await presence.leave(socket);
  return {};
};

const chat: Command<'chat:send'> = async ({ text }, socket, ctx) => {
  const master = await joined(socket, ctx);
  await withinLimit(ctx.limits.chat, String(socket.data.userId), () => {
    ctx.logger.warn({ event: 'chat-limited', userId: socket.data.userId, tableId: master.id }, 'chat over the limit');
    return new TableError('RATE_LIMITED', 'You are sending messages very fast. Wait a moment, then try again.');
  });
  const message = {
    id: randomUUID(),
    tableId: master.id,
    userId: socket.data.userId,
    displayName: socket.data.displayName,
    seat: socket.data.as === 'player' ? master.seatOf(socket.data.userId) : null,
    text,
    at: new Date().toISOString(),
  };
  ctx.io.to(tableRoom(master.id)).emit('chat:message', message);
  return { id: message.id };
};

/**
 * Every client event and its command. The table changes go to the master's one dispatch, which
 * checks them in a fixed order before anything changes. An event not in here is answered UNKNOWN_EVENT.
 */
const commands: { [E in ClientEventName]: Command<E> } = {
  'table:join': join,
  'table:leave': leave,
  'table:sit': change((master, who, { seat }) => master.dispatch({ type: 'table:sit', seat }, who)),
  'table:stand': change((master, who) => master.dispatch({ type: 'table:stand' }, who)),
  'table:bot': change((master, who, { seat, strategy }) => master.dispatch({ type: 'table:bot', seat, strategy }, who)),
  'table:start': change((master, who) => master.dispatch({ type: 'table:start' }, who)),
  'table:advice': change((master, who, { hidden }) => master.dispatch({ type: 'table:advice', hidden }, who)),
  'table:close': change((master, who) => master.dispatch({ type: 'table:close' }, who)),
  'exchange:act': change(
    async (master, who, { action, version }, { limits }) => {
      const limited = () => new TableError('RATE_LIMITED', 'You are moving faster than anyone plays. Wait a moment; nothing of that move was kept.');
      await withinLimit(limits.act, `${master.id}:${who.userId}`, limited);
      if (master.remoteSockets > 0) tableCounters.split += 1;
      // The move budget per exchange is the registry's (`movesPerExchange`, from the same config).
      return master.dispatch({ type: 'exchange:act', action, version }, who);
    },
    { hot: true },
  ),
  'huddle:call': change((master, who) => master.dispatch({ type: 'huddle:call' }, who)),
  'huddle:reveal': change((master, who, { seat }) => master.dispatch({ type: 'huddle:reveal', seat }, who)),
  'huddle:note': change((master, who, { text, seat }) => master.dispatch({ type: 'huddle:note', text, seat }, who)),
  'huddle:release': change((master, who) => master.dispatch({ type: 'huddle:release' }, who)),
  'chat:send': chat,
};

/** Own keys only: "toString" or "__proto__" are in every object, and are no Rackside message. */
const isClientEvent = (event: unknown): event is ClientEventName => typeof event === 'string' && Object.hasOwn(commands, event);

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

export type HandlersDeps = Pick<Application, 'config' | 'registry' | 'logger'>;

/** Answers the client events of each socket it is given, through the table of commands. */
export function createHandlers(io: RacksideServer, deps: HandlersDeps, presence: Presence, peers: Peers, gate: Gate) {
  const { config, logger } = deps;
  const ctx: Context = {
    ...deps,
    io,
    presence,
    peers,
    limits: {
      chat: peers.limiter('chat', config.rateLimits.chatPerMinute, 60),
      act: peers.limiter('act', config.rateLimits.actions.max, Math.max(1, Math.round(config.rateLimits.actions.windowMs / 1000))),
    },
  };

  async function handle<E extends ClientEventName>(event: E, input: unknown, socket: RacksideSocket, ack: (answer: AckOf<E>) => void) {
    if (gate.closing) {
      ack({ ok: false, code: 'SHUTTING_DOWN', message: 'Rackside is restarting. Your table will be back in a moment; send that again then.' });
      return;
    }
    const at = controlCharacterAt(input);
    if (at) {
      ack({ ok: false, code: 'BAD_INPUT', message: `"${at}" holds a control character (such as NUL), which no Rackside text may hold. Remove it and send again.` });
      return;
    }
    const parsed = schemas[event].safeParse(input ?? {});
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      ack({ ok: false, code: 'BAD_INPUT', message: `That ${event} message is not one Rackside understands: ${issue ? issueMessage(issue) : 'it is empty.'}` });
      return;
    }
    gate.enter();
    try {
      const answer = await commands[event](parsed.data, socket, ctx);
      ack({ ok: true, ...answer });
    } catch (err) {
      if (err instanceof TableError) ack({ ok: false, code: err.code, message: err.message });
      else {
        logger.error({ err, event }, `Unexpected error in ${event}`);
        ack({ ok: false, code: 'SERVER_ERROR', message: 'Something went wrong on our side. Please try again.' });
      }
    } finally {
      gate.exit();
    }
  }

  return function attach(socket: RacksideSocket) {
    // One listener for every event: what arrives is untrusted until its event is known and its payload parsed.
    socket.onAny((event: unknown, ...args: unknown[]) => {
      const last = args[args.length - 1];
      const ack = typeof last === 'function' ? (args.pop(), (answer: unknown) => void last(answer)) : () => undefined;
      if (isClientEvent(event)) void handle(event, args[0], socket, ack);
      else if (typeof last === 'function') ack({ ok: false, code: 'UNKNOWN_EVENT', message: `Rackside has no "${String(event).slice(0, 40)}" message.` });
    });
    socket.on('disconnect', () => {
      presence.leave(socket).catch((err) => logger.error({ err }, 'leaving a table failed'));
    });
  };
}

import { io, type Socket } from 'socket.io-client';
import type { Ack, ClientEventName, ClientPayload, ClientToServerEvents, ServerToClientEvents } from '../../../../shared/protocol';
import { sessionEnded } from '../../../lib/session-end';
import { onSessionChange } from '../../../lib/session-change';
import { useTableStore } from './table-store';

type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

const ACK_TIMEOUT_MS = 10_000;
export const SIGNED_OUT_PROBLEM = 'You were signed out. Sign in again to come back to this table.';
let socket: ClientSocket | null = null;
let joined: { tableId: string; invite?: string } | null = null;
/** Set when the server closed the connection itself: the next connect joins the table again. */
let rejoinOnConnect = false;

function rejoin(s: ClientSocket) {
  if (joined) s.emit('table:join', { tableId: joined.tableId, as: 'player', invite: joined.invite }, () => {});
}

/**
 * The socket carries the table's id in its handshake (`?table=`): with several processes, the
 * balancer sends every connection of one table to the one process that runs it.
 */
function open(tableId: string | null): ClientSocket {
  const store = useTableStore.getState;
  const s: ClientSocket = io({ withCredentials: true, transports: ['websocket', 'polling'], query: tableId ? { table: tableId } : {} });
  store().connectionChanged('connecting');
  s.on('connect', () => {
    store().connectionChanged('online');
    if (rejoinOnConnect) {
      rejoinOnConnect = false;
      rejoin(s);
    }
  });
  // After a drop, join again: the server sends a full table:state on every join, so nothing is lost.
  s.io.on('reconnect', () => rejoin(s));
  s.on('disconnect', (reason) => {
    if (reason === 'io client disconnect') return;
    if (reason === 'io server disconnect') {
      // The server closed this connection on purpose, most often because the session ended (a sign-out in
      // another tab). Socket.IO does not retry that by itself: ask once; a refused handshake says which.
      store().connectionChanged('connecting', 'The table closed the connection. Rackside is checking that you are still signed in…');
      rejoinOnConnect = true;
      s.connect();
      return;
    }
    store().connectionChanged('offline', 'The connection dropped. Rackside is trying again…');
  });
  s.on('connect_error', (err) => {
    const code = (err as Error & { data?: { code?: string } }).data?.code;
    if (code === 'UNAUTHENTICATED') {
      rejoinOnConnect = false;
      store().connectionChanged('signed-out', SIGNED_OUT_PROBLEM);
      sessionEnded();
      return;
    }
    store().connectionChanged('offline', 'Rackside cannot reach the table just now. Trying again…');
  });
  s.on('table:state', (state) => store().stateArrived(state));
  s.on('chat:message', (message) => store().chatArrived(message));
  return s;
}

export function getSocket(tableId: string | null = null): ClientSocket {
  if (!socket) {
    socket = open(tableId);
    onSessionChange(renewSocket);
  } else if (tableId !== null && (socket.io.opts.query as Record<string, string> | undefined)?.table !== tableId) {
    // Another table may be run by another process: connect again with this table's id. What is sent
    // meanwhile waits in the socket's buffer and goes out once the new connection is up.
    socket.io.opts.query = { table: tableId };
    socket.disconnect();
    socket.connect();
  }
  return socket;
}

/** Sends one client event and waits for its ack (a timeout becomes an ack with code TIMEOUT). */
export function send<E extends ClientEventName>(event: E, payload: ClientPayload<E>): Promise<Ack> {
  const s = getSocket();
  // A refused session is not a slow table: say so at once rather than after the ack timeout.
  if (useTableStore.getState().connection === 'signed-out') return Promise.resolve({ ok: false, code: 'UNAUTHENTICATED', message: SIGNED_OUT_PROBLEM });
  return new Promise((resolve) => {
    const timed = s.timeout(ACK_TIMEOUT_MS) as unknown as { emit: (e: E, p: ClientPayload<E>, cb: (err: Error | null, ack: Ack) => void) => void };
    timed.emit(event, payload, (err, ack) =>
      resolve(err ? { ok: false, code: 'TIMEOUT', message: 'The table did not answer. Check your connection and try again.' } : ack),
    );
  });
}

export function joinTable(tableId: string, invite?: string) {
  joined = { tableId, invite };
  useTableStore.getState().watch(tableId);
  getSocket(tableId);
  return send('table:join', { tableId, as: 'player', invite });
}

export function leaveTable() {
  if (joined && socket?.connected) socket.emit('table:leave', {}, () => {});
  joined = null;
  useTableStore.getState().reset();
}

/** A socket opened before sign-in keeps the old session: call this after signing in or out. */
export function renewSocket() {
  if (!socket) return;
  // Not 'signed-out' any more: a table opened right after signing in joins without waiting for the socket.
  useTableStore.getState().connectionChanged('connecting');
  socket.disconnect();
  socket.connect();
}

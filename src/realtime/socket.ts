import { io, type Socket } from 'socket.io-client';
import type { Ack, ClientEventName, ClientPayload, ClientToServerEvents, ServerToClientEvents } from '../../shared/protocol';
import { onSessionChange } from './session';
import { useTableStore } from './tableStore';

type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

const ACK_TIMEOUT_MS = 10_000;
let socket: ClientSocket | null = null;
let joined: { tableId: string; invite?: string } | null = null;

function open(): ClientSocket {
  const store = useTableStore.getState;
  const s: ClientSocket = io({ withCredentials: true, transports: ['websocket', 'polling'] });
  store().connectionChanged('connecting');
  s.on('connect', () => store().connectionChanged('online'));
  // After a drop, join again: the server sends a full table:state on every join, so nothing is lost.
  s.io.on('reconnect', () => {
    if (joined) s.emit('table:join', { tableId: joined.tableId, as: 'player', invite: joined.invite }, () => {});
  });
  s.on('disconnect', () => store().connectionChanged('offline', 'The connection dropped. Rackside is trying again…'));
  s.on('connect_error', (err) => {
    const code = (err as Error & { data?: { code?: string } }).data?.code;
    store().connectionChanged('offline', code === 'UNAUTHENTICATED' ? 'Please sign in to sit at a table.' : 'Rackside cannot reach the table just now. Trying again…');
  });
  s.on('table:state', (state) => store().stateArrived(state));
  s.on('chat:message', (message) => store().chatArrived(message));
  return s;
}

export function getSocket(): ClientSocket {
  if (!socket) {
    socket = open();
    onSessionChange(renewSocket);
  }
  return socket;
}

/** Sends one client event and waits for its ack (a timeout becomes an ack with code TIMEOUT). */
export function send<E extends ClientEventName>(event: E, payload: ClientPayload<E>): Promise<Ack> {
  const s = getSocket();
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
  socket.disconnect();
  socket.connect();
}

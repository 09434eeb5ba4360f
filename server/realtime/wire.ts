/**
 * The shapes of Rackside's Socket.IO server, shared by its parts (handshake, presence, peers,
 * handlers): what a socket carries, what the processes tell each other, and the rooms.
 */
import type { Server, Socket } from 'socket.io';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/protocol';
import type { Member, TablePosition } from './table-master';

/** What the handshake learns of a socket's user, and the table it joined. */
export interface SocketData {
  userId: number;
  displayName: string;
  isAdmin: boolean;
  sessionId?: string;
  tableId?: string;
  as?: 'player' | 'spectator';
}

/** A process stored a change to a table: the others catch up to this position. */
export type TableMoved = TablePosition & { tableId: string; whole: boolean };

/**
 * What one Rackside process tells the others through the Redis adapter. Another process may run
 * another version of Rackside, so a listener still checks what it is given.
 */
export interface InterServerEvents {
  /** Count again who is at this table, on every process. */
  'table:presence': (tableId: string) => void;
  'table:moved': (told: TableMoved) => void;
  /** This user's account changed: their sockets read it again (./sessions.ts). */
  'user:refresh': (userId: number) => void;
}

export type RacksideServer = Server<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;
export type RacksideSocket = Socket<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;

export const tableRoom = (tableId: string) => `table:${tableId}`;
export const sessionRoom = (sessionId: string) => `session:${sessionId}`;
export const userRoom = (userId: number) => `user:${userId}`;

/** Who the socket is to the table it joined. */
export function memberOf(socket: RacksideSocket): Member {
  return { userId: socket.data.userId, displayName: socket.data.displayName, as: socket.data.as ?? 'player', isAdmin: socket.data.isAdmin };
}

/**
 * Who is at a table, and what each of them is shown: the sockets in a table's room, counted on every
 * process when there are several, and each sent its own view of the table.
 */
import type { Application } from '../app';
import type { TableMaster } from './table-master';
import type { Peers } from './peers';
import { memberOf, tableRoom, type RacksideServer, type RacksideSocket, type SocketData } from './wire';

export type PresenceDeps = Pick<Application, 'registry' | 'logger'>;

export interface Presence {
  /**
   * Sends every socket at the table its own view, then lets the bots think. Without `force`, a
   * table whose shown version was already sent is skipped: one stored group of actions gives each
   * viewer one state, however many of the group's actions are then acked.
   */
  broadcast(master: TableMaster, force?: boolean): void;
  /** Counts the socket in (it has joined the table's room) or out. */
  count(master: TableMaster, socket: RacksideSocket, delta: 1 | -1): void;
  /** Counts the table's sockets on every process (through the adapter) and shows the result here. */
  recount(master: TableMaster): void;
  /** Takes the socket away from its table, if it is at one, and shows the others. */
  leave(socket: RacksideSocket): Promise<void>;
}

export function createPresence(io: RacksideServer, { registry, logger }: PresenceDeps, peers: Peers, closing: () => boolean): Presence {
  function broadcast(master: TableMaster, force = true) {
    if (!force && master.sentVersion === master.shownVersion && master.sentNotes === master.noteCount) return;
    master.sentVersion = master.shownVersion;
    master.sentNotes = master.noteCount;
    const ids = io.of('/').adapter.rooms.get(tableRoom(master.id));
    for (const id of ids ?? []) {
      const socket = io.of('/').sockets.get(id);
      if (socket) socket.emit('table:state', master.stateFor(memberOf(socket)));
    }
    master.wakeBots();
  }

  function count(master: TableMaster, socket: RacksideSocket, delta: 1 | -1) {
    if (socket.data.as === 'spectator') {
      master.spectators = Math.max(0, master.spectators + delta);
    } else {
      const n = (master.connected.get(socket.data.userId) ?? 0) + delta;
      if (n > 0) master.connected.set(socket.data.userId, n);
      else master.connected.delete(socket.data.userId);
      master.presenceChanged();
    }
    if (peers.shared && !closing()) {
      // Who is here counts the sockets of every process: count again here, and have the others do so.
      peers.askRecount(master.id);
      recount(master);
    }
  }

  function recount(master: TableMaster) {
    io.in(tableRoom(master.id))
      .fetchSockets()
      .then((sockets) => {
        const connected = new Map<number, number>();
        let spectators = 0;
        let remote = 0;
        const local = io.of('/').sockets;
        for (const s of sockets) {
          // Another process may run another version of Rackside: read its sockets with care.
          const data: Partial<SocketData> = s.data;
          if (data.tableId !== master.id || typeof data.userId !== 'number') continue;
          if (!local.has(s.id)) remote += 1;
          if (data.as === 'spectator') spectators += 1;
          else connected.set(data.userId, (connected.get(data.userId) ?? 0) + 1);
        }
        master.connected.clear();
        connected.forEach((n, userId) => master.connected.set(userId, n));
        master.spectators = spectators;
        const shared = remote > 0 && master.remoteSockets <= 0;
        master.remoteSockets = remote;
        master.presenceChanged();
        broadcast(master);
        // This table's sockets are now on more than one process. The others tell this one of their
        // changes from the count on; catch up once on any they stored before it.
        if (shared) return master.catchUp();
      })
      .catch((err) => logger.warn({ tableId: master.id, error: (err as Error).message }, 'counting the sockets of every process failed'));
  }

  async function leave(socket: RacksideSocket) {
    const tableId = socket.data.tableId;
    if (!tableId) return;
    socket.data.tableId = undefined;
    await socket.leave(tableRoom(tableId));
    const master = await registry.peek(tableId);
    if (master) {
      count(master, socket, -1);
      broadcast(master);
    }
  }

  return { broadcast, count, recount, leave };
}

import { create } from 'zustand';
import type { ChatMessageDto, TableStateDto } from '../../../../shared/protocol';
import { receivedAnnouncement } from './announce';

/** 'signed-out': the server refused this tab's session; nothing is retried until the person signs in again. */
export type Connection = 'idle' | 'connecting' | 'online' | 'offline' | 'signed-out';

interface TableStore {
  table: TableStateDto | null;
  chat: ChatMessageDto[];
  connection: Connection;
  /** Why the connection failed, in words for people. */
  problem: string | null;
  /** The last thing to read aloud about the table (tiles received). */
  announcement: string;
  /** The table this tab has joined; states of any other table are ignored. */
  watching: string | null;
  /** The socket's own writers: nothing else calls these. */
  stateArrived: (state: TableStateDto) => void;
  chatArrived: (message: ChatMessageDto) => void;
  connectionChanged: (connection: Connection, problem?: string | null) => void;
  watch: (tableId: string | null) => void;
  reset: () => void;
}

const CHAT_KEEP = 200;

/** The live table, written only by the socket (src/features/table/api/socket.ts). */
export const useTableStore = create<TableStore>()((set) => ({
  table: null,
  chat: [],
  connection: 'idle',
  problem: null,
  announcement: '',
  watching: null,
  stateArrived: (state) =>
    set((s) => {
      if (s.watching && state.tableId !== s.watching) return s;
      const same = s.table?.tableId === state.tableId;
      if (same && s.table && state.version < s.table.version) return s;
      const said = receivedAnnouncement(same ? s.table : null, state);
      return { table: state, chat: same ? s.chat : [], announcement: said ?? s.announcement };
    }),
  chatArrived: (message) =>
    set((s) => (s.table && message.tableId !== s.table.tableId ? s : { chat: [...s.chat, message].slice(-CHAT_KEEP) })),
  connectionChanged: (connection, problem = null) => set({ connection, problem }),
  watch: (tableId) => set({ watching: tableId, table: null, chat: [], announcement: '' }),
  reset: () => set({ table: null, chat: [], announcement: '', problem: null, watching: null }),
}));

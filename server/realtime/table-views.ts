/** What each viewer is shown of a table: its DTO for lists, and its live state for one viewer. */
import { rackOf, viewFor } from '../../shared/exchange';
import type { Viewer } from '../../shared/exchange/types';
import type { HuddleNoteDto, SeatOccupant, SeatStateDto, TableDto, TableOptions, TableStateDto } from '../../shared/protocol';
import { SEATS, seatOfUser, type Seat } from '../../shared/seats';
import type { TableExchange } from '../../shared/table';
import type { StoredTableOptions, TableRecord } from './table-store';

export interface Member {
  userId: number;
  displayName: string;
  as: 'player' | 'spectator';
  isAdmin: boolean;
}

/** Who is at the table in this process's count. */
export interface Presence {
  readonly connected: ReadonlyMap<number, number>;
  readonly spectators: number;
  /** When a seated player's last connection closed (ms), or null while connected. */
  awayTime(userId: number): number | null;
}

/** A table as it may be shown: its row, and its exchange as of the last stored event. */
export interface Sight {
  row: TableRecord;
  exchange: TableExchange | null;
  version: number;
  presence: Presence;
}

/** A table nobody in this process is at: everyone seated counts as away since now. */
export function absentPresence(now = Date.now()): Presence {
  return { connected: new Map(), spectators: 0, awayTime: () => now };
}

export function occupantDto(row: TableRecord, presence: Presence, seat: Seat): SeatOccupant | null {
  const o = row.seats[seat];
  if (!o) return null;
  if (o.kind === 'bot') return o;
  const since = row.status === 'playing' ? presence.awayTime(o.userId) : null;
  return { ...o, connected: presence.connected.has(o.userId), awaySince: since === null ? null : new Date(since).toISOString() };
}

export function tableDto(row: TableRecord, presence: Presence, forUserId: number | null): TableDto {
  return {
    id: row.id,
    name: row.name,
    hostId: row.hostId,
    hostName: row.hostName,
    private: row.private,
    status: row.status,
    options: publicTableOptions(row.options, forUserId === row.hostId),
    seats: Object.fromEntries(SEATS.map((s) => [s, occupantDto(row, presence, s)])) as TableDto['seats'],
    ...(forUserId === row.hostId && row.inviteCode ? { inviteCode: row.inviteCode } : {}),
    currentExchangeId: row.currentExchangeId,
    createdAt: row.createdAt.toISOString(),
  };
}

/** Which engine view a viewer gets. */
export function viewerKind(sight: Sight, viewer: Member): Viewer {
  const { row, exchange } = sight;
  const seat = viewer.as === 'player' ? seatOfUser(row.seats, viewer.userId) : null;
  const isHost = row.hostId === viewer.userId;
  if (exchange && exchange.state.phase === 'done' && (seat || isHost)) return 'replay';
  if (isHost && row.options.teaching) return 'host';
  return seat ?? 'spectator';
}

export function stateFor(sight: Sight, viewer: Member): TableStateDto {
  const { row, exchange: live, presence } = sight;
  const isHost = row.hostId === viewer.userId;
  const mySeat = viewer.as === 'player' ? seatOfUser(row.seats, viewer.userId) : null;
  const kind = viewerKind(sight, viewer);
  const view = live ? viewFor(live.state, kind) : null;
  const seats = Object.fromEntries(
    SEATS.map((seat): [Seat, SeatStateDto] => [seat, { occupant: occupantDto(row, presence, seat), committed: view?.seats[seat].committed ?? false, rackSize: view?.seats[seat].rackSize ?? 0 }]),
  ) as Record<Seat, SeatStateDto>;
  const revealed: TableStateDto['huddle']['revealed'] = {};
  if (live?.huddle.open) {
    for (const seat of live.huddle.revealed) revealed[seat] = { rack: rackOf(live.state, seat), pass: live.state.pending[seat] ?? null };
  }
  return {
    tableId: row.id,
    name: row.name,
    version: sight.version,
    phase: live ? live.state.phase : 'lobby',
    status: row.status,
    hostId: row.hostId,
    isHost,
    mySeat,
    myRack: mySeat && live ? rackOf(live.state, mySeat) : [],
    seats,
    options: publicTableOptions(row.options, isHost),
    exchangeId: live?.id ?? null,
    view,
    huddle: { open: live?.huddle.open ?? false, revealed, notes: live ? notesFor(live.notes, isHost ? 'host' : kind) : [] },
    spectators: presence.spectators,
    ...(isHost && row.inviteCode ? { inviteCode: row.inviteCode } : {}),
  };
}

/**
 * A note for the whole table is everyone's as it is written. A note on one seat is coaching for
 * that seat: its player and the host see it at once, everyone else in the replay once the
 * exchange is done (it may speak of that seat's tiles).
 */
export function notesFor(notes: readonly HuddleNoteDto[], viewer: Viewer): HuddleNoteDto[] {
  if (viewer === 'host' || viewer === 'replay') return [...notes];
  return notes.filter((n) => n.seat === null || n.seat === viewer);
}

/**
 * What a viewer sees of a table's options: a drill's preset racks stay on the server, and only
 * the host sees the seed (with the seed and the public engine anyone could work out every rack).
 */
export function publicTableOptions(options: StoredTableOptions, isHost: boolean): TableOptions {
  const { racks: _racks, dealScope: _scope, ...rest } = options;
  if (isHost || rest.seed === null) return rest;
  return { ...rest, seed: null, seedHidden: true };
}

import { SEATS, isSeat, type Seat } from '../seats';
import type { Tile, TileKind } from '../tiles';
import { isBlindPhase } from './constants';
import { isCommitted, legalPassSize } from './status';
import type { ExchangeState, ExchangeView, PassRecord, Viewer } from './types';

function pick<T>(record: Partial<Record<Seat, T>>, seats: readonly Seat[]): Partial<Record<Seat, T>> {
  const out: Partial<Record<Seat, T>> = {};
  for (const seat of seats) if (record[seat] !== undefined) out[seat] = record[seat];
  return out;
}

const empty = (): Record<Seat, string[]> => ({ east: [], south: [], west: [], north: [] });

/** A pass record cut down to what `viewer` may know: its own sent and received ids, never a forwarded one. */
function redact(record: PassRecord, viewer: Seat | null): PassRecord {
  const sent = empty();
  const received = empty();
  if (viewer) {
    sent[viewer] = record.sent[viewer].slice();
    received[viewer] = record.received[viewer].slice();
  }
  return { phase: record.phase, sent, forwarded: empty(), received, blind: { ...record.blind } };
}

function copyRecord(record: PassRecord): PassRecord {
  const copy = (lists: Record<Seat, string[]>) => ({
    east: lists.east.slice(),
    south: lists.south.slice(),
    west: lists.west.slice(),
    north: lists.north.slice(),
  });
  return {
    phase: record.phase,
    sent: copy(record.sent),
    forwarded: copy(record.forwarded),
    received: copy(record.received),
    blind: { ...record.blind },
  };
}

/**
 * The state as one viewer may see it; the only way state leaves the engine. Never holds the
 * seed, the wall or the options. A seat sees its own rack, pending pass and received tiles,
 * and of the others only rack sizes and whether they committed; every vote as it comes, and
 * courtesy asks of others once they settle. 'host' and 'replay' see every rack and pass; 'spectator' counts only.
 */
export function viewFor(state: ExchangeState, viewer: Viewer): ExchangeView {
  const seat = isSeat(viewer) ? viewer : null;
  const full = viewer === 'host' || viewer === 'replay';
  const visible: readonly Seat[] = full ? SEATS : seat ? [seat] : [];

  const kindOf = new Map<string, TileKind>();
  for (const s of SEATS) for (const tile of state.racks[s]) kindOf.set(tile.id, tile.kind);
  const kinds: Record<string, TileKind> = {};
  const mention = (id: string) => {
    kinds[id] = kindOf.get(id)!;
  };
  const tilesOf = (ids: string[]): Tile[] =>
    ids.map((id) => {
      mention(id);
      return { id, kind: kindOf.get(id)! };
    });

  const racks: ExchangeView['racks'] = {};
  const pending: ExchangeView['pending'] = {};
  const received: ExchangeView['received'] = {};
  const last = state.history[state.history.length - 1];
  for (const s of visible) {
    racks[s] = tilesOf(state.racks[s].map((tile) => tile.id));
    const committed = state.pending[s];
    if (committed) pending[s] = { tiles: committed.tiles.slice(), blind: committed.blind };
    if (last) received[s] = tilesOf(last.received[s]);
  }

  const history = state.history.map((record) => (full ? copyRecord(record) : redact(record, seat)));
  for (const record of history) {
    for (const lists of [record.sent, record.forwarded, record.received]) {
      for (const s of SEATS) lists[s].forEach(mention);
    }
  }

  const askSettled = state.phase !== 'courtesy-ask';
  const shown = (settled: boolean): readonly Seat[] => (full || (seat && settled) ? SEATS : visible);

  return {
    viewer,
    phase: state.phase,
    seats: {
      east: { rackSize: state.racks.east.length, committed: isCommitted(state, 'east') },
      south: { rackSize: state.racks.south.length, committed: isCommitted(state, 'south') },
      west: { rackSize: state.racks.west.length, committed: isCommitted(state, 'west') },
      north: { rackSize: state.racks.north.length, committed: isCommitted(state, 'north') },
    },
    racks,
    received,
    pending,
    passSize: seat ? legalPassSize(state, seat) : 0,
    blindAllowed: isBlindPhase(state.phase),
    asks: pick(state.asks, shown(askSettled)),
    agreed: pick(state.agreed, shown(askSettled)),
    // The vote is open, as at a real table: every seat and spectator sees each vote as it comes.
    votes: pick(state.votes, SEATS),
    history,
    kinds,
  };
}

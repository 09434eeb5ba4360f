import { useState } from 'react';
import type { TableStateDto } from '../../../shared/protocol';
import type { TileKind } from '../../../shared/tiles';

/** One step of play (this exchange, this pass): picks and messages belong to the step they were made in. */
export function stepKey(table: TableStateDto) {
  return `${table.exchangeId}:${table.view?.phase}:${table.view?.history.length}`;
}

export interface Picks {
  key: string;
  ids: string[];
  blind: number;
}

const picksKey = (tableId: string) => `rackside:picks:${tableId}`;

function storedPicks(tableId: string): Picks {
  try {
    const raw = JSON.parse(sessionStorage.getItem(picksKey(tableId)) ?? 'null') as Partial<Picks> | null;
    if (raw && typeof raw.key === 'string' && Array.isArray(raw.ids) && raw.ids.every((x) => typeof x === 'string') && typeof raw.blind === 'number') {
      return { key: raw.key, ids: raw.ids, blind: raw.blind };
    }
  } catch {
    // Nothing kept, or something unreadable: start with no picks.
  }
  return { key: '', ids: [], blind: 0 };
}

function keepPicks(tableId: string, picks: Picks) {
  try {
    sessionStorage.setItem(picksKey(tableId), JSON.stringify(picks));
  } catch {
    // Storage full or off: the picks live only on this page.
  }
}

/** The picks of a pass, kept in this browser tab until it resolves: a refresh or the back button keeps them. */
export function usePicks(tableId: string) {
  const [pick, setPickState] = useState<Picks>(() => storedPicks(tableId));
  const setPick = (next: Picks) => {
    setPickState(next);
    keepPicks(tableId, next);
  };
  return { pick, setPick };
}

/** The rack's tile ids for an advised pass's kinds (never a joker, each tile once). */
export function idsFor(rack: TableStateDto['myRack'], kinds: readonly TileKind[]): string[] {
  const used = new Set<string>();
  return kinds.flatMap((kind) => {
    const tile = rack.find((t) => t.kind === kind && t.kind !== 'joker' && !used.has(t.id));
    if (!tile) return [];
    used.add(tile.id);
    return [tile.id];
  });
}

import { useState } from 'react';
import { kindOrder, rankOf, type Tile } from '../../../shared/tiles';

export type RackSort = 'suit' | 'number';

export function sortTiles(tiles: readonly Tile[], by: RackSort): Tile[] {
  const key = (t: Tile) => (by === 'number' ? (rankOf(t.kind) ?? 10) * 100 + kindOrder(t.kind) : kindOrder(t.kind));
  return tiles.slice().sort((a, b) => key(a) - key(b) || a.id.localeCompare(b.id));
}

/** Tiles in the player's own order: new tiles join at the end, gone ones drop out. */
export function arrange(tiles: readonly Tile[], order: readonly string[]): Tile[] {
  const byId = new Map(tiles.map((t) => [t.id, t]));
  const kept = order.filter((id) => byId.has(id)).map((id) => byId.get(id)!);
  const known = new Set(order);
  return [...kept, ...tiles.filter((t) => !known.has(t.id))];
}

export function moveTile(order: readonly string[], id: string, to: number): string[] {
  const next = order.filter((x) => x !== id);
  next.splice(Math.max(0, Math.min(to, next.length)), 0, id);
  return next;
}

/** The rack's order as component state: sorted by suit at first, then as the player arranges it. */
export function useRackOrder(tiles: readonly Tile[]) {
  const [order, setOrder] = useState<string[]>([]);
  const arranged = order.length === 0 ? sortTiles(tiles, 'suit') : arrange(tiles, order);
  return {
    tiles: arranged,
    sortBy: (by: RackSort) => setOrder(sortTiles(tiles, by).map((t) => t.id)),
    move: (id: string, to: number) => setOrder(moveTile(arranged.map((t) => t.id), id, to)),
  };
}

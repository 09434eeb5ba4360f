/**
 * The seed a deal is really dealt from. A seed name alone never reproduces a deal: the engine's
 * seed is derived from the name, where it was given (one table, or one drill or lesson whose
 * tables all share it) and how many deals that table has dealt before. So a name guessed or read
 * elsewhere deals other racks at anybody else's table, and a table dealing again never repeats a
 * deal whose replay is already out.
 */
import { createHmac, randomBytes } from 'node:crypto';
import type { TableRow } from '../db/models';

/** Where a seed name holds: the drill or lesson that gave it to its tables, else the table itself. */
export function dealScope(table: Pick<TableRow, 'id' | 'options'>): string {
  return table.options.dealScope ?? (table.options.drillId ? `drill:${table.options.drillId}` : `table:${table.id}`);
}

/**
 * The key that makes derived seeds unguessable: without it, a seed name, a table id and a count
 * of deals (all of which a player may know) would give away the table's next deal. Set once per
 * process from LINK_SECRET (the same on every process); the default serves throwaway tests only.
 */
let secret = 'rackside-deal-key-for-tests';

export function setDealSecret(key: string) {
  secret = key;
}

/** The engine seed for deal number `round` (0 for the first) of a table, from its seed name. */
export function dealSeed(scope: string, seedName: string, round: number): string {
  const digest = createHmac('sha256', secret).update(JSON.stringify(['rackside-deal', scope, seedName, round])).digest('base64url');
  return `deal-${digest.slice(0, 32)}`;
}

/** The seed of a table's next deal: derived from its seed name, or fresh chance when it has none. */
export function nextDealSeed(table: Pick<TableRow, 'id' | 'options'>, round: number): { seed: string; seedName: string | null } {
  const name = table.options.seed;
  if (!name) return { seed: randomBytes(12).toString('base64url'), seedName: null };
  return { seed: dealSeed(dealScope(table), name, round), seedName: name };
}

/**
 * Same deal, compared: finished exchanges grouped by the deal they played (seed, preset racks,
 * jokers and pattern list), each table's seats side by side and every seat in one standings list.
 */
import { Op } from 'sequelize';
import type { ComparedSeatDto, ComparedTableDto, ComparisonDto, DealComparisonDto, StandingDto } from '../../../shared/comparisons';
import type { ExchangeOptions } from '../../../shared/exchange/types';
import { SEATS, seatOfUser } from '../../../shared/seats';
import { ExchangeRow, isParticipant, TableRow } from '../../db/models';
import { dealScope, dealSeed } from '../../services/deal-seed';
import { figuresFor, listsFor } from '../../services/exchange-stats';

export interface Viewer {
  id: number;
  role: string;
}

/** Exchanges play the same deal when these match; the pattern list is part of the key so figures compare. */
export function dealKey(options: ExchangeOptions, listId: string): string {
  const racks = options.racks ? SEATS.map((s) => `${s}:${[...(options.racks![s] ?? [])].sort().join(',')}`).join(';') : '';
  return JSON.stringify([options.seed, options.jokers !== false, racks, listId]);
}

/** Places by a number, fewest first; equal numbers share a place (1, 1, 3). */
function placed<T>(items: T[], value: (item: T) => number[]): (T & { place: number })[] {
  const order = items.slice().sort((a, b) => {
    const x = value(a);
    const y = value(b);
    for (let i = 0; i < x.length; i++) if (x[i] !== y[i]) return x[i] - y[i];
    return 0;
  });
  let place = 0;
  return order.map((item, i) => {
    if (i === 0 || value(order[i - 1]).join() !== value(item).join()) place = i + 1;
    return { ...item, place };
  });
}

const round = (n: number) => Math.round(n * 100) / 100;

/**
 * Deals the viewer still has passes to make on: the deal under way, or the next one, at every
 * table of these hosts where the viewer sits. Seeing another table's passes, or a replay, of such
 * a deal first would show the viewer its racks.
 */
export async function dealsStillToPlay(viewerId: number, hostIds: readonly number[]): Promise<Set<string>> {
  const open = new Set<string>();
  if (!hostIds.length) return open;
  const tables = await TableRow.findAll({ where: { hostId: { [Op.in]: [...new Set(hostIds)] } }, attributes: ['id', 'seats', 'options', 'status', 'currentExchangeId'], limit: 500 });
  const mine = tables.filter((t) => t.options.seed && seatOfUser(t.seats, viewerId) !== null);
  if (!mine.length) return open;
  const counts = (await ExchangeRow.count({ where: { tableId: { [Op.in]: mine.map((t) => t.id) } }, group: ['tableId'] })) as unknown as { tableId: string; count: number }[];
  const dealt = new Map(counts.map((c) => [c.tableId, Number(c.count)]));
  // A deal under way is read as stored; the next deal of any other table is worked out as it will be dealt.
  const current = mine.filter((t) => t.status === 'playing' && t.currentExchangeId).map((t) => t.currentExchangeId!);
  const underWay = new Map((current.length ? await ExchangeRow.findAll({ where: { id: { [Op.in]: current } }, attributes: ['id', 'options'] }) : []).map((e) => [e.id, e.options]));
  for (const t of mine) {
    const listId = t.options.patternListId ?? 'starter';
    const stored = t.status === 'playing' && t.currentExchangeId ? underWay.get(t.currentExchangeId) : undefined;
    if (stored) open.add(dealKey(stored, listId));
    else open.add(dealKey({ seed: dealSeed(dealScope(t), t.options.seed!, dealt.get(t.id) ?? 0), jokers: t.options.jokers, racks: t.options.racks }, listId));
  }
  return open;
}

export async function compareExchanges(rows: readonly ExchangeRow[], viewer: Viewer, title: string): Promise<ComparisonDto> {
  const lists = await listsFor(rows);
  const tableIds = [...new Set(rows.map((r) => r.tableId))];
  const tables = tableIds.length ? await TableRow.findAll({ where: { id: { [Op.in]: tableIds } }, attributes: ['id', 'options'] }) : [];
  const drillNameOf = new Map(tables.map((t) => [t.id, t.options.drillName ?? null]));
  const groups = new Map<string, ExchangeRow[]>();
  for (const row of rows) {
    const key = dealKey(row.options, lists.get(row.id)!.id);
    groups.set(key, [...(groups.get(key) ?? []), row]);
  }
  const open = viewer.role === 'admin' ? new Set<string>() : await dealsStillToPlay(viewer.id, rows.map((r) => r.hostId));

  const deals: DealComparisonDto[] = [];
  const withheld: ComparisonDto['withheld'] = [];
  let index = 0;
  for (const [key, group] of groups) {
    index++;
    const done = group.filter((r) => r.status === 'done');
    const drillName = group.map((r) => drillNameOf.get(r.tableId)).find(Boolean) ?? null;
    const host = viewer.role === 'admin' || group.every((r) => r.hostId === viewer.id);
    const dealTitle = drillName ? `Drill: ${drillName}` : host && group[0].options.seedName ? `Seed ${group[0].options.seedName}` : `Deal ${index}`;
    if (!host) {
      if (!done.some((r) => isParticipant(r, viewer.id))) {
        withheld.push({ title: dealTitle, reason: 'You have not finished a table on this deal yet. It opens once you have.' });
        continue;
      }
      if (open.has(key) || group.some((r) => r.status !== 'done' && isParticipant(r, viewer.id))) {
        withheld.push({ title: dealTitle, reason: 'You are still to play this deal at another table. It opens once that table finishes.' });
        continue;
      }
    }
    const figures = await figuresFor(done, () => SEATS, false);
    const compared = done.map((row) => {
      const { seats: bySeat } = figures.get(row.id)!;
      const seats = SEATS.map((seat): ComparedSeatDto => {
        const f = bySeat[seat]!;
        const o = row.seats[seat];
        return {
          seat,
          player: o?.displayName ?? seat,
          kind: o?.kind ?? 'user',
          awayBefore: f.awayBefore,
          awayAfter: f.awayAfter,
          nearest: f.nearest,
          passes: f.passes.map((p) => ({ phase: p.phase, sent: p.sent, blind: p.blind })),
        };
      });
      const afters = seats.map((s) => s.awayAfter);
      return {
        exchangeId: row.id,
        tableId: row.tableId,
        tableName: row.tableName,
        finishedAt: row.finishedAt?.toISOString() ?? null,
        bestAfter: Math.min(...afters),
        meanAfter: round(afters.reduce((a, b) => a + b, 0) / afters.length),
        seats,
      };
    });
    const ranked: ComparedTableDto[] = placed(compared, (t) => [t.bestAfter, t.meanAfter]);
    const standings: StandingDto[] = placed(
      ranked.flatMap((t) => t.seats.map((s) => ({ exchangeId: t.exchangeId, tableName: t.tableName, seat: s.seat, player: s.player, awayBefore: s.awayBefore, awayAfter: s.awayAfter, nearest: s.nearest }))),
      (s) => [s.awayAfter],
    );
    deals.push({
      key: `deal-${index}`,
      title: dealTitle,
      drillName,
      seed: host ? (group[0].options.seedName ?? null) : null,
      patternListName: lists.get(group[0].id)!.name,
      tables: ranked,
      standings,
      stillPlaying: group.length - done.length,
    });
  }
  return { title, deals, withheld };
}

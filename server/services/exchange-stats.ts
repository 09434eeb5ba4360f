/**
 * Figures of a finished exchange, per seat, rebuilt from its options and log: tiles away after the
 * deal and at the end, what each pass sent, and whether it followed the advice, broke a pair or
 * gave up a flower. Finished exchanges never change, so figures are kept once worked out.
 */
import { Op } from 'sequelize';
import { advisePass, bestAway, completionOdds, rankPatterns, type Pattern } from '../../shared/analysis';
import { createExchange, isBlindPhase, isPassPhase, replay } from '../../shared/exchange';
import type { ExchangeOptions, LogEntry, Phase } from '../../shared/exchange/types';
import { SEATS, type Seat } from '../../shared/seats';
import type { TileKind } from '../../shared/tiles';
import { TableRow, type ExchangeRow } from '../db/models';
import { patternsForTable } from '../teaching/pattern-lists';
import { storedLogs } from './exchange-log';

/** One pass of one seat, with the rack it was chosen from. */
export interface SeatPass {
  phase: Phase;
  rack: TileKind[];
  sent: TileKind[];
  blind: number;
}

export interface SeatRecord {
  start: TileKind[];
  end: TileKind[];
  passes: SeatPass[];
}

/** What each seat held after the deal and at the end, and each pass it sent (a courtesy pass of 0 tiles is none). */
export function seatRecords(options: ExchangeOptions, log: readonly LogEntry[]): Record<Seat, SeatRecord> {
  const dealt = createExchange(options);
  const final = replay(options, [...log]);
  const kinds = new Map<string, TileKind>();
  for (const tile of [...SEATS.flatMap((s) => dealt.racks[s]), ...dealt.wall]) kinds.set(tile.id, tile.kind);
  const kindsOf = (ids: readonly string[]) => ids.map((id) => kinds.get(id)!);
  const out = {} as Record<Seat, SeatRecord>;
  for (const seat of SEATS) {
    let rack = dealt.racks[seat].map((t) => t.id);
    const passes: SeatPass[] = [];
    for (const record of final.history) {
      if (!isPassPhase(record.phase)) continue;
      const sent = record.sent[seat];
      if (sent.length + record.blind[seat] > 0) passes.push({ phase: record.phase, rack: kindsOf(rack), sent: kindsOf(sent), blind: record.blind[seat] });
      // Tiles forwarded blind never land, so a rack loses what it sent and gains what it received.
      const gone = new Set(sent);
      rack = [...rack.filter((id) => !gone.has(id)), ...record.received[seat]];
    }
    out[seat] = { start: kindsOf(dealt.racks[seat].map((t) => t.id)), end: final.racks[seat].map((t) => t.kind), passes };
  }
  return out;
}

export interface PassFigures {
  phase: Phase;
  sent: TileKind[];
  blind: number;
  /** The top advice for that rack at that step, when advice was worked out (the first of any tied for the top score). */
  advised: { tiles: TileKind[]; blind: number } | null;
  asAdvised: boolean;
  /** Sent a tile of a pair the advice kept (a pass as advised never counts). */
  brokePair: boolean;
  passedFlower: boolean;
}

export interface SeatFigures {
  awayBefore: number;
  awayAfter: number;
  /** Odds of finishing the likeliest pattern of the list, from the dealt rack and from the final one. */
  oddsBefore: number;
  oddsAfter: number;
  nearest: string | null;
  passes: PassFigures[];
}

/** Scores closer than this count as equal (they are sums of floating-point weights). */
const SCORE_TIE = 1e-9;

const sorted = (kinds: readonly TileKind[]) => [...kinds].sort().join(' ');

/** A pass breaks a pair when it sends a tile of a kind the rack held two or more of; jokers never pass. */
export function breaksPair(rack: readonly TileKind[], sent: readonly TileKind[]): boolean {
  return sent.some((kind) => kind !== 'joker' && rack.filter((k) => k === kind).length >= 2);
}

/** Played out fewer times than at the table: a figure for a list of many exchanges, seeded by the rack so it repeats. */
const HISTORY_SAMPLES = 100;
function bestOdds(rack: readonly TileKind[], patterns: readonly Pattern[]): number {
  return completionOdds(rack, patterns, { samples: HISTORY_SAMPLES, seed: [...rack].sort().join(',') }).patterns[0]?.odds ?? 0;
}

export function seatFigures(record: SeatRecord, patterns: readonly Pattern[], withAdvice: boolean): SeatFigures {
  return {
    awayBefore: bestAway(record.start, patterns),
    awayAfter: bestAway(record.end, patterns),
    oddsBefore: bestOdds(record.start, patterns),
    oddsAfter: bestOdds(record.end, patterns),
    nearest: rankPatterns(record.end, patterns, 1)[0]?.pattern.name ?? null,
    passes: record.passes.map((p): PassFigures => {
      const advice = withAdvice ? advisePass(p.rack, patterns, { phase: p.phase, blindAllowed: isBlindPhase(p.phase), count: p.sent.length + p.blind }) : [];
      // Suggestions that tie with the top score are equally the advice.
      const best = advice.filter((a) => a.score >= advice[0].score - SCORE_TIE);
      const advised = best[0] ? { tiles: best[0].tiles, blind: best[0].blind } : null;
      return {
        phase: p.phase,
        sent: p.sent,
        blind: p.blind,
        advised,
        asAdvised: best.some((a) => a.blind === p.blind && sorted(a.tiles) === sorted(p.sent)),
        // A pair the advice would break too is no slip: only a pair the advice kept counts.
        brokePair: breaksPair(p.rack, p.sent) && !best.some((a) => breaksPair(p.rack, a.tiles)),
        passedFlower: p.sent.includes('flower'),
      };
    }),
  };
}

// ───────────── stored exchanges ─────────────

export interface ExchangeList {
  id: string;
  name: string;
  patterns: Pattern[];
}

/**
 * The pattern list each exchange was judged by at its table. A table's list is set when it opens
 * and never changes, so the table's choice is the exchange's (a list deleted since falls back to
 * the starter list, as the table itself does).
 */
export async function listsFor(rows: readonly ExchangeRow[]): Promise<Map<string, ExchangeList>> {
  const tableIds = [...new Set(rows.map((r) => r.tableId))];
  const tables = tableIds.length ? await TableRow.findAll({ where: { id: { [Op.in]: tableIds } }, attributes: ['id', 'options'] }) : [];
  const listIdOf = new Map(tables.map((t) => [t.id, t.options.patternListId]));
  const lists = new Map<string, ExchangeList>();
  const out = new Map<string, ExchangeList>();
  for (const row of rows) {
    const wanted = listIdOf.get(row.tableId) ?? 'starter';
    let list = lists.get(wanted);
    if (!list) {
      list = await patternsForTable(wanted);
      lists.set(wanted, list);
    }
    out.set(row.id, list);
  }
  return out;
}

const CACHE_MAX = 4000;
const cache = new Map<string, SeatFigures>();

function remember(key: string, figures: SeatFigures) {
  if (cache.size >= CACHE_MAX) cache.delete(cache.keys().next().value!);
  cache.set(key, figures);
}

/** A list's content in a short key, so an edited list is judged afresh. */
const listKeys = new WeakMap<readonly Pattern[], string>();
function listKey(patterns: readonly Pattern[]): string {
  const known = listKeys.get(patterns);
  if (known) return known;
  let h = 0;
  const text = JSON.stringify(patterns);
  for (let i = 0; i < text.length; i++) h = (Math.imul(h, 31) + text.charCodeAt(i)) | 0;
  const key = `${text.length}:${h}`;
  listKeys.set(patterns, key);
  return key;
}

/** Figures of the given seats of finished exchanges, keyed by exchange id then seat. */
export async function figuresFor(
  rows: readonly ExchangeRow[],
  seatsOf: (row: ExchangeRow) => readonly Seat[],
  withAdvice: boolean,
): Promise<Map<string, { list: ExchangeList; seats: Partial<Record<Seat, SeatFigures>> }>> {
  const lists = await listsFor(rows);
  const keys = new Map<string, string>();
  const missing = rows.filter((row) => {
    const key = listKey(lists.get(row.id)!.patterns);
    keys.set(row.id, key);
    return seatsOf(row).some((seat) => !cache.has(`${row.id}|${seat}|${key}|${withAdvice}`));
  });
  const logs = await storedLogs(missing.map((r) => r.id));
  const out = new Map<string, { list: ExchangeList; seats: Partial<Record<Seat, SeatFigures>> }>();
  for (const row of rows) {
    const list = lists.get(row.id)!;
    const seats: Partial<Record<Seat, SeatFigures>> = {};
    let records: Record<Seat, SeatRecord> | null = null;
    for (const seat of seatsOf(row)) {
      const key = `${row.id}|${seat}|${keys.get(row.id)}|${withAdvice}`;
      let figures = cache.get(key) ?? (withAdvice ? undefined : cache.get(`${row.id}|${seat}|${keys.get(row.id)}|true`));
      if (!figures) {
        records ??= seatRecords(row.options, logs.get(row.id) ?? []);
        figures = seatFigures(records[seat], list.patterns, withAdvice);
        remember(key, figures);
      }
      seats[seat] = figures;
    }
    out.set(row.id, { list, seats });
  }
  return out;
}

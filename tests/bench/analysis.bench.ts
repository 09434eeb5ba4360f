/**
 * How fast rack analysis runs, on racks dealt from fixed seeds: tiles away of one rack over the
 * whole starter list, pass advice over every option (with and without blind), the full advice
 * with odds, focus and defence for a seat mid-exchange, the rack summary, a bot's choice, the
 * price ranking and the finishing odds. Aims: under 1 ms for the list; the full advice with
 * odds, median under 50 ms and p95 under 150 ms per rack.
 */
import { Bench } from 'tinybench';
import { adviceContextFor, advisePass, adviseRack, chooseBotAction, completionOdds, ODDS_DEFAULTS, rankByPrice, starterPatterns, summarizeRack, tilesAway } from '../../shared/analysis';
import { act, createExchange, resolve, viewFor } from '../../shared/exchange';
import type { ExchangeState } from '../../shared/exchange/types';
import { SEATS } from '../../shared/seats';
import type { TileKind } from '../../shared/tiles';

const DEALS = 64;
const states = Array.from({ length: DEALS }, (_, i) => createExchange({ seed: `analysis-bench-${i}` }));
const racks14: TileKind[][] = states.map((s) => s.racks.east.map((t) => t.kind));
const racks13: TileKind[][] = states.map((s) => s.racks.south.map((t) => t.kind));
// Seats mid-exchange (after two passes, so the defence has history to read), as the table asks.
function afterTwoPasses(state: ExchangeState): ExchangeState {
  for (let pass = 0; pass < 2; pass++) {
    for (const seat of SEATS) {
      const action = chooseBotAction('multiples', viewFor(state, seat), starterPatterns);
      if (action) {
        const result = act(state, seat, action);
        if (result.ok) state = result.state;
      }
    }
    const result = resolve(state);
    if (result.ok) state = result.state;
  }
  return state;
}
const midViews = states.map((s, n) => viewFor(afterTwoPasses(s), SEATS[n % 4]));
let i = 0;
const next = <T>(list: T[]): T => list[i++ % list.length];

const bench = new Bench({ name: 'Rack analysis', time: 1000, warmup: true });
bench
  .add(`tilesAway, 14-tile rack × ${starterPatterns.length} patterns`, () => {
    const rack = next(racks14);
    for (const pattern of starterPatterns) tilesAway(rack, pattern);
  })
  .add(`tilesAway, 13-tile rack × ${starterPatterns.length} patterns`, () => {
    const rack = next(racks13);
    for (const pattern of starterPatterns) tilesAway(rack, pattern);
  })
  .add('advisePass, 14 tiles, every 3-tile choice (up to 364)', () => {
    advisePass(next(racks14), starterPatterns, { phase: 'first-right', blindAllowed: false });
  })
  .add('advisePass, 14 tiles, every choice plus blind options', () => {
    advisePass(next(racks14), starterPatterns, { phase: 'first-left', blindAllowed: true });
  })
  .add('advisePass, 13 tiles, every choice plus blind options', () => {
    advisePass(next(racks13), starterPatterns, { phase: 'second-right', blindAllowed: true });
  })
  .add('full advice with odds, focus and defence, seat mid-exchange (first left, blind allowed)', () => {
    const view = next(midViews);
    const seat = view.viewer as (typeof SEATS)[number];
    adviseRack(view.racks[seat]!.map((t) => t.kind), starterPatterns, adviceContextFor(view));
  }, { retainSamples: true })
  .add('summarizeRack, 14 tiles', () => {
    summarizeRack(next(racks14), starterPatterns);
  })
  .add('advised bot, one pass', () => {
    chooseBotAction('advised', viewFor(next(states), 'east'), starterPatterns);
  })
  .add(`rankByPrice, 14 tiles × ${starterPatterns.length} patterns`, () => {
    rankByPrice(next(racks14), starterPatterns, 10);
  })
  .add(`completionOdds, 14 tiles, defaults (${ODDS_DEFAULTS.samples} samples, ${ODDS_DEFAULTS.drawsLeft} draws, ${ODDS_DEFAULTS.nearest} patterns)`, () => {
    completionOdds(next(racks14), starterPatterns);
  })
  .add('completionOdds, 13 tiles, defaults', () => {
    completionOdds(next(racks13), starterPatterns);
  });

await bench.run();

console.log(`${bench.name} (${process.version}, ${process.arch}), racks from ${DEALS} seeded deals`);
console.table(bench.table());

const stat = (prefix: string, key: 'p50' | 'p75' | 'p99' | 'max') => {
  const task = bench.tasks.find((t) => t.name.startsWith(prefix));
  const result = task?.result as { latency?: Record<string, number> } | undefined;
  return result?.latency?.[key] ?? NaN;
};
const stat2 = (prefix: string, key: 'p50' | 'p95' | 'p99') => {
  const task = bench.tasks.find((t) => t.name.startsWith(prefix));
  const result = task?.result as { latency?: Record<string, number> & { samples?: number[] } } | undefined;
  if (key !== 'p95') return result?.latency?.[key] ?? NaN;
  const samples = [...(result?.latency?.samples ?? [])].sort((a, b) => a - b);
  return samples.length ? samples[Math.min(samples.length - 1, Math.floor(0.95 * samples.length))] : NaN;
};
const full = { p50: stat2('full advice', 'p50'), p95: stat2('full advice', 'p95'), p99: stat2('full advice', 'p99') };
const list = stat('tilesAway, 14', 'p50');
const advice = stat('advisePass, 14 tiles, every choice plus', 'p50');
const adviceMax = stat('advisePass, 14 tiles, every choice plus', 'max');
console.log(`tilesAway over the list: median ${list.toFixed(3)} ms (aim < 1 ms)`);
console.log(`advisePass with blind options: median ${advice.toFixed(2)} ms, slowest ${adviceMax.toFixed(2)} ms`);
console.log(`full advice with odds, focus and defence: median ${full.p50.toFixed(1)} ms, p95 ${full.p95.toFixed(1)} ms, p99 ${full.p99.toFixed(1)} ms (aims: median < 50 ms, p95 < 150 ms)`);
const odds = stat('completionOdds, 14', 'p50');
const oddsTail = stat('completionOdds, 14', 'p99');
const odds13 = stat('completionOdds, 13', 'p50');
console.log(`completionOdds with defaults: median ${odds.toFixed(2)} ms (14 tiles), ${odds13.toFixed(2)} ms (13 tiles); p99 ${oddsTail.toFixed(2)} ms (14 tiles)`);

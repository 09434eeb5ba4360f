/**
 * How fast rack analysis runs, on racks dealt from fixed seeds: tiles away of one rack over the
 * whole starter list, pass advice over every option (with and without blind), the rack
 * summary, a bot's choice, the price ranking and the finishing odds. Aims: under 1 ms for the
 * list, under 30 ms for the full advice.
 */
import { Bench } from 'tinybench';
import { advisePass, chooseBotAction, completionOdds, ODDS_DEFAULTS, rankByPrice, starterPatterns, summarizeRack, tilesAway } from '../../shared/analysis';
import { createExchange, viewFor } from '../../shared/exchange';
import type { TileKind } from '../../shared/tiles';

const DEALS = 64;
const states = Array.from({ length: DEALS }, (_, i) => createExchange({ seed: `analysis-bench-${i}` }));
const racks14: TileKind[][] = states.map((s) => s.racks.east.map((t) => t.kind));
const racks13: TileKind[][] = states.map((s) => s.racks.south.map((t) => t.kind));
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
const list = stat('tilesAway, 14', 'p50');
const advice = stat('advisePass, 14 tiles, every choice plus', 'p50');
const adviceMax = stat('advisePass, 14 tiles, every choice plus', 'max');
console.log(`tilesAway over the list: median ${list.toFixed(3)} ms (aim < 1 ms)`);
console.log(`advisePass with blind options: median ${advice.toFixed(2)} ms, slowest ${adviceMax.toFixed(2)} ms (aim < 30 ms)`);
const odds = stat('completionOdds, 14', 'p50');
const oddsTail = stat('completionOdds, 14', 'p99');
const odds13 = stat('completionOdds, 13', 'p50');
console.log(`completionOdds with defaults: median ${odds.toFixed(2)} ms (14 tiles), ${odds13.toFixed(2)} ms (13 tiles); p99 ${oddsTail.toFixed(2)} ms (14 tiles)`);

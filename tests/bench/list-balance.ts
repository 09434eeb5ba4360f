/**
 * How balanced a pattern list is against random deals, and what each pattern is worth.
 *
 * Deals `--deals` seeded deals (four racks each) and prints, per pattern: how often it is the
 * nearest hand (by tiles away, as rankPatterns ranks; and by price, as rankByPrice ranks), how
 * often it is within 7 tiles, and its mean finishing odds from the dealt rack (completionOdds,
 * over the first `--odds-racks` racks). The value column maps those odds onto Rackside's scale
 * (valueFromOdds: the likeliest pattern 10, the rarest 100, log scale, steps of 5); the starter
 * list's values are written from this column.
 *
 * Run: npm run bench:list -- [--deals 2000] [--list starter|teacher] [--odds-racks 400] [--samples 120] [--seed TEXT]
 */
import { readFileSync } from 'node:fs';
import { buildsWithoutCalls, patternValue, type Pattern } from '../../shared/analysis/pattern';
import { starterPatterns } from '../../shared/analysis/starter-patterns';
import { BALANCE_GOALS, dealtRacks, measureBalance, onlySinglesAndPairs, valueFromOdds } from './balance-measure';
import { readPatternListJson } from '../../server/teaching/pattern-lists/file-json';
import type { TileKind } from '../../shared/tiles';

function arg(name: string, fallback: string): string {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 && process.argv[at + 1] ? process.argv[at + 1] : fallback;
}

const deals = Number(arg('deals', '2000'));
const oddsRacks = Number(arg('odds-racks', '400'));
const samples = Number(arg('samples', '120'));
const seed = arg('seed', 'list-balance');
const listName = arg('list', 'starter');
const list: Pattern[] =
  listName === 'starter' ? starterPatterns : readPatternListJson(readFileSync(listName === 'teacher' ? new URL('../fixtures/teacher-list.json', import.meta.url) : listName, 'utf8')).patterns;

type OddsFn = (rack: readonly TileKind[], list: readonly Pattern[], options: Record<string, unknown>) => { patterns: { id: string; odds: number }[] };
type PriceFn = (rack: readonly TileKind[], list: readonly Pattern[], limit: number) => { pattern: Pattern }[];

/** The finishing-odds simulator and price ranking, when this tree has them. */
async function optional<T>(path: string, name: string): Promise<T | null> {
  try {
    const mod = (await import(path)) as Record<string, unknown>;
    return (mod[name] as T) ?? null;
  } catch {
    return null;
  }
}

const pct = (x: number) => `${(100 * x).toFixed(1)}%`;
const pad = (s: string, n: number) => s.padEnd(n);
const lpad = (s: string, n: number) => s.padStart(n);

async function main() {
  const started = performance.now();
  const racks = dealtRacks(deals, seed);
  const balance = measureBalance(list, racks);
  const completionOdds = await optional<OddsFn>('../../shared/analysis/odds', 'completionOdds');
  const rankByPrice = await optional<PriceFn>('../../shared/analysis/price', 'rankByPrice');

  const byPrice = new Map<string, number>();
  if (rankByPrice) {
    for (const rack of racks) {
      const top = rankByPrice(rack, list, 1)[0].pattern.id;
      byPrice.set(top, (byPrice.get(top) ?? 0) + 1);
    }
  }
  const odds = new Map<string, number>();
  const measured = Math.min(oddsRacks, racks.length);
  if (completionOdds && measured > 0) {
    for (let i = 0; i < measured; i++) {
      const result = completionOdds(racks[i], list, { nearest: list.length, samples, seed: `${seed}-odds-${i}` });
      for (const p of result.patterns) odds.set(p.id, (odds.get(p.id) ?? 0) + p.odds / measured);
    }
  }
  const oddsValues = [...odds.values()];
  // A pattern never finished in any sample counts as half a finish: rarer than all the others, by a measured bound.
  const floor = 0.5 / Math.max(1, measured * samples);
  for (const [id, o] of odds) odds.set(id, Math.max(o, floor));
  const likeliest = Math.max(...oddsValues, floor);
  const rarest = Math.min(...oddsValues.map((o) => Math.max(o, floor)));

  console.log(`${list.length} patterns, ${deals} seeded deals (${racks.length} racks, seed "${seed}").`);
  console.log(`Nearest: the pattern fewest tiles away (ties: more natural tiles, then list order)${rankByPrice ? '; by price: rankByPrice\'s first' : ''}.`);
  console.log(`Odds: mean finishing odds from the dealt rack over ${completionOdds ? `${measured} racks, ${samples} samples each (completionOdds defaults otherwise)` : '(completionOdds not in this tree)'}.\n`);
  const head = [pad('pattern', 12), pad('family', 10), 'sealed', lpad('nearest', 8), rankByPrice ? lpad('by price', 9) : '', lpad('≤7 away', 8), lpad('mean away', 10), lpad('odds', 8), lpad('value now', 10), lpad('from odds', 10)];
  console.log(head.filter(Boolean).join(' '));
  list.forEach((p, i) => {
    const b = balance.patterns[i];
    const o = odds.get(p.id);
    const row = [
      pad(p.id, 12),
      pad(p.family, 10),
      pad(buildsWithoutCalls(p) ? 'yes' : '', 6),
      lpad(pct(b.nearest), 8),
      rankByPrice ? lpad(pct((byPrice.get(p.id) ?? 0) / racks.length), 9) : '',
      lpad(pct(b.withinReach), 8),
      lpad(b.meanAway.toFixed(2), 10),
      lpad(o === undefined ? '–' : `${(100 * o).toFixed(3)}%`, 8),
      lpad(String(patternValue(p)), 10),
      lpad(o === undefined ? '–' : String(valueFromOdds(o, likeliest, rarest)), 10),
    ];
    console.log(row.filter(Boolean).join(' '));
  });
  const sp = list.filter(onlySinglesAndPairs).map((p) => p.id);
  const spPrice = sp.reduce((sum, id) => sum + (byPrice.get(id) ?? 0), 0) / racks.length;
  const topPrice = [...byPrice.entries()].sort((a, b) => b[1] - a[1])[0];
  console.log(`\nBy tiles away: the most frequent nearest hand is ${balance.maxNearest.id} in ${pct(balance.maxNearest.share)} of racks (goal ≤ ${pct(BALANCE_GOALS.maxNearestShare)}); hands of singles and pairs only (${sp.length}: ${sp.join(', ')}) are nearest in ${pct(balance.singlesAndPairsNearest)} together (goal ≤ ${pct(BALANCE_GOALS.maxSinglesAndPairsShare)}).`);
  if (topPrice) console.log(`By price: the most frequent first is ${topPrice[0]} in ${pct(topPrice[1] / racks.length)}; singles and pairs first in ${pct(spPrice)} together.`);
  console.log(`(${((performance.now() - started) / 1000).toFixed(1)} s)`);
}

void main();

/**
 * The bot tournament: N seeded exchanges (default 2,000) played to the end by the engine, the
 * three strategies rotated through the seats, and for each strategy the mean tiles away from
 * its best starter pattern after the deal, after the first Charleston and at the end, with a
 * 95% interval. Run: npm run bench:bots -- --n 500
 */
import cliProgress from 'cli-progress';
import { BOT_STRATEGIES, bestAway, createBot, starterPatterns, type Bot, type BotStrategyId } from '../../shared/analysis';
import { act, canResolve, createExchange, resolve, viewFor, type ExchangeState } from '../../shared/exchange';
import { SEATS, type Seat } from '../../shared/seats';

const STAGES = ['deal', 'first', 'end'] as const;
type Stage = (typeof STAGES)[number];
const STAGE_LABELS: Record<Stage, string> = { deal: 'after the deal', first: 'after the first Charleston', end: 'at the end' };

function argValue(name: string, fallback: string): string {
  const args = process.argv.slice(2);
  for (let i = 0; i < args.length; i++) {
    if (args[i] === `--${name}`) return args[i + 1] ?? fallback;
    if (args[i].startsWith(`--${name}=`)) return args[i].slice(name.length + 3);
  }
  return fallback;
}

const games = Number(argValue('n', '2000'));
const prefix = argValue('seed', 'rackside-tournament');
if (!Number.isInteger(games) || games < 1) {
  console.error('--n takes a whole number of exchanges, for example --n 500.');
  process.exit(1);
}

const ids = BOT_STRATEGIES.map((s) => s.id);
const samples = Object.fromEntries(ids.map((id) => [id, Object.fromEntries(STAGES.map((s) => [s, [] as number[]]))])) as Record<
  BotStrategyId,
  Record<Stage, number[]>
>;
let stopped = 0;
let courtesyTiles = 0;

function record(state: ExchangeState, lineup: Record<Seat, BotStrategyId>, stage: Stage) {
  for (const seat of SEATS) samples[lineup[seat]][stage].push(bestAway(state.racks[seat].map((t) => t.kind), starterPatterns));
}

function play(index: number) {
  const seed = `${prefix}-${index}`;
  const lineup = Object.fromEntries(SEATS.map((seat, s) => [seat, ids[(index + s) % ids.length]])) as Record<Seat, BotStrategyId>;
  const bots = Object.fromEntries(SEATS.map((seat) => [seat, createBot(lineup[seat], `${seed}:${seat}`)])) as Record<Seat, Bot>;
  let state = createExchange({ seed });
  record(state, lineup, 'deal');
  for (let step = 0; state.phase !== 'done'; step++) {
    if (step > 100) throw new Error(`Exchange ${seed} did not finish.`);
    let moved = false;
    for (const seat of SEATS) {
      const action = bots[seat].chooseAction(viewFor(state, seat), starterPatterns);
      if (!action) continue;
      const result = act(state, seat, action);
      if (!result.ok) throw new Error(`Exchange ${seed}: ${lineup[seat]} bot at ${seat} in ${state.phase}: ${result.code} ${result.message}`);
      state = result.state;
      moved = true;
    }
    if (canResolve(state)) {
      const before = state.phase;
      const result = resolve(state);
      if (!result.ok) throw new Error(`Exchange ${seed}: resolve in ${before}: ${result.message}`);
      state = result.state;
      if (before === 'first-left') record(state, lineup, 'first');
      if (before === 'courtesy-pass') courtesyTiles += state.history[state.history.length - 1].sent.east.length;
    } else if (!moved) {
      throw new Error(`Exchange ${seed} is stuck in ${state.phase}.`);
    }
  }
  if (!state.history.some((h) => h.phase === 'second-left')) stopped++;
  record(state, lineup, 'end');
}

function stats(values: number[]) {
  const n = values.length;
  const mean = values.reduce((a, b) => a + b, 0) / n;
  const variance = values.reduce((a, b) => a + (b - mean) ** 2, 0) / Math.max(1, n - 1);
  return { n, mean, se: Math.sqrt(variance / n) };
}

const fmt = (x: number) => x.toFixed(2);
// 1.96: the two-sided 95% point of the normal distribution, from memory.
const Z95 = 1.96;

const bar = new cliProgress.SingleBar(
  { format: 'tournament [{bar}] {value}/{total} exchanges · {duration_formatted}', stream: process.stderr, hideCursor: true },
  cliProgress.Presets.shades_classic,
);
const started = performance.now();
bar.start(games, 0);
for (let i = 0; i < games; i++) {
  play(i);
  bar.increment();
}
bar.stop();
const seconds = (performance.now() - started) / 1000;

console.log(`\n${games} exchanges (seeds ${prefix}-0 … ${prefix}-${games - 1}), strategies rotated through the seats, ${seconds.toFixed(1)} s.`);
console.log(`Mean tiles away from the best of the ${starterPatterns.length} starter patterns, with 95% intervals (lower is closer):\n`);
console.table(
  Object.fromEntries(
    BOT_STRATEGIES.map((s) => [
      `${s.id} (${s.name})`,
      {
        seats: samples[s.id].deal.length,
        ...Object.fromEntries(
          STAGES.map((stage) => {
            const { mean, se } = stats(samples[s.id][stage]);
            return [STAGE_LABELS[stage], `${fmt(mean)} ± ${fmt(Z95 * se)}`];
          }),
        ),
      },
    ]),
  ),
);

console.log('Differences at the end (first minus second), with 95% intervals:');
for (const [a, b] of [
  ['advised', 'multiples'],
  ['advised', 'random'],
  ['multiples', 'random'],
] as [BotStrategyId, BotStrategyId][]) {
  const x = stats(samples[a].end);
  const y = stats(samples[b].end);
  console.log(`  ${a} − ${b}: ${fmt(x.mean - y.mean)} ± ${fmt(Z95 * Math.hypot(x.se, y.se))}`);
}
const firstCount = samples.random.first.length + samples.multiples.first.length + samples.advised.first.length;
console.log(
  `\nStopped after the first Charleston: ${((100 * stopped) / games).toFixed(1)}% of exchanges. ` +
    `Courtesy tiles east sent, on average: ${fmt(courtesyTiles / games)}. Seats measured after the first Charleston: ${firstCount}.`,
);

/**
 * How fast the Charleston engine runs: one pass resolving (plain and blind), a whole exchange
 * played by four random legal players, and a replay of a finished log. Aims: a pass resolves
 * in under 20 µs (median), a whole exchange in under 1 ms.
 */
import { Bench } from 'tinybench';
import { createExchange, replay, resolve, viewFor, type ExchangeState } from '../../shared/exchange';
import { rngFor } from '../../shared/random';
import { advanceTo, commitAll, playToEnd } from '../unit/exchange/helpers';

const options = { seed: 'harbor-lane-week-01' };
const plainPass: ExchangeState = commitAll(createExchange(options));
const blindPass: ExchangeState = commitAll(advanceTo(createExchange(options), 'first-left'), { east: 1, south: 2, west: 3 });
const finished = playToEnd(createExchange(options), rngFor('bench-players', 0));

let round = 0;
const bench = new Bench({ name: 'Charleston engine', time: 1000, warmup: true });
bench
  .add('resolve one pass', () => {
    resolve(plainPass);
  })
  .add('resolve one blind pass', () => {
    resolve(blindPass);
  })
  .add('deal (createExchange)', () => {
    createExchange({ seed: `deal-${round++}` });
  })
  .add('whole exchange, four random legal players', () => {
    const seed = `exchange-${round++}`;
    playToEnd(createExchange({ seed }), rngFor('bench-players', seed));
  })
  .add(`replay a full log (${finished.log.length} entries)`, () => {
    replay(finished.options, finished.log);
  })
  .add('view for one seat', () => {
    viewFor(finished, 'south');
  });

await bench.run();

console.log(`${bench.name} (${process.version}, ${process.arch})`);
console.table(bench.table());

const median = (name: string) => {
  const task = bench.tasks.find((t) => t.name.startsWith(name));
  const result = task?.result as { latency?: { p50?: number } } | undefined;
  return result?.latency?.p50 ?? NaN;
};
const pass = median('resolve one pass') * 1000;
const blind = median('resolve one blind pass') * 1000;
const whole = median('whole exchange');
console.log(`pass resolve median ${pass.toFixed(1)} µs, blind pass ${blind.toFixed(1)} µs (aim < 20 µs)`);
console.log(`whole exchange median ${whole.toFixed(3)} ms (aim < 1 ms)`);

/**
 * `npm run bench:load [-- --tables 250 --processes 1|2 --warmup|--cold --database sqlite|postgres --start-batch 5]`:
 * plays whole exchanges on many tables at once, four signed-in clients a table, against Rackside
 * in its own process.
 *
 * By default, back to back in the same run, the very same client code, client count, tables and
 * message pattern also play against a bare Socket.IO relay in its own process
 * (tests/bench/bare-relay.ts: it acks every action and answers each with a state for each of the
 * four, padded to the size Rackside's states had, with no rules, storage or sign-in). Prints latency
 * from a pass's fourth commit to all four clients holding the next step, passes per second, errors
 * and memory per table for both, and Rackside's p99 over the relay's; and each server process's own
 * CPU time over play (tests/bench/cpu-time.ts), per pass resolved on Rackside and per state sent by
 * the relay, with the ratio of the two.
 *
 * With `--processes 2`, one Rackside process and then two play the same load instead, both with a
 * Redis and behind HAProxy (server/deploy/haproxy.cfg), each client naming its table in the
 * handshake query; printed side by side with the ratios two / one, the goals, HAProxy's and
 * redis-server's CPU apart, and each process's table counters (tests/bench/counters-on-signal.ts).
 * There every table plays one unmeasured round first (`--cold` skips it; `--warmup` adds it to a
 * single-process run too).
 *
 * The parts: load-play.ts (the clients), load-servers.ts (the servers of each run), load-children.ts
 * (server processes and the helpers this bench starts), load-report.ts (what is printed).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { reportAgainstRelay, reportProcesses } from './load-report';
import { benchRackside, benchRelay, type LoadSettings } from './load-servers';

const args = process.argv.slice(2);
const arg = (name: string, fallback: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : fallback;
};
const PROCESSES = Number(arg('processes', '1'));
const DATABASE = arg('database', 'sqlite');
if (PROCESSES !== 1 && PROCESSES !== 2) {
  console.error('--processes takes 1 or 2: server/deploy/haproxy.cfg balances over two servers.');
  process.exit(2);
}
if (DATABASE !== 'sqlite' && DATABASE !== 'postgres') {
  console.error('--database takes sqlite (a file, the default) or postgres (a throwaway PostgreSQL).');
  process.exit(2);
}

const began = performance.now();
const settings: LoadSettings = {
  tables: Number(arg('tables', '250')),
  huddleEvery: 10,
  startBatch: Number(arg('start-batch', '5')),
  // Two processes are compared warmed up (see the report's footnote): a fresh process compiles its
  // hot paths in its first seconds, once, and two fresh processes pay that twice in a short play.
  warmup: process.argv.includes('--warmup') || (PROCESSES > 1 && !process.argv.includes('--cold')),
  database: DATABASE,
  dir: mkdtempSync(join(tmpdir(), 'rackside-load-')),
  stage: (what) => console.error(`  … ${what} (${((performance.now() - began) / 1000).toFixed(1)} s)`),
};

try {
  const on = DATABASE === 'postgres' ? 'PostgreSQL' : 'a SQLite file';
  const { tables, huddleEvery, stage } = settings;
  console.log(`Rackside load: ${tables} tables, ${tables * 4} signed-in connections, a huddle on one table in ${huddleEvery}, on ${on}\n`);
  if (PROCESSES === 1) {
    const one = await benchRackside(settings, { processes: 1, balanced: false });
    // Back to back with the same load: the floor, with states as big as Rackside's were.
    stage(`now the bare relay, states padded to ${one.stateBytes} bytes`);
    reportAgainstRelay(settings, await benchRelay(settings, one.stateBytes), one);
  } else {
    const one = await benchRackside(settings, { processes: 1, balanced: true });
    stage('now the same load on 2 processes');
    reportProcesses(settings, one, await benchRackside(settings, { processes: 2, balanced: true }));
  }
} finally {
  rmSync(settings.dir, { recursive: true, force: true });
}
process.exit(0);

/**
 * `npm run bench:load [-- --tables 250]`: plays whole exchanges on many tables at once against
 * the real server in its own process, then, back to back in the same run, the very same client
 * code, client count, tables and message pattern against a bare Socket.IO relay in its own
 * process (tests/bench/bare-relay.ts: it acks every action and answers each with a state for each
 * of the four, padded to the size Rackside's states had, with no rules, storage or sign-in).
 * Prints latency from a pass's fourth commit to all four clients holding the next step, passes
 * per second, errors and memory per table for both, and Rackside's p99 over the relay's; and each
 * server process's own CPU time over play (tests/bench/cpu-time.ts), per pass resolved on
 * Rackside and per state sent by the relay, with the ratio of the two.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { io as connect, type Socket } from 'socket.io-client';
import type { Action } from '../../shared/exchange/types';
import type { TableStateDto } from '../../shared/protocol';
import { SEATS } from '../../shared/seats';
import { startPostgres, startRedis } from '../server/backing-servers';
import { cpuMeter } from './cpu-time';

const args = process.argv.slice(2);
const arg = (name: string, fallback: number) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? Number(args[i + 1]) : fallback;
};
const TABLES = arg('tables', 250);
const PROCESSES = arg('processes', 1);
/** `--database postgres` runs the servers on a throwaway PostgreSQL instead of a SQLite file. */
const DATABASE = args.includes('--database') ? args[args.indexOf('--database') + 1] : 'sqlite';
const HUDDLE_EVERY = 10;
const dir = mkdtempSync(join(tmpdir(), 'rackside-load-'));
const began = performance.now();
const stage = (what: string) => console.error(`  … ${what} (${((performance.now() - began) / 1000).toFixed(1)} s)`);

function start(script: string, env: Record<string, string>, ready: RegExp): Promise<{ child: ChildProcess; port: number }> {
  const profile = script.startsWith('server') && process.env.PROFILE_SERVER ? ['--cpu-prof', '--cpu-prof-dir=/tmp/prof'] : [];
  const child = spawn(process.execPath, [...profile, '--expose-gc', '--import', 'tsx', '--import', './tests/bench/gc-on-signal.ts', script], { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => {
      const m = d.toString().match(ready);
      if (m) resolve({ child, port: Number(m[1]) });
    });
    child.once('exit', (code) => reject(new Error(`${script} exited with ${code}`)));
  });
}

function rssKb(pid: number): number {
  const line = readFileSync(`/proc/${pid}/status`, 'utf8').split('\n').find((l) => l.startsWith('VmRSS:'))!;
  return Number(line.replace(/\D+/g, ''));
}

/** Resident memory of a server after it has run a full garbage collection (see gc-on-signal.ts). */
async function settledRssKb(child: ChildProcess): Promise<number> {
  const collected = new Promise<void>((resolve) => {
    const hear = (d: Buffer) => {
      if (d.toString().includes('collected')) {
        if (process.env.SHOW_HEAP) console.error(d.toString().trim());
        child.stdout!.off('data', hear);
        resolve();
      }
    };
    child.stdout!.on('data', hear);
  });
  child.kill('SIGUSR2');
  await collected;
  return rssKb(child.pid!);
}

/** The first match of `line` on the child's stdout from now on (listen before sending what prompts it). */
function heard(child: ChildProcess, line: RegExp): Promise<RegExpMatchArray> {
  return new Promise((resolve) => {
    const hear = (d: Buffer) => {
      const m = d.toString().match(line);
      if (m) {
        child.stdout!.off('data', hear);
        resolve(m);
      }
    };
    child.stdout!.on('data', hear);
  });
}

function percentile(sorted: number[], p: number) {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function summary(values: number[]) {
  const s = [...values].sort((a, b) => a - b);
  return { n: s.length, p50: percentile(s, 50), p95: percentile(s, 95), p99: percentile(s, 99) };
}

async function inBatches<T>(items: T[], size: number, fn: (item: T, i: number) => Promise<void>) {
  for (let i = 0; i < items.length; i += size) await Promise.all(items.slice(i, i + size).map((item, j) => fn(item, i + j)));
}

function plainAction(state: TableStateDto): Action | null {
  const view = state.view;
  const seat = state.mySeat;
  if (!view || !seat || view.seats[seat].committed) return null;
  if (state.phase === 'vote') return { type: 'vote', stop: false };
  if (state.phase === 'courtesy-ask') return { type: 'courtesy-ask', count: 1 };
  if (view.passSize > 0) return { type: 'pass', tiles: state.myRack.filter((t) => t.kind !== 'joker').slice(0, view.passSize).map((t) => t.id) };
  return null;
}

interface Seat4 {
  socket: Socket;
  latest: TableStateDto | null;
}

/** Four connections per table, each joined and seated in turn order; `cookies` signs them in (none for the relay). */
async function seatTables(urls: string[], tableIds: string[], cookies: string[] | null) {
  const tables: Seat4[][] = [];
  let errors = 0;
  await inBatches(tableIds, 10, async (tableId, t) => {
    const seats: Seat4[] = [];
    for (let s = 0; s < 4; s++) {
      // As a round-robin balancer would: connection k goes to process k mod N, so a table's four are split.
      const socket = connect(urls[(t * 4 + s) % urls.length], {
        transports: ['websocket'],
        reconnection: false,
        ...(cookies ? { extraHeaders: { Cookie: cookies[t * 4 + s] } } : {}),
      });
      await new Promise<void>((resolve, reject) => {
        socket.once('connect', () => resolve());
        socket.once('connect_error', reject);
      });
      const seat: Seat4 = { socket, latest: null };
      socket.on('table:state', (st: TableStateDto) => (seat.latest = st));
      const joined = await socket.emitWithAck('table:join', { tableId, as: 'player' });
      const sat = await socket.emitWithAck('table:sit', { seat: SEATS[s] });
      if (!joined.ok || !sat.ok) {
        errors++;
        if (process.env.SHOW_ERRORS) console.error('seat:', JSON.stringify(joined), JSON.stringify(sat));
      }
      seats.push(seat);
    }
    tables[t] = seats;
  });
  return { tables, errors };
}

/** One state in this many is measured for its size (stringifying every one would slow the clients). */
const SIZE_SAMPLE = 64;

/** Tables dealt at once. */
const START_BATCH = arg('start-batch', 5);
/** How long one run may deal and play before the tables still going are given up and counted as unfinished. */
const PLAY_DEADLINE_MS = 10 * 60 * 1000;

/**
 * Every table plays one whole exchange, each client answering as soon as its state asks it to.
 * The same code drives Rackside and the relay. A table that cannot start, or is still going at
 * the deadline, is counted as unfinished rather than waited for.
 */
async function play(tables: Seat4[][]) {
  const latencies: number[] = [];
  const huddleLatencies: number[] = [];
  let resolved = 0;
  let errors = 0;
  let states = 0;
  let sampledBytes = 0;
  let sampled = 0;
  let finishedTables = 0;
  let deadline: NodeJS.Timeout | undefined;
  const starts: (() => Promise<void>)[] = [];
  const t0 = performance.now();
  const allDone = Promise.all(
    tables.map(
      (seats) =>
        new Promise<void>((done) => {
          // For pass k (k passes resolved before it): when each commit was emitted, and when each seat first saw k + 1 resolved.
          const emitted = new Map<number, number[]>();
          const arrived = new Map<number, number[]>();
          const huddled = new Set<number>();
          const seen = [0, 0, 0, 0];
          const busy = [false, false, false, false];
          let releasing = false;
          let finished = false;
          function onState(i: number) {
            const st = seats[i].latest!;
            const now = performance.now();
            const k = st.view?.history.length ?? 0;
            while (seen[i] < k) {
              seen[i] += 1;
              const list = arrived.get(seen[i] - 1) ?? [];
              list.push(now);
              arrived.set(seen[i] - 1, list);
              if (list.length === 4) {
                const commits = emitted.get(seen[i] - 1) ?? [];
                if (commits.length === 4) {
                  (huddled.has(seen[i] - 1) ? huddleLatencies : latencies).push(Math.max(...list) - Math.max(...commits));
                }
                resolved++;
              }
            }
            if (st.phase === 'done') {
              if (!finished && seats.every((s) => s.latest?.phase === 'done')) {
                finished = true;
                finishedTables++;
                done();
              }
              return;
            }
            if (st.huddle.open) huddled.add(k);
            if (i === 0 && st.huddle.open && st.isHost && !releasing) {
              releasing = true;
              seats[0].socket
                .emitWithAck('huddle:release', {})
                .then((a) => {
                  if (!a.ok) {
                    errors++;
                    if (process.env.SHOW_ERRORS) console.error('release:', JSON.stringify(a));
                  }
                })
                .catch(() => errors++)
                .finally(() => (releasing = false));
            }
            const action = plainAction(st);
            if (!action || busy[i]) return;
            busy[i] = true;
            if (action.type === 'pass') {
              const list = emitted.get(k) ?? [];
              list.push(performance.now());
              emitted.set(k, list);
            }
            seats[i].socket
              .timeout(30_000)
              .emitWithAck('exchange:act', { action })
              .then((a) => {
                if (!a.ok && a.code !== 'WRONG_PHASE' && a.code !== 'ALREADY_COMMITTED') {
                  errors++;
                  if (process.env.SHOW_ERRORS) console.error('refused:', a.code, a.message);
                }
              })
              .catch(() => errors++)
              .finally(() => {
                busy[i] = false;
                onState(i);
              });
          }
          seats.forEach((s, i) =>
            s.socket.on('table:state', (st: TableStateDto) => {
              if (states++ % SIZE_SAMPLE === 0) {
                sampledBytes += JSON.stringify(st).length;
                sampled++;
              }
              onState(i);
            }),
          );
          starts.push(() =>
            seats[0].socket
              .timeout(60_000)
              .emitWithAck('table:start', {})
              .then((a) => {
                if (!a.ok) {
                  errors++;
                  if (process.env.SHOW_ERRORS) console.error('start:', JSON.stringify(a));
                  // It never starts: nothing to wait for.
                  done();
                }
              })
              .catch(() => {
                errors++;
                done();
              }),
          );
        }),
    ),
  );
  const overdue = new Promise<void>((resolve) => (deadline = setTimeout(resolve, PLAY_DEADLINE_MS)));
  // Tables are dealt a few at a time, as people sit down at different moments; play starts at once.
  await Promise.race([inBatches(starts, START_BATCH, (start) => start()), overdue]);
  await Promise.race([allDone, overdue]);
  clearTimeout(deadline);
  const seconds = (performance.now() - t0) / 1000;
  return {
    latency: summary(latencies),
    huddle: summary(huddleLatencies),
    resolved,
    seconds,
    errors,
    states,
    stateBytes: sampled ? Math.round(sampledBytes / sampled) : 0,
    finishedTables,
  };
}

/** Rackside on `processes` processes sharing one SQLite file (and, past one, one Redis). */
async function benchRackside(processes: number) {
  const pg = DATABASE === 'postgres' ? await startPostgres() : null;
  const database = pg ? pg.url : `sqlite:${join(dir, `load-${processes}.sqlite`)}`;
  const redis = processes > 1 ? await startRedis() : null;
  const servers: { child: ChildProcess; port: number }[] = [];
  // One after another: the first runs the migrations on the new file.
  for (let i = 0; i < processes; i++) {
    servers.push(
      await start(
        'server/index.ts',
        {
          PORT: '0',
          DATABASE_URL: database,
          ...(redis ? { REDIS_URL: redis.url } : {}),
          BCRYPT_ROUNDS: '4',
          SEED_DEMO: 'false',
          CLIENT_DIR: 'none',
          BOT_DELAY_MS: '0',
          REGISTER_RATE_MAX: '100000',
          LOGIN_RATE_MAX: '100000',
          CHAT_RATE_PER_MINUTE: '100000',
          SESSION_SECRET: 'load',
          LOG_LEVEL: 'error',
          // As in production: stack traces unmapped (the database driver reads one on every query).
          SOURCE_MAPS: 'false',
        },
        /ready on http:\/\/localhost:(\d+)/,
      ),
    );
  }
  let stopping = false;
  for (const s of servers) {
    s.child.once('exit', (code, signal) => {
      if (stopping) return;
      // Nothing more can be measured: say so rather than wait on clients that will hear nothing.
      console.error(`A Rackside server process stopped in the middle of the run (code ${code}, signal ${signal}); no figures.`);
      process.exit(1);
    });
  }
  const urls = servers.map((s) => `http://127.0.0.1:${s.port}`);
  const url = urls[0];
  const memory = async () => (await Promise.all(servers.map((s) => settledRssKb(s.child)))).reduce((a, b) => a + b, 0);
  const baseline = await memory();

  const people = Array.from({ length: TABLES * 4 }, (_, i) => `p${i}`);
  const cookies: string[] = [];
  await inBatches(people, 25, async (name, i) => {
    const res = await fetch(`${url}/api/auth/register`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: `${name}@load.test`, password: 'load-test-pass', displayName: name }) });
    if (res.status !== 201) throw new Error(`register failed: ${res.status} ${await res.text()}`);
    cookies[i] = res.headers.getSetCookie()[0].split(';')[0];
  });

  stage(`registered ${people.length} people`);
  const tableIds: string[] = [];
  await inBatches(Array.from({ length: TABLES }, (_, t) => t), 25, async (t) => {
    const res = await fetch(`${url}/api/tables`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Cookie: cookies[t * 4] },
      body: JSON.stringify({ name: `Load ${t}`, options: { seed: `load-${t}`, huddleEveryPass: t % HUDDLE_EVERY === 0 } }),
    });
    tableIds[t] = (await res.json()).table.id;
  });

  stage(`opened ${TABLES} tables`);
  const seated = await seatTables(urls, tableIds, cookies);
  const connected = await memory();
  stage(`seated ${TABLES * 4} connections`);
  // Every server process counts, and only those: the clients run in this process, not in any of them.
  const cpu = cpuMeter(servers.map((s) => s.child.pid!));
  const played = await play(seated.tables);
  const cpuMs = cpu();
  stage(`played every exchange on Rackside (${processes} process${processes > 1 ? 'es' : ''})`);
  const peak = await memory();
  seated.tables.flat().forEach((s) => s.socket.disconnect());
  stopping = true;
  await Promise.all(servers.map((s) => new Promise((resolve) => (s.child.once('exit', resolve), s.child.kill('SIGTERM')))));
  await redis?.stop();
  await pg?.stop();
  // Rackside's messages are the states its clients received.
  return { ...played, errors: played.errors + seated.errors, baseline, connected, peak, cpuMs, messages: played.states };
}

/** The bare relay under the same load: the same tables, client count and client code, states padded to `stateBytes`. */
async function benchRelay(stateBytes: number) {
  const { child, port } = await start('tests/bench/bare-relay.ts', { PORT: '0', STATE_BYTES: String(stateBytes) }, /bare relay ready on (\d+)/);
  let stopping = false;
  child.once('exit', (code, signal) => {
    if (stopping) return;
    console.error(`The relay process stopped in the middle of the run (code ${code}, signal ${signal}); no figures.`);
    process.exit(1);
  });
  const url = `http://127.0.0.1:${port}`;
  const baseline = await settledRssKb(child);
  const seated = await seatTables([url], Array.from({ length: TABLES }, (_, t) => `room-${t}`), null);
  const connected = await settledRssKb(child);
  stage(`relay: seated ${TABLES * 4} connections`);
  const cpu = cpuMeter([child.pid!]);
  const played = await play(seated.tables);
  const cpuMs = cpu();
  stage('played every exchange on the relay');
  const counted = heard(child, /relayed (\d+)/);
  const peak = await settledRssKb(child);
  // The relay's own count of the states it sent; it sends none before play.
  const messages = Number((await counted)[1]);
  seated.tables.flat().forEach((s) => s.socket.disconnect());
  stopping = true;
  await new Promise((resolve) => (child.once('exit', resolve), child.kill('SIGTERM')));
  return { ...played, errors: played.errors + seated.errors, baseline, connected, peak, cpuMs, messages };
}

const fmt = (ms: number) => `${ms.toFixed(2)} ms`;
type Run = Awaited<ReturnType<typeof benchRackside>>;
try {
  console.log(`Rackside load: ${TABLES} tables, ${TABLES * 4} signed-in connections, a huddle on one table in ${HUDDLE_EVERY}, on ${DATABASE === 'postgres' ? 'PostgreSQL' : 'a SQLite file'}\n`);
  const runs: [string, Run][] = [['Rackside, 1 process', await benchRackside(1)]];
  // Back to back with the same load: the floor, with states as big as Rackside's were.
  stage(`now the bare relay, states padded to ${runs[0][1].stateBytes} bytes`);
  const relay = await benchRelay(runs[0][1].stateBytes);
  if (PROCESSES > 1) {
    stage(`now the same load on ${PROCESSES} processes`);
    runs.push([`Rackside, ${PROCESSES} processes`, await benchRackside(PROCESSES)]);
  }
  const all: [string, Run][] = [['bare relay', relay], ...runs];
  const perSecond = (r: Run) => r.resolved / r.seconds;
  const cpuPerPass = (r: Run) => r.cpuMs / r.resolved;
  const relayCpuPerMessage = relay.cpuMs / relay.messages;
  const rows: string[][] = [
    ['', ...all.map(([name]) => name)],
    ['pass latency p50 (4th commit → all four hold the next step)', ...all.map(([, r]) => fmt(r.latency.p50))],
    ['pass latency p95', ...all.map(([, r]) => fmt(r.latency.p95))],
    ['pass latency p99', ...all.map(([, r]) => fmt(r.latency.p99))],
    ['p99 over the relay’s p99 in this run', '1.00x', ...runs.map(([, r]) => `${(r.latency.p99 / relay.latency.p99).toFixed(2)}x`)],
    ['passes resolved (huddled ones counted apart)', ...all.map(([, r]) => `${r.latency.n} (+${r.huddle.n} from a huddle)`)],
    ['passes resolved per second', ...all.map(([, r]) => perSecond(r).toFixed(1))],
    ['states sent to clients / mean size', ...all.map(([, r]) => `${r.states} / ${r.stateBytes} B`)],
    ['wall time of play', ...all.map(([, r]) => `${r.seconds.toFixed(1)} s`)],
    ['tables that finished their exchange', ...all.map(([, r]) => `${r.finishedTables} of ${TABLES}`)],
    ['errors', ...all.map(([, r]) => String(r.errors))],
    ['server memory after a full collection: started / connected / end', ...all.map(([, r]) => `${(r.baseline / 1024).toFixed(0)} / ${(r.connected / 1024).toFixed(0)} / ${(r.peak / 1024).toFixed(0)} MB`)],
    ['server memory per table (end − start) / tables', ...all.map(([, r]) => `${((r.peak - r.baseline) / TABLES).toFixed(0)} KB`)],
    ['server CPU over play, user+system (share of one core)', ...all.map(([, r]) => `${(r.cpuMs / 1000).toFixed(2)} s (${((r.cpuMs / (r.seconds * 1000)) * 100).toFixed(0)}%)`)],
    ['server CPU per resolved pass (ms)', ...all.map(([, r]) => cpuPerPass(r).toFixed(3))],
    ['relay CPU per relayed message (ms)', relayCpuPerMessage.toFixed(4), ...runs.map(() => '')],
    ['server CPU per pass / relay CPU per message', '', ...runs.map(([, r]) => `${(cpuPerPass(r) / relayCpuPerMessage).toFixed(1)}x`)],
  ];
  if (runs.length > 1) rows.push([`passes per second, ${PROCESSES} processes / 1`, '', '', `${(perSecond(runs[1][1]) / perSecond(runs[0][1])).toFixed(2)}x`]);
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => (r[c] ?? '').length)));
  for (const r of rows) console.log(r.map((cell, c) => (cell ?? '').padEnd(widths[c])).join('  ').trimEnd());
  const ratio = runs[0][1].latency.p99 / relay.latency.p99;
  const one = runs[0][1];
  console.log(
    [
      '',
      `What the ratio means: the same ${TABLES} tables of four clients, driven by the same client code, played`,
      'the same exchange against a bare Socket.IO relay that checks nothing and stores nothing (it answers the',
      'actions of each turn with one state per seat, padded to the size of Rackside’s, then the acks) and against',
      `Rackside, which checks every action, writes it to its database and builds each seat's own view.`,
      `At p99 a pass took ${fmt(relay.latency.p99)} on the relay and ${fmt(runs[0][1].latency.p99)} on Rackside: ${ratio.toFixed(2)}x the floor.`,
      `The two ran back to back in this run, each server in its own process, on the same machine.`,
      'Every client answers as soon as it is asked, so a faster server is sent more at once: on the relay all',
      'tables run together and the one client process parsing their states adds to its latency. Rackside',
      'groups its states by stored write, so it may send fewer (see "states sent"). A ratio near or below 1x',
      'says Rackside adds little over the transport at this load; read any single run with the machine\'s',
      'other work in mind.',
      '',
      'What the CPU figures mean: each server process\'s own CPU time, user + system, over every thread of that',
      'process (the event loop, libuv\'s pool where SQLite runs, V8\'s helpers), read by this bench from',
      '/proc/<pid>/stat when the first table is dealt and again when the last one has finished. The clients run',
      'in another process and are not counted; neither is a PostgreSQL or Redis server. Rackside\'s CPU is',
      `divided by the passes resolved (${one.resolved}, huddled ones included), the relay's by the states it sent to a`,
      `client (${relay.messages} by its own count, ${(relay.messages / relay.resolved).toFixed(1)} per pass). A pass cost Rackside ${cpuPerPass(one).toFixed(3)} ms of CPU, as much as`,
      `the relay spends sending ${(cpuPerPass(one) / relayCpuPerMessage).toFixed(1)} states (relay CPU per pass: ${cpuPerPass(relay).toFixed(3)} ms). Time spent waiting for a core is not`,
      'CPU time, so unlike latency this hardly depends on how busy the client process or the machine is. It',
      'still moves a little with how many actions reach a server in one turn of its event loop, as both send one',
      'state per seat per turn (Rackside per stored group), and with what else shares the cores\' caches.',
    ].join('\n'),
  );
} finally {
  rmSync(dir, { recursive: true, force: true });
}
process.exit(0);

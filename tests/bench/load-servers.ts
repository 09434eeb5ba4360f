/**
 * The servers `npm run bench:load` plays against, each set up, measured over play and stopped:
 * Rackside on one process or two (straight to the process, or through HAProxy with the production
 * config and a Redis), and the bare relay. CPU time is read from /proc for every process of a run,
 * Rackside's apart from HAProxy's and redis-server's.
 */
import type { ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { startPostgres, startRedis } from '../server/backing-servers';
import { startHaproxy, type ServerStatus } from '../server/haproxy';
import { childPidsNamed, heard, readCounters, settledRssKb, startChild, type Started, type TableCounts } from './load-children';
import { cpuMeter } from './cpu-time';
import { inBatches, play, seatTables, type Route } from './load-play';

export interface LoadSettings {
  tables: number;
  /** One table in this many holds a huddle after every pass. */
  huddleEvery: number;
  /** Tables dealt at once. */
  startBatch: number;
  database: 'sqlite' | 'postgres';
  /** A temporary folder for the SQLite files. */
  dir: string;
  /** Says on stderr how far the run has come. */
  stage(what: string): void;
  /** Play one unmeasured round first (`--warmup`), so that warmed-up processes are measured. */
  warmup?: boolean;
}

/**
 * How Rackside runs: `processes` of it, and whether they share a Redis with clients coming through
 * HAProxy (server/deploy/haproxy.cfg, routing each table by the `table` handshake query). One
 * process behind HAProxy has both of the config's servers, a and b, pointing at it.
 */
export interface Layout {
  processes: 1 | 2;
  balanced: boolean;
}

/** CPU time (ms) over play of the processes named `command` that this bench started; null when there are none. */
function helperMeter(command: string): () => number | null {
  const pids = childPidsNamed(command);
  if (!pids.length) return () => null;
  const meter = cpuMeter(pids);
  return () => meter();
}

/** Every Rackside server process ending the bench if it stops before `stopping()` says it may. */
function endIfStopped(servers: Started[], what: string, stopping: () => boolean) {
  for (const s of servers) {
    s.child.once('exit', (code, signal) => {
      if (stopping()) return;
      // Nothing more can be measured: say so rather than wait on clients that will hear nothing.
      console.error(`${what} stopped in the middle of the run (code ${code}, signal ${signal}); no figures.`);
      process.exit(1);
    });
  }
}

const stopChild = (child: ChildProcess) => new Promise((resolve) => (child.once('exit', resolve), child.kill('SIGTERM')));

let runs = 0;

/** Rackside under the load, laid out as `layout`, on one SQLite file (or a throwaway PostgreSQL). */
export async function benchRackside(settings: LoadSettings, layout: Layout) {
  const { tables, stage } = settings;
  const pg = settings.database === 'postgres' ? await startPostgres() : null;
  const database = pg ? pg.url : `sqlite:${join(settings.dir, `load-${++runs}.sqlite`)}`;
  const redis = layout.balanced ? await startRedis() : null;
  const servers: Started[] = [];
  // One after another: the first runs the migrations on the new file.
  for (let i = 0; i < layout.processes; i++) {
    servers.push(
      await startChild(
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
        ['./tests/bench/gc-on-signal.ts', './tests/bench/counters-on-signal.ts'],
      ),
    );
  }
  let stopping = false;
  endIfStopped(servers, 'A Rackside server process', () => stopping);
  const ports = servers.map((s) => s.port);
  const front = layout.balanced ? await startHaproxy({ a: ports[0], b: ports[ports.length - 1] }) : null;
  const url = front?.url ?? `http://127.0.0.1:${ports[0]}`;
  // Through the balancer every connection names its table, as the client does; without one they all go to the one process.
  const route: Route = front ? (tableId) => ({ url: front.url, query: { table: tableId } }) : () => ({ url });
  const memory = async () => (await Promise.all(servers.map((s) => settledRssKb(s.child)))).reduce((a, b) => a + b, 0);
  const baseline = await memory();

  const people = Array.from({ length: tables * 4 }, (_, i) => `p${i}`);
  const cookies: string[] = [];
  await inBatches(people, 25, async (name, i) => {
    const res = await fetch(`${url}/api/auth/register`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: `${name}@load.test`, password: 'load-test-pass', displayName: name }) });
    if (res.status !== 201) throw new Error(`register failed: ${res.status} ${await res.text()}`);
    cookies[i] = res.headers.getSetCookie()[0].split(';')[0];
  });

  stage(`registered ${people.length} people`);
  const tableIds: string[] = [];
  await inBatches(Array.from({ length: tables }, (_, t) => t), 25, async (t) => {
    const res = await fetch(`${url}/api/tables`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Cookie: cookies[t * 4] },
      body: JSON.stringify({ name: `Load ${t}`, options: { seed: `load-${t}`, huddleEveryPass: t % settings.huddleEvery === 0 } }),
    });
    tableIds[t] = (await res.json()).table.id;
  });

  stage(`opened ${tables} tables`);
  const seated = await seatTables(route, tableIds, cookies);
  const connected = await memory();
  // HAProxy's own count of the table connections each of its servers holds.
  const split: ServerStatus[] | null = front ? (await front.servers()).filter((s) => s.backend === 'tables') : null;
  stage(`seated ${tables * 4} connections`);
  if (settings.warmup) {
    // A round that is not measured: every table plays one exchange first, so that what is measured is
    // a warmed-up process (its hot paths compiled), as a server is after its first minutes.
    const warm = await play(seated.tables, settings.startBatch);
    stage(`warm-up round: ${warm.finishedTables} of ${tables} tables finished, ${warm.errors} errors (not measured)`);
  }
  // Every server process counts, and only those: the clients run in this process, not in any of them.
  const each = servers.map((s) => cpuMeter([s.child.pid!]));
  const [haproxyCpu, redisCpu] = [helperMeter('haproxy'), helperMeter('redis-server')];
  const played = await play(seated.tables, settings.startBatch);
  const perProcessCpuMs = each.map((cpu) => cpu());
  const [haproxyCpuMs, redisCpuMs] = [haproxyCpu(), redisCpu()];
  const counters: (TableCounts | null)[] = await Promise.all(servers.map((s) => readCounters(s.child)));
  stage(`played every exchange on Rackside (${layout.processes} process${layout.processes > 1 ? 'es' : ''}${front ? ', through HAProxy' : ''})`);
  const peak = await memory();
  seated.tables.flat().forEach((s) => s.socket.disconnect());
  // What HAProxy said when it marked a server down: the likeliest reason connections were dropped.
  if (played.dropped && front) console.error(front.output().split('\n').filter((l) => /DOWN|UP/.test(l)).join('\n'));
  stopping = true;
  await front?.stop();
  await Promise.all(servers.map((s) => stopChild(s.child)));
  await redis?.stop();
  await pg?.stop();
  const cpuMs = perProcessCpuMs.reduce((a, b) => a + b, 0);
  // Rackside's messages are the states its clients received.
  return {
    ...played,
    errors: played.errors + seated.errors,
    baseline,
    connected,
    peak,
    cpuMs,
    perProcessCpuMs,
    haproxyCpuMs,
    redisCpuMs,
    counters,
    split,
    messages: played.states,
    redis: redis !== null,
    balanced: front !== null,
  };
}

export type RacksideRun = Awaited<ReturnType<typeof benchRackside>>;

/** The bare relay under the same load: the same tables, client count and client code, states padded to `stateBytes`. */
export async function benchRelay(settings: LoadSettings, stateBytes: number) {
  const { tables, stage } = settings;
  const { child, port } = await startChild('tests/bench/bare-relay.ts', { PORT: '0', STATE_BYTES: String(stateBytes) }, /bare relay ready on (\d+)/, ['./tests/bench/gc-on-signal.ts']);
  let stopping = false;
  endIfStopped([{ child, port }], 'The relay process', () => stopping);
  const url = `http://127.0.0.1:${port}`;
  const baseline = await settledRssKb(child);
  const seated = await seatTables(() => ({ url }), Array.from({ length: tables }, (_, t) => `room-${t}`), null);
  const connected = await settledRssKb(child);
  stage(`relay: seated ${tables * 4} connections`);
  const cpu = cpuMeter([child.pid!]);
  const played = await play(seated.tables, settings.startBatch);
  const cpuMs = cpu();
  stage('played every exchange on the relay');
  const counted = heard(child, /relayed (\d+)/);
  const peak = await settledRssKb(child);
  // The relay's own count of the states it sent; it sends none before play.
  const messages = Number((await counted)![1]);
  seated.tables.flat().forEach((s) => s.socket.disconnect());
  stopping = true;
  await stopChild(child);
  return { ...played, errors: played.errors + seated.errors, baseline, connected, peak, cpuMs, messages };
}

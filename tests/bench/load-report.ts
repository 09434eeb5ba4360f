/**
 * What `npm run bench:load` prints: Rackside beside the bare relay (the default), or one Rackside
 * process beside two behind HAProxy (`--processes 2`), each as a table of figures and a few lines
 * on what they mean.
 */
import type { TableCounts } from './load-children';
import type { benchRelay, LoadSettings, RacksideRun } from './load-servers';

type RelayRun = Awaited<ReturnType<typeof benchRelay>>;
type Run = RacksideRun | RelayRun;

const fmt = (ms: number) => `${ms.toFixed(2)} ms`;
const times = (ratio: number, digits = 2) => `${ratio.toFixed(digits)}x`;
const perSecond = (r: Run) => r.resolved / r.seconds;
const cpuPerPass = (r: Run) => r.cpuMs / r.resolved;

/** Prints rows as columns padded to their widest cell. */
function printRows(rows: string[][]) {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => (r[c] ?? '').length)));
  for (const r of rows) console.log(r.map((cell, c) => (cell ?? '').padEnd(widths[c])).join('  ').trimEnd());
}

/** Rows both reports share, one column per run. */
function commonRows(all: [string, Run][]): string[][] {
  return [
    ['', ...all.map(([name]) => name)],
    ['pass latency p50 (4th commit → all four hold the next step)', ...all.map(([, r]) => fmt(r.latency.p50))],
    ['pass latency p95', ...all.map(([, r]) => fmt(r.latency.p95))],
    ['pass latency p99', ...all.map(([, r]) => fmt(r.latency.p99))],
  ];
}

function tailRows(settings: LoadSettings, all: [string, Run][]): string[][] {
  return [
    ['passes resolved (huddled ones counted apart)', ...all.map(([, r]) => `${r.latency.n} (+${r.huddle.n} from a huddle)`)],
    ['passes resolved per second', ...all.map(([, r]) => perSecond(r).toFixed(1))],
    ['states sent to clients / mean size', ...all.map(([, r]) => `${r.states} / ${r.stateBytes} B`)],
    ['wall time of play', ...all.map(([, r]) => `${r.seconds.toFixed(1)} s`)],
    ['tables that finished their exchange', ...all.map(([, r]) => `${r.finishedTables} of ${settings.tables}`)],
    ['errors', ...all.map(([, r]) => String(r.errors))],
    ['server memory after a full collection: started / connected / end', ...all.map(([, r]) => `${(r.baseline / 1024).toFixed(0)} / ${(r.connected / 1024).toFixed(0)} / ${(r.peak / 1024).toFixed(0)} MB`)],
    ['server memory per table (end − start) / tables', ...all.map(([, r]) => `${((r.peak - r.baseline) / settings.tables).toFixed(0)} KB`)],
    ['server CPU over play, user+system (share of one core)', ...all.map(([, r]) => `${(r.cpuMs / 1000).toFixed(2)} s (${((r.cpuMs / (r.seconds * 1000)) * 100).toFixed(0)}%)`)],
  ];
}

/** The default report: Rackside on one process beside the bare relay, the floor under the same load. */
export function reportAgainstRelay(settings: LoadSettings, relay: RelayRun, one: RacksideRun) {
  const all: [string, Run][] = [
    ['bare relay', relay],
    ['Rackside, 1 process', one],
  ];
  const relayCpuPerMessage = relay.cpuMs / relay.messages;
  const ratio = one.latency.p99 / relay.latency.p99;
  printRows([
    ...commonRows(all),
    ['p99 over the relay’s p99 in this run', '1.00x', times(ratio)],
    ...tailRows(settings, all),
    ['server CPU per resolved pass (ms)', ...all.map(([, r]) => cpuPerPass(r).toFixed(3))],
    ['relay CPU per relayed message (ms)', relayCpuPerMessage.toFixed(4), ''],
    ['server CPU per pass / relay CPU per message', '', `${(cpuPerPass(one) / relayCpuPerMessage).toFixed(1)}x`],
  ]);
  console.log(
    [
      '',
      `What the ratio means: the same ${settings.tables} tables of four clients, driven by the same client code, played`,
      'the same exchange against a bare Socket.IO relay that checks nothing and stores nothing (it answers the',
      'actions of each turn with one state per seat, padded to the size of Rackside’s, then the acks) and against',
      `Rackside, which checks every action, writes it to its database and builds each seat's own view.`,
      `At p99 a pass took ${fmt(relay.latency.p99)} on the relay and ${fmt(one.latency.p99)} on Rackside: ${ratio.toFixed(2)}x the floor.`,
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
}

/** A counter summed over a run's processes, with each process's own count when there are several; "not read" if one did not answer. */
function counted(r: RacksideRun, field: keyof TableCounts): string {
  if (r.counters.some((c) => c === null)) return 'not read (a process did not answer)';
  const each = r.counters.map((c) => c![field]);
  const sum = String(each.reduce((a, b) => a + b, 0));
  return each.length > 1 ? `${sum} (${each.join(' + ')})` : sum;
}

const perPassOf = (r: RacksideRun, ms: number | null) => (ms === null ? 'not found' : (ms / r.resolved).toFixed(3));

/** Whether a goal holds, as printed. */
const verdict = (met: boolean) => (met ? 'MET' : 'NOT MET');

/** Goals for two processes against one under the same load. */
export const GOALS = { cpuPerPassAtMost: 1.25, throughputAtLeast: 0.9 };

/** `--processes 2`: one Rackside process beside two, both behind HAProxy with a Redis, and the goals. */
export function reportProcesses(settings: LoadSettings, one: RacksideRun, two: RacksideRun) {
  const all: [string, Run][] = [
    ['Rackside, 1 process', one],
    ['Rackside, 2 processes', two],
  ];
  const throughput = perSecond(two) / perSecond(one);
  const cpu = cpuPerPass(two) / cpuPerPass(one);
  const withHelpers = (r: RacksideRun) => (r.cpuMs + (r.haproxyCpuMs ?? 0) + (r.redisCpuMs ?? 0)) / r.resolved;
  const split = (r: RacksideRun, same: boolean) =>
    r.split ? `${r.split.map((s) => `${s.server} ${s.current}`).join(', ')}${same ? ' (a and b: the one process)' : ''}` : 'no balancer';
  printRows([
    [...commonRows(all)[0], 'two / one'],
    ['REDIS_URL set / how clients connect', ...[one, two].map((r) => `${r.redis ? 'yes' : 'no'} / ${r.balanced ? 'HAProxy, query table=<id>' : 'straight to the process'}`)],
    ...commonRows(all).slice(1),
    ...tailRows(settings, all),
    ['Rackside CPU over play, each process', ...all.map(([, r]) => (r as RacksideRun).perProcessCpuMs.map((ms) => `${(ms / 1000).toFixed(2)} s`).join(' + '))],
    ['Rackside CPU per resolved pass, all its processes (ms)', cpuPerPass(one).toFixed(3), cpuPerPass(two).toFixed(3), times(cpu)],
    ['HAProxy CPU per resolved pass (ms), not in the above', perPassOf(one, one.haproxyCpuMs), perPassOf(two, two.haproxyCpuMs)],
    ['redis-server CPU per resolved pass (ms), not in the above', perPassOf(one, one.redisCpuMs), perPassOf(two, two.redisCpuMs)],
    ['Rackside + HAProxy + redis-server CPU per pass (ms)', withHelpers(one).toFixed(3), withHelpers(two).toFixed(3), times(withHelpers(two) / withHelpers(one))],
    ['passes resolved per second, two / one', '', '', times(throughput)],
    ['table connections per config server (HAProxy, after seating)', split(one, true), split(two, false)],
    ['connections closed during play', String(one.dropped), String(two.dropped)],
    ['actions forwarded to another process', 'no such path: the balancer routes each table to its owner', ''],
    ['actions on a table split over processes', counted(one, 'split'), counted(two, 'split')],
    ['actions retried after a conflict', counted(one, 'retried'), counted(two, 'retried')],
    ['catch-ups folded / tables read again whole', `${counted(one, 'caughtUp')} / ${counted(one, 'rebuilt')}`, `${counted(two, 'caughtUp')} / ${counted(two, 'rebuilt')}`],
  ]);
  console.log(
    [
      '',
      'Goals, two processes against one:',
      `  Rackside CPU per pass on two ≤ ${GOALS.cpuPerPassAtMost}× one: ${times(cpu, 3)}, ${verdict(cpu <= GOALS.cpuPerPassAtMost)}`,
      `  passes per second on two ≥ ${GOALS.throughputAtLeast}× one: ${times(throughput, 3)}, ${verdict(throughput >= GOALS.throughputAtLeast)}`,
      '',
      settings.warmup
        ? 'Warmed up: every table played one exchange before the measured one, in both runs (`--cold` skips it). A fresh'
        : 'Cold: the measured exchange is each table\'s first (no warm-up round). A fresh',
      'process spends its first seconds compiling its hot paths; that is paid once per process, so over a short cold',
      'play two fresh processes pay it twice, and a server that runs for hours does not pay it per pass at all.',
      '',
      `What was compared: the same ${settings.tables} tables of four signed-in clients, the same client code and exchanges, first`,
      'on one Rackside process, then on two, one after the other in this run. Both runs set REDIS_URL (Socket.IO\'s',
      'Redis adapter, one redis-server started fresh for each run) and share one database between their processes.',
      'In both, every client connects through HAProxy with the production config (server/deploy/haproxy.cfg), its',
      'table named in the Socket.IO handshake query (`table=<id>`), which the config hashes on; for the single',
      'process the config\'s two servers, a and b, both point at it, so both runs pay the same extra hop and the only',
      'differences are the second process and the balancer spreading tables over the two. (Health checks are the',
      'same in both: two every half second, both to the one process or one to each of the two.)',
      '',
      'What is fair to compare: the clients all run in this bench\'s one process, on a machine of 2 shared cores',
      'that also runs HAProxy, redis-server and whatever else is busy on it, so two processes cannot double',
      'the passes per second here; that figure can only show whether a second process costs throughput. CPU per pass',
      'is the fair figure: each Rackside process\'s own CPU time (user + system, every thread, from /proc/<pid>/stat)',
      'from the first deal to the last finished table, summed over the processes and divided by the passes',
      'resolved. It is what a pass costs Rackside wherever it runs, and it grows with whatever work a second',
      'process adds (fan-out through Redis, catching up, retries). HAProxy\'s and redis-server\'s CPU are read the',
      'same way and shown apart; they are not in Rackside\'s figure or in the goals.',
      '',
      'The counters are each process\'s own (server/realtime/counters.ts, printed on SIGWINCH by',
      'tests/bench/counters-on-signal.ts), read when play has ended and counted since the process started, so',
      'they include seating. With the balancer sending every connection of a table to one process, no action',
      'needs forwarding: the figure is read, not assumed. A counter moves only where the table master counts it.',
    ].join('\n'),
  );
}

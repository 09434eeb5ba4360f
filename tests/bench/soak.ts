/**
 * `npm run bench:soak [-- --exchanges 10000 --wave 1000 --players 100 --idle-ms 1000 --settle-ms 2200]`: many exchanges played one
 * after another against the real server in its own process, in waves; after each wave the server
 * runs a full collection and its resident memory and heap are printed. Tables nobody is at leave
 * memory (TABLE_IDLE_MS), so memory should stay flat after the first waves.
 *
 * Each player opens a table, seats three bots, sits east, deals, plays plainly to the end, and goes
 * on to a new table: the one it leaves is finished and empty.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { io as connect, type Socket } from 'socket.io-client';
import type { Action } from '../../shared/exchange/types';
import type { TableStateDto } from '../../shared/protocol';

const args = process.argv.slice(2);
const arg = (name: string, fallback: number) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? Number(args[i + 1]) : fallback;
};
const EXCHANGES = arg('exchanges', 10_000);
const WAVE = arg('wave', 1_000);
const PLAYERS = arg('players', 100);
const IDLE_MS = arg('idle-ms', 1_000);
/** How long to wait after a wave before reading memory (default: two idle periods, so the wave's tables are swept). */
const SETTLE_MS = arg('settle-ms', IDLE_MS * 2 + 200);
const dir = mkdtempSync(join(tmpdir(), 'rackside-soak-'));

function startServer(): Promise<{ child: ChildProcess; url: string }> {
  const child = spawn(process.execPath, ['--expose-gc', '--import', 'tsx', '--import', './tests/bench/gc-on-signal.ts', 'server/index.ts'], {
    env: {
      ...process.env,
      PORT: '0',
      DATABASE_URL: `sqlite:${join(dir, 'soak.sqlite')}`,
      BCRYPT_ROUNDS: '4',
      SEED_DEMO: 'false',
      CLIENT_DIR: 'none',
      BOT_DELAY_MS: '0',
      REGISTER_RATE_MAX: '100000',
      LOGIN_RATE_MAX: '100000',
      SESSION_SECRET: 'soak',
      LOG_LEVEL: 'error',
      SOURCE_MAPS: 'false',
      TABLE_IDLE_MS: String(IDLE_MS),
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => {
      const m = d.toString().match(/ready on http:\/\/localhost:(\d+)/);
      if (m) resolve({ child, url: `http://127.0.0.1:${m[1]}` });
    });
    child.once('exit', (code) => reject(new Error(`the server exited with ${code}`)));
  });
}

/** Resident memory (KB) and heap in use (bytes) after a full collection (see gc-on-signal.ts). */
async function settled(child: ChildProcess): Promise<{ rssKb: number; heap: number }> {
  const heap = await new Promise<number>((resolve) => {
    const hear = (d: Buffer) => {
      const m = d.toString().match(/collected heap=(\d+)/);
      if (m) {
        child.stdout!.off('data', hear);
        resolve(Number(m[1]));
      }
    };
    child.stdout!.on('data', hear);
    child.kill('SIGUSR2');
  });
  const line = readFileSync(`/proc/${child.pid}/status`, 'utf8').split('\n').find((l) => l.startsWith('VmRSS:'))!;
  return { rssKb: Number(line.replace(/\D+/g, '')), heap };
}

function plainAction(state: TableStateDto): Action | null {
  const view = state.view;
  const seat = state.mySeat;
  if (!view || !seat || view.seats[seat].committed) return null;
  if (state.phase === 'vote') return { type: 'vote', stop: true };
  if (state.phase === 'courtesy-ask') return { type: 'courtesy-ask', count: 0 };
  if (view.passSize > 0) return { type: 'pass', tiles: state.myRack.filter((t) => t.kind !== 'joker').slice(0, view.passSize).map((t) => t.id) };
  return null;
}

interface Player {
  cookie: string;
  socket: Socket;
  latest: TableStateDto | null;
  /** States received so far, so a wait never misses one that came while the player was busy. */
  received: number;
  wake: (() => void) | null;
}

/** Resolves once a state past the `seen`-th has arrived. */
function nextState(p: Player, seen: number): Promise<void> {
  if (p.received > seen) return Promise.resolve();
  return new Promise((resolve) => (p.wake = resolve));
}

async function ack(socket: Socket, event: string, payload?: unknown) {
  const answer = await (payload === undefined ? socket.timeout(30_000).emitWithAck(event) : socket.timeout(30_000).emitWithAck(event, payload)).catch((err: Error) => {
    throw new Error(`${event}: ${err.message}`);
  });
  if (!answer.ok) throw new Error(`${event}: ${answer.code} ${answer.message}`);
  return answer;
}

/** One exchange: a new table, three bots, deal, play to the end. */
async function playOne(url: string, p: Player, n: number) {
  const res = await fetch(`${url}/api/tables`, { method: 'POST', headers: { 'Content-Type': 'application/json', Cookie: p.cookie }, body: JSON.stringify({ name: `Soak ${n}`, options: { courtesy: false } }) });
  const tableId = ((await res.json()) as { table: { id: string } }).table.id;
  p.latest = null;
  await ack(p.socket, 'table:join', { tableId, as: 'player' });
  await ack(p.socket, 'table:sit', { seat: 'east' });
  for (const seat of ['south', 'west', 'north']) await ack(p.socket, 'table:bot', { seat, strategy: 'random' });
  await ack(p.socket, 'table:start');
  for (;;) {
    const seen = p.received;
    const s = p.latest as TableStateDto | null;
    if (s && s.tableId === tableId && s.phase === 'done') return;
    const action = s && s.tableId === tableId ? plainAction(s) : null;
    if (action) {
      const answer = await p.socket.timeout(30_000).emitWithAck('exchange:act', { action });
      if (!answer.ok && !['STALE', 'ALREADY_COMMITTED', 'WRONG_PHASE', 'NOT_STARTED'].includes(answer.code)) throw new Error(`act: ${answer.code} ${answer.message}`);
    }
    await nextState(p, seen);
  }
}

async function main() {
  const { child, url } = await startServer();
  const players: Player[] = [];
  for (let i = 0; i < PLAYERS; i++) {
    const res = await fetch(`${url}/api/auth/register`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: `soak${i}@soak.test`, password: 'soak-test-pass', displayName: `Soak ${i}` }) });
    const cookie = res.headers.getSetCookie()[0].split(';')[0];
    const socket = connect(url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: cookie } });
    await new Promise<void>((resolve, reject) => {
      socket.once('connect', () => resolve());
      socket.once('connect_error', reject);
    });
    const p: Player = { cookie, socket, latest: null, received: 0, wake: null };
    socket.on('table:state', (st: TableStateDto) => {
      p.latest = st;
      p.received += 1;
      const wake = p.wake;
      p.wake = null;
      wake?.();
    });
    players.push(p);
  }
  const base = await settled(child);
  console.log(`Soak: ${EXCHANGES} exchanges in waves of ${WAVE}, ${PLAYERS} players at once, each with three bots; tables leave memory after ${IDLE_MS} ms idle.`);
  console.log(`after start and sign-up: ${(base.rssKb / 1024).toFixed(1)} MB resident, ${(base.heap / 2 ** 20).toFixed(1)} MB heap`);
  console.log('wave  exchanges  seconds  exch/s  resident MB  heap MB');
  let done = 0;
  const t0 = performance.now();
  const rows: { heap: number; rss: number }[] = [];
  while (done < EXCHANGES) {
    const wave = Math.min(WAVE, EXCHANGES - done);
    const w0 = performance.now();
    let next = 0;
    await Promise.all(
      players.map(async (p) => {
        for (let n = next++; n < wave; n = next++) await playOne(url, p, done + n);
      }),
    );
    done += wave;
    // Let the idle tables of this wave reach the sweep, then read memory after a full collection.
    await new Promise((resolve) => setTimeout(resolve, SETTLE_MS));
    const m = await settled(child);
    rows.push({ heap: m.heap, rss: m.rssKb });
    const seconds = (performance.now() - w0) / 1000;
    console.log(`${String(rows.length).padStart(4)}  ${String(done).padStart(9)}  ${seconds.toFixed(1).padStart(7)}  ${(wave / seconds).toFixed(0).padStart(6)}  ${(m.rssKb / 1024).toFixed(1).padStart(11)}  ${(m.heap / 2 ** 20).toFixed(1).padStart(7)}`);
  }
  const later = rows.slice(Math.min(2, rows.length - 1));
  const heapGrowth = (later[later.length - 1].heap - later[0].heap) / 2 ** 20;
  console.log(`${done} exchanges in ${((performance.now() - t0) / 1000).toFixed(0)} s. Heap from wave ${rows.length - later.length + 1} to the last: ${heapGrowth >= 0 ? '+' : ''}${heapGrowth.toFixed(1)} MB (flat means tables leave memory).`);
  players.forEach((p) => p.socket.disconnect());
  child.kill('SIGTERM');
  await new Promise((resolve) => child.once('exit', resolve));
  rmSync(dir, { recursive: true, force: true });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});

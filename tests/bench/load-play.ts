/**
 * The load client of `npm run bench:load`: four socket connections per table, seated in turn
 * order, then every table plays one whole exchange, each client answering as soon as its state
 * asks it to. The same code drives Rackside (one process or several) and the bare relay; it
 * measures a pass from its fourth commit to all four clients holding the next step.
 */
import { performance } from 'node:perf_hooks';
import { io as connect, type Socket } from 'socket.io-client';
import type { Action } from '../../shared/exchange/types';
import type { TableStateDto } from '../../shared/protocol';
import { SEATS } from '../../shared/seats';

function percentile(sorted: number[], p: number) {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function summary(values: number[]) {
  const s = [...values].sort((a, b) => a - b);
  return { n: s.length, p50: percentile(s, 50), p95: percentile(s, 95), p99: percentile(s, 99) };
}

export async function inBatches<T>(items: T[], size: number, fn: (item: T, i: number) => Promise<void>) {
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

export interface Seat4 {
  socket: Socket;
  latest: TableStateDto | null;
}

/** Where connection `s` of table `t` goes: a server's URL, and the handshake query a balancer routes on. */
export type Route = (tableId: string, t: number, s: number) => { url: string; query?: Record<string, string> };

/** Four connections per table, each joined and seated in turn order; `cookies` signs them in (none for the relay). */
export async function seatTables(route: Route, tableIds: string[], cookies: string[] | null) {
  const tables: Seat4[][] = [];
  let errors = 0;
  await inBatches(tableIds, 10, async (tableId, t) => {
    const seats: Seat4[] = [];
    for (let s = 0; s < 4; s++) {
      const { url, query } = route(tableId, t, s);
      const socket = connect(url, {
        transports: ['websocket'],
        reconnection: false,
        ...(query ? { query } : {}),
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

/** How long one run may deal and play before the tables still going are given up and counted as unfinished. */
const PLAY_DEADLINE_MS = 10 * 60 * 1000;

/**
 * Every table plays one whole exchange, each client answering as soon as its state asks it to.
 * The same code drives Rackside and the relay. A table that cannot start, or is still going at
 * the deadline, is counted as unfinished rather than waited for. Tables are dealt `startBatch` at
 * a time, as people sit down at different moments.
 */
export async function play(tables: Seat4[][], startBatch: number) {
  const latencies: number[] = [];
  const huddleLatencies: number[] = [];
  let resolved = 0;
  let errors = 0;
  let states = 0;
  let sampledBytes = 0;
  let sampled = 0;
  let finishedTables = 0;
  // Connections closed before play ended (a balancer that marked its server down closes them).
  let dropped = 0;
  let over = false;
  let deadline: NodeJS.Timeout | undefined;
  const starts: (() => Promise<void>)[] = [];
  // Its listeners come off when play ends, so that the same connections can play another round.
  const cleanups: (() => void)[] = [];
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
          seats.forEach((s) => {
            const onDrop = () => {
              if (!over) dropped++;
            };
            s.socket.on('disconnect', onDrop);
            cleanups.push(() => s.socket.off('disconnect', onDrop));
          });
          seats.forEach((s, i) => {
            const onTableState = (st: TableStateDto) => {
              if (states++ % SIZE_SAMPLE === 0) {
                sampledBytes += JSON.stringify(st).length;
                sampled++;
              }
              onState(i);
            };
            s.socket.on('table:state', onTableState);
            cleanups.push(() => s.socket.off('table:state', onTableState));
          });
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
  await Promise.race([inBatches(starts, startBatch, (start) => start()), overdue]);
  await Promise.race([allDone, overdue]);
  clearTimeout(deadline);
  over = true;
  cleanups.forEach((off) => off());
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
    dropped,
  };
}

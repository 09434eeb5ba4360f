/**
 * Several Rackside processes on one database, fanning out through one Redis: real processes, a real
 * redis-server, SQLite or a real PostgreSQL server, and HAProxy with the configuration kept for
 * production (server/deploy/haproxy.cfg), all on loopback.
 */
import type { ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { performance } from 'node:perf_hooks';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { io as connect } from 'socket.io-client';
import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { ExchangeReplayDto, TableStateDto } from '../../shared/protocol';
import { SEATS } from '../../shared/seats';
import { startPostgres, startRackside, startRedis, waitFor, type Running, type RunningPostgres } from './backing-servers';
import { startHaproxy, type RunningHaproxy } from './haproxy';
import { autoPlayer, Client, expectAckedInLog } from './live';

let redis: Running;
let postgres: RunningPostgres;
const running: ChildProcess[] = [];
const folders: string[] = [];
const openClients: Client[] = [];
const balancers: RunningHaproxy[] = [];
const listeners: Redis[] = [];

beforeAll(async () => {
  [redis, postgres] = await Promise.all([startRedis(), startPostgres()]);
}, 60_000);

afterEach(async (context) => {
  openClients.splice(0).forEach((c) => c.socket.disconnect());
  running.splice(0).forEach((p) => p.exitCode === null && p.kill('SIGKILL'));
  const fronts = balancers.splice(0);
  // A failing test shows what HAProxy logged: each request, and each server it marked up or down.
  if (context.task.result?.state === 'fail') fronts.forEach((f) => process.stderr.write(`HAProxy said:\n${f.output()}\n`));
  await Promise.all(fronts.map((f) => f.stop()));
  await Promise.allSettled(listeners.splice(0).map((l) => l.quit()));
});

afterAll(async () => {
  await Promise.allSettled([redis?.stop(), postgres?.stop()]);
  folders.forEach((f) => rmSync(f, { recursive: true, force: true }));
});

interface Proc {
  child: ChildProcess;
  url: string;
  port: number;
}

/** One Rackside process, as it runs in production: its own port, the shared database and Redis. */
async function rackside(databaseUrl: string): Promise<Proc> {
  // Every test here registers four new people from one address, and the limit on new accounts
  // counts in the one Redis the whole file shares: raise it.
  const proc = await startRackside({ REGISTER_RATE_MAX: '1000', DATABASE_URL: databaseUrl, REDIS_URL: redis.url, WEBSOCKET_ONLY: 'true', SESSION_SECRET: 'shared-by-every-process', SEED_DEMO: 'false' });
  running.push(proc.child);
  return proc;
}

async function twoProcesses(databaseUrl: string) {
  const a = await rackside(databaseUrl);
  const b = await rackside(databaseUrl);
  return [a, b] as const;
}

const databases = {
  sqlite: () => {
    const dir = mkdtempSync(join(tmpdir(), 'rackside-two-'));
    folders.push(dir);
    return `sqlite:${join(dir, 'shared.sqlite')}`;
  },
  postgres: () => postgres.newDatabase(`rackside_${Date.now()}_${Math.floor(Math.random() * 1e6)}`),
};

async function register(url: string, name: string) {
  const res = await request(url).post('/api/auth/register').send({ email: `${name}@harborlane.test`, password: 'tiles-and-tea', displayName: name });
  if (res.status !== 201) throw new Error(`register ${name}: ${res.status} ${JSON.stringify(res.body)}`);
  return (res.headers['set-cookie'] as unknown as string[])[0].split(';')[0];
}

/** A socket straight to one process, or, with a table, through the balancer as the client does: the table's id in the handshake query. */
function socketTo(url: string, cookie: string, reconnect: boolean, table?: string) {
  return connect(url, { transports: ['websocket'], reconnection: reconnect, reconnectionDelay: 100, reconnectionDelayMax: 300, extraHeaders: { Cookie: cookie }, ...(table ? { query: { table } } : {}) });
}

/** A client of live.ts's, kept to be closed after the test. */
function player(name: string, cookie: string, url: string, tableId: string, reconnect = false) {
  const p = autoPlayer(url, name, cookie, tableId, { reconnect, sendVersion: true });
  openClients.push(p.c);
  return p;
}

/** Four people, a table, everyone seated: east and south through the first URL, west and north through the second. */
async function seatedTable(urls: [string, string]) {
  const names = ['ines', 'theo', 'mina', 'ruth'].map((n) => `${n}${Math.floor(Math.random() * 1e6)}`);
  const cookies: string[] = [];
  for (const n of names) cookies.push(await register(urls[0], n));
  const table = (await request(urls[1]).post('/api/tables').set('Cookie', cookies[0]).send({ name: 'Harbor Lane, two rooms', options: { seed: 'harbor-lane-week-09' } })).body.table as { id: string };
  for (const [i, cookie] of cookies.entries()) {
    const c = new Client(names[i], cookie, socketTo(urls[i < 2 ? 0 : 1], cookie, false));
    openClients.push(c);
    await c.ok('table:join', { tableId: table.id, as: 'player' });
    await c.ok('table:sit', { seat: SEATS[i] });
  }
  openClients.splice(0).forEach((c) => c.socket.disconnect());
  return { names, cookies, table };
}

async function replayOf(url: string, cookie: string, exchangeId: string) {
  const res = await request(url).get(`/api/exchanges/${exchangeId}/replay`).set('Cookie', cookie);
  expect(res.status).toBe(200);
  return res.body.replay as ExchangeReplayDto;
}

/**
 * Counts the notices one process sends the others about a stored table change ("table:moved"), by
 * listening on every Redis channel (the Socket.IO adapter carries them as MessagePack, whose strings
 * are plain bytes). Closed after the test.
 */
async function movedNotices() {
  const sub = new Redis(redis.url);
  listeners.push(sub);
  let count = 0;
  sub.on('pmessageBuffer', (_pattern: Buffer, _channel: Buffer, message: Buffer) => {
    if (message.includes('table:moved')) count += 1;
  });
  await sub.psubscribe('*');
  return { count: () => count };
}

/** HAProxy in front of the two processes (the config's servers a and b), stopped after the test. */
async function balancer(a: Proc, b: Proc) {
  const front = await startHaproxy({ a: a.port, b: b.port });
  balancers.push(front);
  return front;
}

/** The URL a table's sockets use through the balancer: Socket.IO sends its query on the upgrade and on every polling request. */
const tableUrl = (front: RunningHaproxy, tableId: string) => `${front.url}/?table=${encodeURIComponent(tableId)}`;

/**
 * Which process HAProxy sent a table's sockets to, read from HAProxy itself: its open connections per
 * server in the `tables` backend (only this table's sockets are open there).
 */
async function tableSockets(front: RunningHaproxy) {
  const servers = (await front.servers()).filter((s) => s.backend === 'tables');
  return Object.fromEntries(servers.map((s) => [s.server, s.current])) as Record<'a' | 'b', number>;
}

/**
 * Resolves with the time from `since` to the first action acked to a player on a connection opened
 * after `since` (an ack still on its way from a process being killed does not count).
 */
function nextAckOnNewConnection(players: { acked: unknown[]; seen: { connects: number } }[], since: number) {
  return new Promise<number>((resolve) => {
    for (const p of players) {
      const connectsBefore = p.seen.connects;
      const push = p.acked.push.bind(p.acked);
      p.acked.push = (...items: unknown[]) => {
        if (p.seen.connects > connectsBefore) resolve(performance.now() - since);
        return push(...items);
      };
    }
  });
}

describe.each(Object.keys(databases) as (keyof typeof databases)[])('two processes on %s with one Redis', (kind) => {
  test('four players, two on each process, finish an exchange; every one of them sees every step; the log is complete', async () => {
    const [a, b] = await twoProcesses(databases[kind]());
    // WEBSOCKET_ONLY: long-polling, which would need sticky sessions, is refused.
    expect((await request(a.url).get('/socket.io/?EIO=4&transport=polling')).status).toBe(400);
    const { names, cookies, table } = await seatedTable([a.url, b.url]);
    const players = names.map((n, i) => player(n, cookies[i], i < 2 ? a.url : b.url, table.id));
    // Each process counts who is here over both: every client sees all four seats connected.
    const allHere = (s: TableStateDto) => SEATS.every((seat) => (s.seats[seat].occupant as { connected?: boolean } | null)?.connected === true);
    await Promise.all(players.map((p) => p.c.until((s) => s.status === 'lobby' && allHere(s))));
    const notices = await movedNotices();
    await players[0].c.ok('table:start');
    await Promise.all(players.map((p) => p.c.until((s) => s.phase === 'done', 30_000)));
    // Players on both processes: each tells the other of what it stored.
    expect(notices.count()).toBeGreaterThan(0);
    const steps = players[0].c.state.view!.history.length;
    for (const p of players) {
      // Each client held every step: a state at every number of resolved passes from 0 to the end.
      const seen = new Set(p.c.states.flatMap((s) => (s.view ? [s.view.history.length] : [])));
      expect([...seen].sort((x, y) => x - y)).toEqual(Array.from({ length: steps + 1 }, (_, i) => i));
      expect(p.c.state.myRack.length).toBe(p.c.state.mySeat === 'east' ? 14 : 13);
    }
    // Either process serves the replay, and it holds every acked action.
    const replay = await replayOf(b.url, cookies[0], players[0].c.state.exchangeId!);
    expect(replay.log.filter((e) => 'resolve' in e || !('seat' in e)).length).toBeGreaterThan(0);
    expectAckedInLog(replay, players);
    expect(players.every((p) => p.acked.length > 0)).toBe(true);
  }, 90_000);

  test('through HAProxy, the four players of one table all reach the same process: HAProxy counts them there, and only killing that process drops them', async () => {
    const [a, b] = await twoProcesses(databases[kind]());
    const front = await balancer(a, b);
    const { names, cookies, table } = await seatedTable([a.url, b.url]);
    const people = names.map((n, i) => new Client(n, cookies[i], socketTo(front.url, cookies[i], false, table.id)));
    openClients.push(...people);
    for (const c of people) await c.ok('table:join', { tableId: table.id, as: 'player' });
    // HAProxy's own count of open connections: four on one server of the `tables` backend, none on the other.
    const counts = await tableSockets(front);
    expect(Object.values(counts).sort()).toEqual([0, 4]);
    const owner = counts.a === 4 ? a : b;
    const other = owner === a ? b : a;
    const dropped = people.map((c) => new Promise<void>((resolve) => c.socket.once('disconnect', () => resolve())));
    // Seen from the clients: with the other process gone, every one of them is still answered...
    other.child.kill('SIGKILL');
    await new Promise((resolve) => other.child.once('exit', resolve));
    for (const c of people) await c.ok('table:join', { tableId: table.id, as: 'player' });
    expect(people.every((c) => c.socket.connected)).toBe(true);
    // ...and with the owner gone, every one of them is dropped.
    owner.child.kill('SIGKILL');
    await Promise.all(dropped);
  }, 90_000);

  test('through HAProxy, the process with all of a table\'s sockets owns it: a whole exchange tells the other process nothing', async () => {
    const [a, b] = await twoProcesses(databases[kind]());
    const front = await balancer(a, b);
    const { names, cookies, table } = await seatedTable([a.url, b.url]);
    const players = names.map((n, i) => player(n, cookies[i], tableUrl(front, table.id), table.id));
    await Promise.all(players.map((p) => p.c.until((s) => s.status === 'lobby')));
    expect(Object.values(await tableSockets(front)).sort()).toEqual([0, 4]);
    await players[0].c.ok('table:start');
    // Counted from the first resolved pass (every join has been counted on both processes by then) to the end.
    await Promise.all(players.map((p) => p.c.until((s) => (s.view?.history.length ?? 0) >= 1, 20_000)));
    const notices = await movedNotices();
    await Promise.all(players.map((p) => p.c.until((s) => s.phase === 'done', 45_000)));
    expect(notices.count()).toBe(0);
    const replay = await replayOf(front.url, cookies[0], players[0].c.state.exchangeId!);
    expectAckedInLog(replay, players);
  }, 90_000);

  test('SIGKILL the process that owns the table mid-exchange: its players reconnect through HAProxy to the other by themselves, and nothing acked is lost', async () => {
    const [a, b] = await twoProcesses(databases[kind]());
    const front = await balancer(a, b);
    const { names, cookies, table } = await seatedTable([a.url, b.url]);
    const players = names.map((n, i) => player(n, cookies[i], tableUrl(front, table.id), table.id, true));
    await Promise.all(players.map((p) => p.c.until((s) => s.status === 'lobby')));
    await players[0].c.ok('table:start');
    await players[0].c.until((s) => (s.view?.history.length ?? 0) >= 2, 20_000);
    const counts = await tableSockets(front);
    expect(Object.values(counts).sort()).toEqual([0, 4]);
    const owner = counts.a === 4 ? a : b;
    const ownerName = owner === a ? 'a' : 'b';
    const killedAt = performance.now();
    const resumed = nextAckOnNewConnection(players, killedAt);
    owner.child.kill('SIGKILL');
    await new Promise((resolve) => owner.child.once('exit', resolve));
    const markedDown = waitFor(async () => (await front.servers()).some((s) => s.backend === 'tables' && s.server === ownerName && s.status === 'DOWN'), 'HAProxy marking the killed process down').then(() => performance.now() - killedAt);
    const [ms, downMs] = await Promise.all([resumed, markedDown]);
    process.stdout.write(`[${kind}] the table's process SIGKILLed: the next action was stored ${ms.toFixed(0)} ms later, on the other process; HAProxy marked it down after ${downMs.toFixed(0)} ms\n`);
    await Promise.all(players.map((p) => p.c.until((s) => s.phase === 'done', 45_000)));
    // All four were on the process that died; all four came back through HAProxy, to the other.
    expect(players.filter((p) => p.seen.connects > 1).length).toBe(4);
    // The replay through HAProxy too: REST goes to the process left.
    const replay = await replayOf(front.url, cookies[0], players[0].c.state.exchangeId!);
    expectAckedInLog(replay, players);
    const resolves = replay.log.filter((e) => !('seat' in e)).length;
    expect(resolves).toBeGreaterThanOrEqual(players[0].c.state.view!.history.length);
  }, 120_000);

  test('huddle notes written on one process reach the players on the other: a table note everyone, a note on west only west', async () => {
    const [a, b] = await twoProcesses(databases[kind]());
    const { names, cookies, table } = await seatedTable([a.url, b.url]);
    const people = names.map((n, i) => new Client(n, cookies[i], socketTo(i < 2 ? a.url : b.url, cookies[i], false)));
    openClients.push(...people);
    for (const c of people) await c.ok('table:join', { tableId: table.id, as: 'player' });
    const [host, , west, north] = people;
    await host.ok('table:start');
    await Promise.all(people.map((c) => c.until((s) => s.phase === 'first-right', 20_000)));
    await host.ok('huddle:call');
    await host.ok('huddle:note', { text: 'Everyone: keep your pairs.' });
    await host.ok('huddle:note', { text: 'West: your dots are building.', seat: 'west' });
    const westSees = await west.until((s) => s.huddle.notes.length === 2, 20_000);
    expect(westSees.huddle.notes.map((n) => n.text).sort()).toEqual(['Everyone: keep your pairs.', 'West: your dots are building.']);
    const northSees = await north.until((s) => s.huddle.notes.length >= 1, 20_000);
    expect(northSees.huddle.notes.map((n) => n.text)).toEqual(['Everyone: keep your pairs.']);
    expect(north.states.some((s) => s.huddle.notes.some((n) => n.seat === 'west'))).toBe(false);
  }, 60_000);

  test('one seat sends two different choices at the same instant, one to each process: exactly one is accepted', async () => {
    const [a, b] = await twoProcesses(databases[kind]());
    const { names, cookies, table } = await seatedTable([a.url, b.url]);
    const east = [new Client(names[0], cookies[0], socketTo(a.url, cookies[0], false)), new Client(names[0], cookies[0], socketTo(b.url, cookies[0], false))];
    const host = east[0];
    openClients.push(...east);
    for (const c of east) await c.ok('table:join', { tableId: table.id, as: 'player' });
    await host.ok('table:start');
    const states = await Promise.all(east.map((c) => c.until((s: TableStateDto) => s.phase === 'first-right')));
    const rack = states[0].myRack.filter((t) => t.kind !== 'joker');
    const choices = [rack.slice(0, 3), rack.slice(3, 6)].map((tiles) => ({ type: 'pass' as const, tiles: tiles.map((t) => t.id) }));
    const acks = await Promise.all(east.map((c, i) => c.emit('exchange:act', { action: choices[i] })));
    expect(acks.filter((x) => x.ok)).toHaveLength(1);
    const refused = acks.find((x) => !x.ok)!;
    expect(['ALREADY_COMMITTED', 'LOG_CONFLICT']).toContain(refused.code);
    // Both processes now show the one accepted choice, and the log holds exactly one pass from east.
    const winner = acks.findIndex((x) => x.ok);
    for (const c of east) await c.until((s) => s.view!.seats.east.committed);
    const res = await request(b.url).get(`/api/tables/${table.id}`).set('Cookie', cookies[0]);
    expect(res.status).toBe(200);
    const pending = (await east[1 - winner].until((s) => s.view!.seats.east.committed)).view!;
    expect([...(pending.pending.east?.tiles ?? [])].sort()).toEqual([...choices[winner].tiles].sort());
  }, 60_000);
});

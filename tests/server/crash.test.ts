import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { io as connect } from 'socket.io-client';
import request from 'supertest';
import { afterAll, expect, test } from 'vitest';
import type { ExchangeReplayDto } from '../../shared/protocol';
import { SEATS } from '../../shared/seats';
import { autoPlayer, Client, expectAckedInLog, simpleAction } from './live';

const dir = mkdtempSync(join(tmpdir(), 'rackside-crash-'));
const port = 4100 + Math.floor(Math.random() * 800);
const url = `http://127.0.0.1:${port}`;
let proc: ChildProcess | undefined;

/** The real server as its own process, so it can be killed outright. */
function startProcess(): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, PORT: String(port), DATABASE_URL: `sqlite:${join(dir, 'crash.sqlite')}`, BCRYPT_ROUNDS: '4', SESSION_SECRET: 'crash-test', SEED_DEMO: 'false', BOT_DELAY_MS: '0', CLIENT_DIR: 'none' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('server did not start')), 20_000);
    child.stdout!.on('data', (d: Buffer) => {
      if (d.toString().includes('ready on')) {
        clearTimeout(timer);
        resolve(child);
      }
    });
    child.stderr!.on('data', (d: Buffer) => process.stderr.write(d));
    child.once('exit', (code) => reject(new Error(`server exited with ${code}`)));
  });
}

afterAll(() => {
  proc?.kill('SIGKILL');
  rmSync(dir, { recursive: true, force: true });
});

async function register(name: string) {
  const res = await request(url).post('/api/auth/register').send({ email: `${name}@harborlane.test`, password: 'tiles-and-tea', displayName: name });
  return (res.headers['set-cookie'] as unknown as string[])[0].split(';')[0];
}

test('SIGKILL mid-exchange: after a restart on the same file every acknowledged action is still there and the table finishes', async () => {
  proc = await startProcess();
  const names = ['ines', 'theo', 'mina', 'ruth'];
  const cookies: string[] = [];
  for (const n of names) cookies.push(await register(n));
  const table = (await request(url).post('/api/tables').set('Cookie', cookies[0]).send({ name: 'Crash drill', options: { seed: 'harbor-lane-week-05' } })).body.table;
  // Seat everyone before play starts.
  const seaters = [];
  for (const [i, cookie] of cookies.entries()) {
    const c = new Client(names[i], cookie, connect(url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: cookie } }));
    await c.ok('table:join', { tableId: table.id, as: 'player' });
    await c.ok('table:sit', { seat: SEATS[i] });
    seaters.push(c);
  }
  seaters.forEach((c) => c.socket.disconnect());
  const players = names.map((n, i) => autoPlayer(url, n, cookies[i], table.id));
  await Promise.all(players.map((p) => p.c.until((s) => s.phase === 'lobby' || s.status === 'lobby')));
  await players[0].c.ok('table:start');

  // Let them play a while, then kill the server without warning.
  await players[0].c.until((s) => s.phase === 'first-left' || s.phase === 'vote' || (s.view?.history.length ?? 0) >= 2, 15_000);
  proc.kill('SIGKILL');
  await new Promise((r) => proc!.once('exit', r));
  const ackedBefore = players.map((p) => p.acked.length);
  expect(ackedBefore.reduce((a, b) => a + b, 0)).toBeGreaterThan(4);

  proc = await startProcess();
  await Promise.all(players.map((p) => p.c.until((s) => s.phase === 'done', 30_000)));

  const replay = (await request(url).get(`/api/exchanges/${players[0].c.state.exchangeId}/replay`).set('Cookie', cookies[0])).body.replay as ExchangeReplayDto;
  expectAckedInLog(replay, players);
  players.forEach((p) => p.c.socket.disconnect());
}, 90_000);

test('SIGTERM: an action sent just before is finished and stored, the process exits 0 and closes the database', async () => {
  if (proc && proc.exitCode === null) {
    proc.kill('SIGKILL');
    await new Promise((r) => proc!.once('exit', r));
  }
  proc = await startProcess();
  const names = ['una', 'vic', 'wes', 'xia'];
  const cookies: string[] = [];
  for (const n of names) cookies.push(await register(n));
  const table = (await request(url).post('/api/tables').set('Cookie', cookies[0]).send({ name: 'Stop drill' })).body.table;
  const cs: Client[] = [];
  for (const [i, cookie] of cookies.entries()) {
    const c = new Client(names[i], cookie, connect(url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: cookie } }));
    await c.ok('table:join', { tableId: table.id, as: 'player' });
    await c.ok('table:sit', { seat: SEATS[i] });
    cs.push(c);
  }
  await cs[0].ok('table:start');
  const states = await Promise.all(cs.map((c) => c.until((x) => x.phase === 'first-right')));
  const exited = new Promise<number | null>((resolve) => proc!.once('exit', (code) => resolve(code)));
  const acks = cs.map((c, i) => c.emit('exchange:act', { action: simpleAction(states[i]) }));
  await new Promise((r) => setTimeout(r, 3));
  proc.kill('SIGTERM');
  // Every message the server received gets its answer: done and stored, or refused because it is stopping.
  const answers = await Promise.all(acks);
  expect(answers).toHaveLength(4);
  for (const a of answers) expect(a.ok || a.code === 'SHUTTING_DOWN', JSON.stringify(a)).toBe(true);
  expect(await exited).toBe(0);
  // A clean close checkpoints the write-ahead log and removes it.
  expect(existsSync(join(dir, 'crash.sqlite-wal'))).toBe(false);
  cs.forEach((c) => c.socket.disconnect());

  proc = await startProcess();
  const again = new Client('vic', cookies[1], connect(url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: cookies[1] } }));
  await again.ok('table:join', { tableId: table.id, as: 'player' });
  if (answers.every((a) => a.ok)) {
    // All four passes were taken, so the pass resolved before the stop.
    expect(again.state.phase).toBe('first-across');
    expect(again.state.view!.history).toHaveLength(1);
  } else {
    expect(SEATS.map((seat) => again.state.seats[seat].committed)).toEqual(answers.map((a) => a.ok));
  }
  again.socket.disconnect();
}, 60_000);

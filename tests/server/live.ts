/**
 * Helpers for live-table tests: a real server on port 0 and real signed-in socket.io clients.
 * Tests take them through `liveTest` (or the `liveKit` fixture), whose kit closes every server,
 * client and temporary folder a test made through it once the test ends.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { io as connect, type Socket } from 'socket.io-client';
import request from 'supertest';
import { expect, test } from 'vitest';
import type { Action } from '../../shared/exchange/types';
import type { Ack, ClientEventName, TableStateDto, ChatMessageDto, ExchangeReplayDto } from '../../shared/protocol';
import { SEATS, type Seat } from '../../shared/seats';
import { loadConfig, type Config } from '../../server/config';
import { startServer } from '../../server/index';

export type Server = Awaited<ReturnType<typeof startServer>> & { url: string };

export async function liveServer(overrides: Partial<Config> = {}): Promise<Server> {
  const server = await startServer(
    loadConfig({}, { port: 0, databaseUrl: 'sqlite::memory:', bcryptRounds: 4, seedDemo: false, sessionSecret: 'live-test', clientDir: 'none', botDelayMs: 0, shutdownGraceMs: 0, seatGraceMs: 0, ...overrides }),
  );
  return { ...server, url: `http://127.0.0.1:${(server.httpServer.address() as AddressInfo).port}` };
}

export class Client {
  states: TableStateDto[] = [];
  chats: ChatMessageDto[] = [];
  private waiters: { pred: (s: TableStateDto) => boolean; resolve: (s: TableStateDto) => void }[] = [];
  constructor(
    readonly name: string,
    readonly cookie: string,
    public socket: Socket,
  ) {
    this.listen();
  }

  listen() {
    this.socket.on('table:state', (state: TableStateDto) => {
      this.states.push(state);
      this.waiters = this.waiters.filter((w) => {
        if (!w.pred(state)) return true;
        w.resolve(state);
        return false;
      });
    });
    this.socket.on('chat:message', (m: ChatMessageDto) => this.chats.push(m));
  }

  get state(): TableStateDto {
    const s = this.states[this.states.length - 1];
    if (!s) throw new Error(`${this.name} has no state yet`);
    return s;
  }

  /** Resolves with the first state (the latest one included) that satisfies pred; the deadline allows for a busy machine. */
  until(pred: (s: TableStateDto) => boolean, timeoutMs = 15_000): Promise<TableStateDto> {
    const latest = this.states[this.states.length - 1];
    if (latest && pred(latest)) return Promise.resolve(latest);
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`${this.name}: no matching state within ${timeoutMs} ms (last phase ${latest?.phase})`)), timeoutMs);
      this.waiters.push({ pred, resolve: (s) => (clearTimeout(timer), resolve(s)) });
    });
  }

  async emit(event: ClientEventName | string, payload?: unknown): Promise<Ack & Record<string, unknown>> {
    const timed = this.socket.timeout(5000);
    return (payload === undefined ? timed.emitWithAck(event) : timed.emitWithAck(event, payload)) as Promise<Ack & Record<string, unknown>>;
  }

  async ok(event: ClientEventName, payload?: unknown) {
    const ack = await this.emit(event, payload);
    if (!ack.ok) throw new Error(`${this.name} ${event}: ${ack.code} ${ack.message}`);
    return ack;
  }
}

export async function register(server: Server, name: string): Promise<string> {
  const email = `${name.toLowerCase()}@harborlane.test`;
  const res = await request(server.url).post('/api/auth/register').send({ email, password: 'tiles-and-tea', displayName: name });
  if (res.status !== 201) throw new Error(`register ${name}: ${res.status} ${JSON.stringify(res.body)}`);
  const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('rackside.sid='))!;
  return cookie.split(';')[0];
}

export async function signIn(server: Server, name: string): Promise<string> {
  const res = await request(server.url).post('/api/auth/login').send({ email: `${name.toLowerCase()}@harborlane.test`, password: 'tiles-and-tea' });
  return (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('rackside.sid='))!.split(';')[0];
}

export function openSocket(server: Server, cookie: string): Promise<Socket> {
  const socket = connect(server.url, { transports: ['websocket'], reconnection: false, extraHeaders: { Cookie: cookie } });
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket));
    socket.once('connect_error', reject);
  });
}

export async function client(server: Server, name: string, cookie?: string) {
  const c = cookie ?? (await register(server, name));
  return new Client(name, c, await openSocket(server, c));
}

export async function createTable(server: Server, cookie: string, body: object = {}) {
  const res = await request(server.url).post('/api/tables').set('Cookie', cookie).send({ name: 'Harbor Lane practice', ...body });
  if (res.status !== 201) throw new Error(`create table: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.table as { id: string; inviteCode?: string };
}

/** Host plus three others, each seated in turn order, ready to start. */
export async function fullTable(server: Server, body: object = {}, names = ['Ines', 'Theo', 'Mina', 'Ruth']) {
  const clients = [];
  for (const name of names) clients.push(await client(server, name));
  const table = await createTable(server, clients[0].cookie, body);
  for (const [i, c] of clients.entries()) {
    await c.ok('table:join', { tableId: table.id, as: 'player', invite: table.inviteCode });
    await c.ok('table:sit', { seat: SEATS[i] });
  }
  return { table, clients, host: clients[0] };
}

/**
 * What a live test holds: the servers it started, every socket it opened and every temporary folder
 * it made through the kit. The `live` fixture closes them all after the test (sockets, then
 * servers, newest first, then folders), so a test cannot leave one behind. Its helpers work on the server started last, starting one with the
 * test defaults when there is none.
 */
export class LiveKit {
  private readonly servers: Server[] = [];
  private readonly sockets: (() => Socket)[] = [];
  private readonly dirs: string[] = [];
  private starting?: Promise<Server>;

  /** Starts a server with these config overrides; closing it before the test ends is allowed. */
  async start(overrides: Partial<Config> = {}): Promise<Server> {
    const started = await liveServer(overrides);
    let closing: Promise<void> | undefined;
    const server: Server = { ...started, close: () => (closing ??= started.close()) };
    this.servers.push(server);
    return server;
  }

  /** The server started last. */
  get server(): Server {
    const latest = this.servers.at(-1);
    if (!latest) throw new Error('No live server yet: call live.start() first');
    return latest;
  }

  /** The server started last, or one started now with the test defaults when there is none. */
  ready(): Promise<Server> {
    const latest = this.servers.at(-1);
    return latest ? Promise.resolve(latest) : (this.starting ??= this.start());
  }

  /** Disconnects these clients (their current sockets) or bare sockets after the test. */
  track(...items: (Client | Socket)[]) {
    for (const item of items) this.sockets.push(item instanceof Client ? () => item.socket : () => item);
  }

  /** Signs up `name` (or uses the cookie given) and connects a socket client. */
  async client(name: string, cookie?: string): Promise<Client> {
    const c = await client(await this.ready(), name, cookie);
    this.track(c);
    return c;
  }

  /** Another socket for someone already signed in: a second tab, or a return after leaving. */
  async reconnect(who: { name: string; cookie: string }): Promise<Client> {
    return new Client(who.name, who.cookie, await this.socket(who.cookie));
  }

  /** A bare signed-in socket, disconnected after the test. */
  async socket(cookie: string): Promise<Socket> {
    const socket = await openSocket(await this.ready(), cookie);
    this.track(socket);
    return socket;
  }

  async fullTable(body: object = {}, names?: string[]) {
    const t = await fullTable(await this.ready(), body, names);
    this.track(...t.clients);
    return t;
  }

  /** A fresh temporary folder (for a database file), removed after the test. */
  tempDir(prefix: string): string {
    const dir = mkdtempSync(join(tmpdir(), prefix));
    this.dirs.push(dir);
    return dir;
  }

  async close() {
    this.sockets.splice(0).forEach((socket) => socket().disconnect());
    for (const server of this.servers.splice(0).reverse()) await server.close();
    this.dirs.splice(0).forEach((dir) => rmSync(dir, { recursive: true, force: true }));
  }
}

/** The `live` fixture: a kit closed, with all it holds, when the test ends. For `test.extend('live', liveKit)`. */
// eslint-disable-next-line no-empty-pattern -- vitest reads a fixture's dependencies from this pattern
export async function liveKit({}: object, { onCleanup }: { onCleanup: (cleanup: () => Promise<void>) => void }) {
  const kit = new LiveKit();
  onCleanup(() => kit.close());
  return kit;
}

/**
 * Tests with a live kit: `live` starts servers on demand; `server` is one started with the test
 * defaults. Both are closed, with every client made through the kit, when the test ends.
 */
export const liveTest = test.extend('live', liveKit).extend('server', async ({ live }) => live.ready());

/** A plain legal choice for a seat from its own latest state: the first non-joker tiles, optional blind. */
export function simpleAction(state: TableStateDto, opts: { blind?: number; stop?: boolean; ask?: 0 | 1 | 2 | 3 } = {}): Action | null {
  const view = state.view!;
  const seat = state.mySeat!;
  if (view.seats[seat].committed) return null;
  if (state.phase === 'vote') return { type: 'vote', stop: opts.stop ?? false };
  if (state.phase === 'courtesy-ask') return { type: 'courtesy-ask', count: opts.ask ?? 2 };
  if (view.passSize > 0) {
    const blind = view.blindAllowed ? (opts.blind ?? 0) : 0;
    const tiles = state.myRack.filter((t) => t.kind !== 'joker').slice(0, view.passSize - blind).map((t) => t.id);
    return { type: 'pass', tiles, ...(blind ? { blind } : {}) };
  }
  return null;
}

export function seatIndex(seat: Seat) {
  return SEATS.indexOf(seat);
}

/**
 * A client that joins its table (and, with `reconnect`, rejoins after any drop by itself) and
 * plays as fast as it is answered. It keeps the actions that were acked, and counts its connects.
 */
export function autoPlayer(url: string, name: string, cookie: string, tableId: string, { reconnect = true, sendVersion = false } = {}) {
  const socket = connect(url, { transports: ['websocket'], reconnection: reconnect, reconnectionDelay: 100, reconnectionDelayMax: 300, extraHeaders: { Cookie: cookie } });
  const c = new Client(name, cookie, socket);
  const acked: Action[] = [];
  const seen = { connects: 0 };
  let busy = false;
  // The state last acted on: the next move waits for a newer one, so nothing is sent twice on one state.
  let actedOn: TableStateDto | undefined;
  async function tick() {
    const s = c.states[c.states.length - 1];
    if (busy || !s?.view || s.phase === 'done' || !socket.connected || s === actedOn) return;
    const action = simpleAction(s, { blind: 1, stop: false, ask: 1 });
    if (!action) return;
    actedOn = s;
    busy = true;
    try {
      const ack = await c.emit('exchange:act', sendVersion ? { action, version: s.version } : { action });
      if (ack.ok) acked.push(action);
    } catch {
      // No answer (the server died): not acknowledged, so nothing is promised.
    } finally {
      busy = false;
      // A state that came in while the action was on its way may already call for the next one.
      void tick();
    }
  }
  socket.on('connect', () => {
    seen.connects += 1;
    void c.emit('table:join', { tableId, as: 'player' }).catch(() => undefined);
  });
  socket.on('table:state', () => void tick());
  return { c, acked, seen };
}

/** Every action acked to each seat's player appears in the stored log, in the order it was acked. */
export function expectAckedInLog(replay: ExchangeReplayDto, players: { c: Client; acked: Action[] }[]) {
  expect(players.length).toBeGreaterThan(0);
  for (const [i, p] of players.entries()) {
    // Every player acts in every pass, so each had something acked.
    expect(p.acked.length, `${p.c.name} had an action acked`).toBeGreaterThan(0);
    const logged = replay.log.flatMap((e) => ('seat' in e && e.seat === SEATS[i] ? [JSON.stringify(e.action)] : []));
    let at = 0;
    for (const a of p.acked) {
      at = logged.indexOf(JSON.stringify(a), at);
      expect(at, `${p.c.name}: ${JSON.stringify(a)} is in the log`).toBeGreaterThanOrEqual(0);
      at += 1;
    }
  }
}

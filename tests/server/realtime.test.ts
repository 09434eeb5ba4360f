import type { AddressInfo } from 'node:net';
import { io as connect, type Socket } from 'socket.io-client';
import request from 'supertest';
import { afterEach, beforeEach, expect, test } from 'vitest';
import { loadConfig } from '../../server/config';
import { startServer } from '../../server/index';
import { createUser, sessionCookie } from './helpers';

let server: Awaited<ReturnType<typeof startServer>>;
let url: string;
const sockets: Socket[] = [];

beforeEach(async () => {
  server = await startServer(
    loadConfig({}, { port: 0, databaseUrl: 'sqlite::memory:', bcryptRounds: 4, seedDemo: false, sessionSecret: 's', clientDir: 'none' }),
  );
  url = `http://127.0.0.1:${(server.httpServer.address() as AddressInfo).port}`;
  await createUser('theo@harborlane.test');
});
afterEach(async () => {
  sockets.splice(0).forEach((s) => s.disconnect());
  await server.close();
});

function open(cookie?: string) {
  const socket = connect(url, { transports: ['websocket'], reconnection: false, extraHeaders: cookie ? { Cookie: cookie } : {} });
  sockets.push(socket);
  return socket;
}

async function signIn() {
  const res = await request(url).post('/api/auth/login').send({ email: 'theo@harborlane.test', password: 'correct horse' });
  return sessionCookie(res)!.split(';')[0];
}

test('a signed-in socket connects on the same port as the API', async () => {
  const socket = open(await signIn());
  await new Promise<void>((resolve, reject) => {
    socket.on('connect', resolve);
    socket.on('connect_error', reject);
  });
  expect(socket.connected).toBe(true);
});

test('a socket without a session is refused with UNAUTHENTICATED', async () => {
  const socket = open();
  const err = await new Promise<Error & { data?: { code: string } }>((resolve) => socket.on('connect_error', resolve));
  expect(err.data?.code).toBe('UNAUTHENTICATED');
});

test("signing out disconnects that session's open sockets", async () => {
  const cookie = await signIn();
  const socket = open(cookie);
  await new Promise<void>((resolve) => socket.on('connect', () => resolve()));
  const closed = new Promise<string>((resolve) => socket.on('disconnect', resolve));
  await request(url).post('/api/auth/logout').set('Cookie', cookie).expect(200);
  expect(await closed).toBe('io server disconnect');
});

import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';

// The socket module is tested against a stand-in for socket.io-client's io(): what matters here is
// which handshake query each connection carries, since the balancer routes tables by it.
const opened: { opts: { query?: Record<string, string> }; connects: number; disconnects: number; emitted: string[] }[] = [];
vi.mock('socket.io-client', () => ({
  io: (opts: { query?: Record<string, string> }) => {
    const record = { opts: { ...opts }, connects: 0, disconnects: 0, emitted: [] as string[] };
    opened.push(record);
    const socket = {
      io: { opts: record.opts, on: () => undefined },
      on: () => socket,
      connected: true,
      connect: () => void (record.connects += 1),
      disconnect: () => void (record.disconnects += 1),
      emit: (event: string) => void record.emitted.push(event),
      timeout: () => ({ emit: (event: string) => void record.emitted.push(event) }),
    };
    return socket;
  },
}));

beforeEach(() => {
  vi.resetModules();
  opened.length = 0;
});
afterEach(() => vi.restoreAllMocks());

describe('the table socket names its table in the handshake', () => {
  test('joining a table opens the socket with ?table= that table', async () => {
    const { joinTable } = await import('../../src/features/table/api/socket');
    void joinTable('table-one');
    expect(opened).toHaveLength(1);
    expect(opened[0].opts.query).toEqual({ table: 'table-one' });
    expect(opened[0].emitted).toEqual(['table:join']);
  });

  test('joining another table connects again with the new id; the same table does not', async () => {
    const { joinTable } = await import('../../src/features/table/api/socket');
    void joinTable('table-one');
    void joinTable('table-one');
    expect(opened[0].disconnects).toBe(0);
    void joinTable('table-two');
    expect(opened).toHaveLength(1);
    expect(opened[0].opts.query).toEqual({ table: 'table-two' });
    expect(opened[0].disconnects).toBe(1);
    expect(opened[0].connects).toBe(1);
    expect(opened[0].emitted).toEqual(['table:join', 'table:join', 'table:join']);
  });
});

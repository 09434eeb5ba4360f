import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sqlite3 from 'sqlite3';
import type { Sequelize } from 'sequelize';
import { afterEach, beforeEach, expect, test } from 'vitest';
import { openDatabase } from '../../server/db';
import { createEventWriter, EventNotStored, GroupWriter, type EventRecord } from '../../server/db/event-writer';
import { migrate } from '../../server/db/migrate';
import { ExchangeEventRow, ExchangeRow, TableRow, User } from '../../server/db/models';

let dir: string;
let db: Sequelize;
let file: string;
let raw: sqlite3.Database | null = null;

beforeEach(async () => {
  dir = mkdtempSync(join(tmpdir(), 'rackside-events-'));
  file = join(dir, 'events.sqlite');
  db = await openDatabase(`sqlite:${file}`);
  await migrate(db);
});

afterEach(async () => {
  if (raw) await new Promise((resolve) => raw!.close(resolve));
  raw = null;
  await db.close();
  rmSync(dir, { recursive: true, force: true });
});

async function exchange(): Promise<string> {
  const host = (await User.findOne()) ?? (await User.create({ email: 'ines@harborlane.test', displayName: 'Ines', role: 'teacher', passwordHash: 'x' }));
  const seats = { east: null, south: null, west: null, north: null };
  const table = await TableRow.create({ id: randomUUID(), name: 'Tuesday table', hostId: host.id, hostName: 'Ines', private: false, inviteCode: null, options: {}, status: 'playing', seats, currentExchangeId: null } as never);
  const row = await ExchangeRow.create({ id: randomUUID(), tableId: table.id, tableName: 'Tuesday table', hostId: host.id, options: { seed: 's' }, seats, participants: ',', status: 'playing', startedAt: new Date(), finishedAt: null } as never);
  return row.id;
}

const event = (exchangeId: string, seq: number): EventRecord => ({ exchangeId, seq, type: 'act', seat: 'east', payload: JSON.stringify({ type: 'vote', stop: false }), userId: null, createdAt: new Date().toISOString() });

/** A writer on a connection of the test's own, which records every statement it sends. */
async function recordingWriter() {
  const opened = await new Promise<sqlite3.Database>((resolve, reject) => {
    const d: sqlite3.Database = new sqlite3.Database(file, (err) => (err ? reject(err) : resolve(d)));
  });
  raw = opened;
  const sent: string[] = [];
  const writer = new GroupWriter(
    (sql, params = []) =>
      new Promise<void>((resolve, reject) => {
        sent.push(sql.split(' ')[0] + (sql.startsWith('BEGIN') ? ' ' + sql.split(' ')[1] : ''));
        opened.run(sql, params, (err) => (err ? reject(err) : resolve()));
      }),
    true,
  );
  return { writer, sent };
}

const seqs = async (exchangeId: string) => (await ExchangeEventRow.findAll({ where: { exchangeId }, order: [['seq', 'ASC']] })).map((e) => e.seq);

test('events appended in the same turn are written in one IMMEDIATE transaction', async () => {
  const a = await exchange();
  const b = await exchange();
  const { writer, sent } = await recordingWriter();
  await Promise.all([writer.append(event(a, 0)), writer.append(event(b, 0)), writer.append(event(a, 1)), writer.append(event(b, 1))]);
  expect(sent).toEqual(['BEGIN IMMEDIATE', 'INSERT', 'INSERT', 'INSERT', 'INSERT', 'COMMIT']);
  expect(await seqs(a)).toEqual([0, 1]);
  expect(await seqs(b)).toEqual([0, 1]);
  // What arrives while a group is being written goes into the next group.
  const first = writer.append(event(a, 2));
  await new Promise((resolve) => setImmediate(resolve));
  const second = writer.append(event(a, 3));
  await Promise.all([first, second]);
  expect(sent.filter((s) => s === 'COMMIT')).toHaveLength(3);
  expect(await seqs(a)).toEqual([0, 1, 2, 3]);
});

test('a taken place refuses that event and the rest of its exchange in the group, and nobody else', async () => {
  const a = await exchange();
  const b = await exchange();
  // As if another process had stored event 0 of exchange b first.
  await ExchangeEventRow.create({ exchangeId: b, seq: 0, type: 'resolve', seat: null, payload: null, userId: null });
  const { writer } = await recordingWriter();
  const results = await Promise.allSettled([writer.append(event(b, 0)), writer.append(event(a, 0)), writer.append(event(b, 1)), writer.append(event(a, 1))]);
  expect(results.map((r) => r.status)).toEqual(['rejected', 'fulfilled', 'rejected', 'fulfilled']);
  const [taken, , later] = results as PromiseRejectedResult[];
  expect(taken.reason).toBeInstanceOf(EventNotStored);
  expect(taken.reason.conflict).toBe(true);
  // Behind a taken place, the later event is behind for the same reason: a conflict too, so its action may be retried.
  expect(later.reason.conflict).toBe(true);
  expect(later.reason.message).toMatch(/earlier event of this exchange/);
  expect(await seqs(a)).toEqual([0, 1]);
  // b keeps only the other writer's event: no hole at 0 with 1 written.
  expect((await ExchangeEventRow.findAll({ where: { exchangeId: b } })).map((e) => [e.seq, e.type])).toEqual([[0, 'resolve']]);
});

test('stored hooks all run before any promise of the group settles; an unwanted event is dropped unwritten', async () => {
  const a = await exchange();
  const b = await exchange();
  const { writer } = await recordingWriter();
  const order: string[] = [];
  const track = (name: string, p: Promise<void>) => p.then(() => order.push(`settled ${name}`), () => order.push(`refused ${name}`));
  await Promise.all([
    track('a0', writer.append(event(a, 0), { stored: () => order.push('stored a0') })),
    track('b0', writer.append(event(b, 0), { wanted: () => false, stored: () => order.push('stored b0') })),
    track('b1', writer.append(event(b, 1), { stored: () => order.push('stored b1') })),
    track('a1', writer.append(event(a, 1), { stored: () => order.push('stored a1') })),
  ]);
  expect(order.slice(0, 2)).toEqual(['stored a0', 'stored a1']);
  expect(order.slice(2).sort()).toEqual(['refused b0', 'refused b1', 'settled a0', 'settled a1']);
  expect(await seqs(b)).toEqual([]);
});

test('the writer for a file database writes on its own connection and closes after its last group', async () => {
  const a = await exchange();
  const writer = createEventWriter(db);
  const pending = [0, 1, 2].map((seq) => writer.append(event(a, seq)));
  await writer.close();
  await Promise.all(pending);
  expect(await seqs(a)).toEqual([0, 1, 2]);
  await expect(writer.append(event(a, 3))).rejects.toThrow(/closed/);
});

test('when the commit itself fails, nothing of the group is stored and every event is refused', async () => {
  const a = await exchange();
  let inserts = 0;
  const { writer: real } = await recordingWriter();
  void real;
  const writer = new GroupWriter(
    (sql, params = []) =>
      new Promise<void>((resolve, reject) => {
        if (sql === 'COMMIT') return reject(new Error('disk I/O error'));
        if (sql.startsWith('INSERT')) inserts += 1;
        raw!.run(sql, params, (err) => (err ? reject(err) : resolve()));
      }),
    true,
  );
  const results = await Promise.allSettled([writer.append(event(a, 0)), writer.append(event(a, 1))]);
  expect(inserts).toBe(2);
  expect(results.map((r) => r.status)).toEqual(['rejected', 'rejected']);
  expect((results[0] as PromiseRejectedResult).reason.message).toMatch(/could not commit: disk I\/O error/);
  expect(await seqs(a)).toEqual([]);
});

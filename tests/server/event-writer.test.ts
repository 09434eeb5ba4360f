/**
 * The event writer as the app makes it (createEventWriter), on each kind of database it opens
 * connections for: a SQLite file (its own sqlite3 connection), in-memory SQLite (the app's one
 * connection) and PostgreSQL (its own pool), started fresh from Debian's binaries when installed.
 */
import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import { openDatabase } from '../../server/db';
import { createEventWriter, EventNotStored, type EventRecord, type EventWriter } from '../../server/db/event-writer';
import { migrate } from '../../server/db/migrate';
import { ExchangeEventRow, ExchangeRow, TableRow, User } from '../../server/db/models';
import { postgresAvailable, startPostgres, type RunningPostgres } from './backing-servers';

let postgres: RunningPostgres | null = null;
const folders: string[] = [];

const databases = {
  'a SQLite file': async () => {
    const dir = mkdtempSync(join(tmpdir(), 'rackside-writer-'));
    folders.push(dir);
    return `sqlite:${join(dir, 'events.sqlite')}`;
  },
  'in-memory SQLite': async () => 'sqlite::memory:',
  PostgreSQL: async () => {
    postgres ??= await startPostgres();
    return postgres.newDatabase(`writer_${randomUUID().replace(/-/g, '')}`);
  },
};

afterAll(async () => {
  await postgres?.stop();
  folders.forEach((f) => rmSync(f, { recursive: true, force: true }));
}, 30_000);

const event = (exchangeId: string, seq: number): EventRecord => ({ exchangeId, seq, type: 'act', seat: 'east', payload: JSON.stringify({ type: 'vote', stop: false }), userId: null, createdAt: new Date().toISOString() });

async function exchange(): Promise<string> {
  const host = (await User.findOne()) ?? (await User.create({ email: 'ines@harborlane.test', displayName: 'Ines', role: 'teacher', passwordHash: 'x' }));
  const seats = { east: null, south: null, west: null, north: null };
  const table = await TableRow.create({ id: randomUUID(), name: 'Tuesday table', hostId: host.id, hostName: 'Ines', private: false, inviteCode: null, options: {}, status: 'playing', seats, currentExchangeId: null } as never);
  const row = await ExchangeRow.create({ id: randomUUID(), tableId: table.id, tableName: 'Tuesday table', hostId: host.id, options: { seed: 's' }, seats, participants: ',', status: 'playing', startedAt: new Date(), finishedAt: null } as never);
  return row.id;
}

const seqs = async (exchangeId: string) => (await ExchangeEventRow.findAll({ where: { exchangeId }, order: [['seq', 'ASC']] })).map((e) => e.seq);

describe.each(Object.keys(databases) as (keyof typeof databases)[])('the event writer on %s', (kind) => {
  const skip = kind === 'PostgreSQL' && !postgresAvailable();
  let db: Sequelize;
  let writer: EventWriter;

  beforeAll(async () => {
    // Started once for this block (initdb takes a few seconds), not inside the first test's time.
    if (kind === 'PostgreSQL' && !skip) postgres ??= await startPostgres();
  }, 60_000);

  afterEach(async () => {
    await writer?.close();
    await db?.close();
  });

  async function open() {
    db = await openDatabase(await databases[kind]());
    await migrate(db);
    writer = createEventWriter(db);
  }

  // PostgreSQL comes from Debian's postgresql package (as in processes.test.ts); without it this block cannot run.
  test.skipIf(skip)('events appended in one turn are written as one group, each exchange in order', async () => {
    await open();
    const [a, b] = [await exchange(), await exchange()];
    const order: string[] = [];
    const append = (exchangeId: string, seq: number) => {
      const name = `${exchangeId === a ? 'a' : 'b'}${seq}`;
      return writer.append(event(exchangeId, seq), { stored: () => order.push(`stored ${name}`) }).then(() => order.push(`settled ${name}`));
    };
    await Promise.all([append(b, 0), append(a, 0), append(a, 1), append(b, 1), append(a, 2)]);
    // One group: every stored hook ran before any promise settled.
    expect(order.slice(0, 5).every((step) => step.startsWith('stored'))).toBe(true);
    expect(order.slice(5).every((step) => step.startsWith('settled'))).toBe(true);
    expect(await seqs(a)).toEqual([0, 1, 2]);
    expect(await seqs(b)).toEqual([0, 1]);
    // An acknowledgement comes after the commit: the event can be read back at once, elsewhere, as it was sent.
    const last = { ...event(a, 3), seat: null, userId: (await User.findOne())!.id, createdAt: '2026-03-04T05:06:07.890Z' };
    await writer.append(last);
    expect(await seqs(a)).toEqual([0, 1, 2, 3]);
    const row = (await ExchangeEventRow.findOne({ where: { exchangeId: a, seq: 3 } }))!;
    expect([row.type, row.seat, row.userId]).toEqual(['act', null, last.userId]);
    // The time goes in as the text it was given (read raw: a model reads SQLite dates in Sequelize's own form).
    const [stored] = await db.query<{ at: string | Date }>('SELECT "createdAt" AS at FROM "ExchangeEvents" WHERE "exchangeId" = $1 AND seq = 3', { bind: [a], type: QueryTypes.SELECT });
    expect(new Date(stored.at).toISOString()).toBe(last.createdAt);
    expect(typeof row.payload === 'string' ? JSON.parse(row.payload) : row.payload).toEqual({ type: 'vote', stop: false });
  });

  test.skipIf(skip)('a taken place is reported as a conflict; that group writes nothing of that exchange from there on, and the others go on', async () => {
    await open();
    const [a, b] = [await exchange(), await exchange()];
    // As if another process had stored event 1 of exchange b first.
    await ExchangeEventRow.create({ exchangeId: b, seq: 1, type: 'resolve', seat: null, payload: null, userId: null });
    const results = await Promise.allSettled([writer.append(event(b, 1)), writer.append(event(a, 0)), writer.append(event(b, 2)), writer.append(event(a, 1))]);
    expect(results.map((r) => r.status)).toEqual(['rejected', 'fulfilled', 'rejected', 'fulfilled']);
    const [taken, , later] = results as PromiseRejectedResult[];
    expect(taken.reason).toBeInstanceOf(EventNotStored);
    expect(taken.reason.conflict).toBe(true);
    expect(taken.reason.message).toMatch(/already taken/);
    expect(later.reason.conflict).toBe(true);
    expect(later.reason.message).toMatch(/earlier event of this exchange/);
    expect(await seqs(a)).toEqual([0, 1]);
    expect((await ExchangeEventRow.findAll({ where: { exchangeId: b } })).map((e) => [e.seq, e.type])).toEqual([[1, 'resolve']]);
    // A group that clashes at its first event writes nothing at all.
    const alone = await Promise.allSettled([writer.append(event(b, 1)), writer.append(event(b, 2))]);
    expect(alone.map((r) => r.status)).toEqual(['rejected', 'rejected']);
    expect(await seqs(b)).toEqual([1]);
    // The writer goes on after a clash.
    await writer.append(event(b, 2));
    expect(await seqs(b)).toEqual([1, 2]);
  });

  test.skipIf(skip)('close writes everything appended before it, then refuses', async () => {
    await open();
    const a = await exchange();
    const pending = [0, 1, 2].map((seq) => writer.append(event(a, seq)));
    await writer.close();
    await Promise.all(pending);
    expect(await seqs(a)).toEqual([0, 1, 2]);
    await expect(writer.append(event(a, 3))).rejects.toThrow(/closed/);
  });

  test.skipIf(kind !== 'PostgreSQL' || skip)('a connection the server cut is thrown away and the next group connects afresh', async () => {
    await open();
    const a = await exchange();
    await writer.append(event(a, 0));
    // The writer's connection names itself, so only it is cut (the app's own pool stays).
    const [cut] = await db.query("SELECT pg_terminate_backend(pid) AS cut FROM pg_stat_activity WHERE application_name = 'rackside event log' AND datname = current_database()");
    expect(cut).toEqual([{ cut: true }]);
    // Whether the cut reached the writer's idle connection before this group depends on the network;
    // either way the event is stored or refused as not a conflict, and a second try is stored.
    const first = await writer.append(event(a, 1)).then(
      () => null,
      (err: unknown) => err,
    );
    if (first) {
      expect(first).toBeInstanceOf(EventNotStored);
      expect((first as EventNotStored).conflict).toBe(false);
      await writer.append(event(a, 1));
    }
    expect(await seqs(a)).toEqual([0, 1]);
  });
});

import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, expect, test } from 'vitest';
import { openDatabase } from '../../server/db';
import { migrate, migrator } from '../../server/db/migrate';
import { User } from '../../server/db/models';
import { DEMO_USERS, seedDemo } from '../../server/db/seed';
import type { Sequelize } from 'sequelize';

let dir: string | undefined;
let db: Sequelize | undefined;
afterEach(async () => {
  await db?.close();
  if (dir) rmSync(dir, { recursive: true, force: true });
  db = dir = undefined;
});

test('a file database is created with its folder, in WAL mode, with a busy timeout', async () => {
  dir = mkdtempSync(join(tmpdir(), 'rackside-db-'));
  db = await openDatabase(`sqlite:${join(dir, 'nested', 'rackside.sqlite')}`);
  const [[mode]] = (await db.query('PRAGMA journal_mode;')) as [{ journal_mode: string }[], unknown];
  expect(mode.journal_mode).toBe('wal');
  const [[timeout]] = (await db.query('PRAGMA busy_timeout;')) as [Record<string, number>[], unknown];
  expect(Object.values(timeout)[0]).toBe(5000);
  // A transaction runs on a connection of its own; it gets the same settings.
  const inTransaction = await db.transaction(async (transaction) => (await db!.query('PRAGMA busy_timeout;', { transaction }))[0] as Record<string, number>[]);
  expect(Object.values(inTransaction[0])[0]).toBe(5000);
  const [[sync]] = (await db.query('PRAGMA synchronous;')) as [Record<string, number>[], unknown];
  expect(Object.values(sync)[0]).toBe(1); // 1 = NORMAL in SQLite's PRAGMA synchronous numbering
});

test('migrations run once and record themselves', async () => {
  db = await openDatabase('sqlite::memory:');
  await migrate(db);
  await migrate(db);
  const executed = await migrator(db).executed();
  const names = executed.map((m) => m.name);
  expect(names).toEqual(expect.arrayContaining(['0001-users-and-sessions', '0002-tables-and-exchanges', '0005-audit-log']));
  expect(names).toEqual([...names].sort());
  expect(new Set(names).size).toBe(names.length);
  expect(await migrator(db).pending()).toEqual([]);
  const tables = await db.getQueryInterface().showAllTables();
  expect(tables).toEqual(expect.arrayContaining(['Users', 'Sessions']));
});

test('the demo seeds every role on an empty database, and only then', async () => {
  db = await openDatabase('sqlite::memory:');
  await migrate(db);
  expect(await seedDemo(4)).toBe(true);
  expect(await seedDemo(4)).toBe(false);
  const users = await User.findAll();
  expect(users).toHaveLength(DEMO_USERS.length);
  expect(new Set(users.map((u) => u.role))).toEqual(new Set(['player', 'teacher', 'admin']));
  expect(users.every((u) => u.email.endsWith('.test'))).toBe(true);
});

test('an unsupported DATABASE_URL is refused with a clear message', async () => {
  await expect(openDatabase('mysql://somewhere/db')).rejects.toThrow(/Unsupported DATABASE_URL/);
});

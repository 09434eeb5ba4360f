import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { Sequelize } from 'sequelize';
import { initModels } from './models';

/** Opens the database named by a URL: `sqlite:path/to/file.sqlite` or `sqlite::memory:`. */
export async function openDatabase(databaseUrl: string): Promise<Sequelize> {
  if (!databaseUrl.startsWith('sqlite:')) {
    throw new Error(`Unsupported DATABASE_URL "${databaseUrl}": Rackside speaks SQLite ("sqlite:path" or "sqlite::memory:").`);
  }
  const storage = databaseUrl.slice('sqlite:'.length) || ':memory:';
  const inMemory = storage === ':memory:';
  if (!inMemory) mkdirSync(dirname(storage), { recursive: true });
  const sequelize = new Sequelize({ dialect: 'sqlite', storage, logging: false });
  // WAL lets readers go on while a write commits; busy_timeout makes a locked write wait instead of failing at once.
  if (!inMemory) await sequelize.query('PRAGMA journal_mode = WAL;');
  await sequelize.query('PRAGMA busy_timeout = 5000;');
  await sequelize.query('PRAGMA foreign_keys = ON;');
  initModels(sequelize);
  return sequelize;
}

import type { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import * as m0001 from './migrations/0001-users-and-sessions';
import * as m0002 from './migrations/0002-tables-and-exchanges';
import * as m0003 from './migrations/0003-drills-and-pattern-lists';
import * as m0004 from './migrations/0004-lessons-mail-payments';
import * as m0005 from './migrations/0005-audit-log';
import * as m0006 from './migrations/0006-table-revision';
import * as m0007 from './migrations/0007-payment-refund-reason';
import * as m0008 from './migrations/0008-pattern-value-sealed';

const MIGRATIONS = [m0001, m0002, m0003, m0004, m0005, m0006, m0007, m0008].sort((a, b) => a.name.localeCompare(b.name));

export function migrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: MIGRATIONS.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize }),
    logger: undefined,
  });
}

export async function migrate(sequelize: Sequelize) {
  await migrator(sequelize).up();
}

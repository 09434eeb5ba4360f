import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0006-table-revision';

/**
 * A revision number on each table row, raised by every save and checked by it (Sequelize's
 * optimistic locking): when several processes serve one table, a save made from an out-of-date
 * copy of the row is refused instead of overwriting a newer one.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('Tables', 'revision', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('Tables', 'revision');
}

import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0002-tables-and-exchanges';

const timestamps = { createdAt: { type: DataTypes.DATE, allowNull: false }, updatedAt: { type: DataTypes.DATE, allowNull: false } };

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('Tables', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    name: { type: DataTypes.STRING(80), allowNull: false },
    hostId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Users', key: 'id' } },
    hostName: { type: DataTypes.STRING(60), allowNull: false },
    private: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    inviteCode: { type: DataTypes.STRING(32), allowNull: true },
    options: { type: DataTypes.JSON, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'lobby' },
    seats: { type: DataTypes.JSON, allowNull: false },
    currentExchangeId: { type: DataTypes.STRING(36), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('Tables', ['status']);
  await qi.createTable('Exchanges', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    tableId: { type: DataTypes.STRING(36), allowNull: false, references: { model: 'Tables', key: 'id' } },
    tableName: { type: DataTypes.STRING(80), allowNull: false },
    hostId: { type: DataTypes.INTEGER, allowNull: false },
    options: { type: DataTypes.JSON, allowNull: false },
    seats: { type: DataTypes.JSON, allowNull: false },
    participants: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false },
    startedAt: { type: DataTypes.DATE, allowNull: false },
    finishedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('Exchanges', ['tableId']);
  await qi.createTable('ExchangeEvents', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    exchangeId: { type: DataTypes.STRING(36), allowNull: false, references: { model: 'Exchanges', key: 'id' } },
    seq: { type: DataTypes.INTEGER, allowNull: false },
    type: { type: DataTypes.STRING(24), allowNull: false },
    seat: { type: DataTypes.STRING(8), allowNull: true },
    payload: { type: DataTypes.JSON, allowNull: true },
    userId: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  // One event per position in an exchange's log: a second writer at the same position fails.
  await qi.addIndex('ExchangeEvents', ['exchangeId', 'seq'], { unique: true });
  await qi.createTable('HuddleNotes', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    exchangeId: { type: DataTypes.STRING(36), allowNull: false, references: { model: 'Exchanges', key: 'id' } },
    passIndex: { type: DataTypes.INTEGER, allowNull: false },
    phase: { type: DataTypes.STRING(24), allowNull: false },
    seat: { type: DataTypes.STRING(8), allowNull: true },
    authorId: { type: DataTypes.INTEGER, allowNull: false },
    authorName: { type: DataTypes.STRING(60), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('HuddleNotes', ['exchangeId']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('HuddleNotes');
  await qi.dropTable('ExchangeEvents');
  await qi.dropTable('Exchanges');
  await qi.dropTable('Tables');
}

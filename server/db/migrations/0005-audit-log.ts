import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0005-audit-log';

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('AuditEntries', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    actorId: { type: DataTypes.INTEGER, allowNull: false },
    action: { type: DataTypes.STRING(40), allowNull: false },
    targetUserId: { type: DataTypes.INTEGER, allowNull: true },
    details: { type: DataTypes.JSON, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('AuditEntries', ['targetUserId']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('AuditEntries');
}

import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0001-users-and-sessions';

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('Users', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    displayName: { type: DataTypes.STRING(60), allowNull: false },
    passwordHash: { type: DataTypes.STRING(100), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'player' },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  // The session store's own table (connect-session-sequelize's default model).
  await qi.createTable('Sessions', {
    sid: { type: DataTypes.STRING(36), primaryKey: true },
    expires: { type: DataTypes.DATE },
    data: { type: DataTypes.TEXT },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('Sessions');
  await qi.dropTable('Users');
}

import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0003-drills-and-pattern-lists';

const timestamps = { createdAt: { type: DataTypes.DATE, allowNull: false }, updatedAt: { type: DataTypes.DATE, allowNull: false } };

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('PatternLists', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    ownerId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Users', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(80), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    patterns: { type: DataTypes.JSON, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('PatternLists', ['ownerId']);
  await qi.createTable('Drills', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    ownerId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Users', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(80), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    seed: { type: DataTypes.STRING(120), allowNull: false },
    jokers: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    secondCharleston: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    courtesy: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    racks: { type: DataTypes.JSON, allowNull: false },
    // "starter" or a PatternLists id; no foreign key, since the starter list is not a row.
    patternListId: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'starter' },
    ...timestamps,
  });
  await qi.addIndex('Drills', ['ownerId']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('Drills');
  await qi.dropTable('PatternLists');
}

import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0004-lessons-mail-payments';

const timestamps = { createdAt: { type: DataTypes.DATE, allowNull: false }, updatedAt: { type: DataTypes.DATE, allowNull: false } };

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('Lessons', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    teacherId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Users', key: 'id' } },
    title: { type: DataTypes.STRING(100), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    startsAt: { type: DataTypes.DATE, allowNull: false },
    timeZone: { type: DataTypes.STRING(64), allowNull: false },
    durationMinutes: { type: DataTypes.INTEGER, allowNull: false },
    seats: { type: DataTypes.INTEGER, allowNull: false },
    priceCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'usd' },
    drillIds: { type: DataTypes.JSON, allowNull: false },
    seed: { type: DataTypes.STRING(120), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('Lessons', ['teacherId']);
  await qi.createTable('Enrollments', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    lessonId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Lessons', key: 'id' } },
    userId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Users', key: 'id' } },
    status: { type: DataTypes.STRING(16), allowNull: false },
    ...timestamps,
  });
  // One place per student per lesson, however often they accept or pay.
  await qi.addIndex('Enrollments', ['lessonId', 'userId'], { unique: true });
  await qi.addIndex('Enrollments', ['userId']);
  await qi.createTable('Invitations', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    lessonId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Lessons', key: 'id' } },
    email: { type: DataTypes.STRING(254), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    usedBy: { type: DataTypes.INTEGER, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('Invitations', ['lessonId']);
  await qi.createTable('LessonTables', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    lessonId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Lessons', key: 'id' } },
    tableId: { type: DataTypes.STRING(36), allowNull: false, unique: true, references: { model: 'Tables', key: 'id' } },
    index: { type: DataTypes.INTEGER, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('LessonTables', ['lessonId']);
  await qi.createTable('Payments', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    lessonId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Lessons', key: 'id' } },
    userId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Users', key: 'id' } },
    checkoutSessionId: { type: DataTypes.STRING(255), allowNull: true, unique: true },
    checkoutUrl: { type: DataTypes.STRING(2000), allowNull: true },
    paymentIntentId: { type: DataTypes.STRING(255), allowNull: true },
    status: { type: DataTypes.STRING(16), allowNull: false },
    amountCents: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    holdUntil: { type: DataTypes.DATE, allowNull: false },
    paidAt: { type: DataTypes.DATE, allowNull: true },
    refundedAt: { type: DataTypes.DATE, allowNull: true },
    refundId: { type: DataTypes.STRING(255), allowNull: true },
    note: { type: DataTypes.STRING(300), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('Payments', ['lessonId', 'status']);
  await qi.addIndex('Payments', ['userId']);
  // Each webhook event is handled once: a repeat of the same event id fails this index.
  await qi.createTable('PaymentEvents', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    eventId: { type: DataTypes.STRING(255), allowNull: false, unique: true },
    type: { type: DataTypes.STRING(80), allowNull: false },
    paymentId: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'Payments', key: 'id' } },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('Mails', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    messageId: { type: DataTypes.STRING(255), allowNull: true },
    to: { type: DataTypes.STRING(2000), allowNull: false },
    from: { type: DataTypes.STRING(400), allowNull: false },
    subject: { type: DataTypes.STRING(400), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: true },
    kind: { type: DataTypes.STRING(32), allowNull: true },
    senderId: { type: DataTypes.INTEGER, allowNull: true },
    receivedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('Mails', ['senderId']);
  await qi.createTable('PasswordResets', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'Users', key: 'id' } },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('PasswordResets', ['userId']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['PasswordResets', 'Mails', 'PaymentEvents', 'Payments', 'LessonTables', 'Invitations', 'Enrollments', 'Lessons']) {
    await qi.dropTable(table);
  }
}

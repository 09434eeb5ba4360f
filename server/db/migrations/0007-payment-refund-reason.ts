import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

export const name = '0007-payment-refund-reason';

/**
 * Why a payment is refunded (`lesson-full`, `already-paid`), so its receipt and mail say so; and
 * at most one paid payment per student and lesson, kept by the database itself. Seats found paid
 * twice before this index existed keep their first payment; the later ones become `refund-due`,
 * for an organiser to refund by hand.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('Payments', 'refundReason', { type: DataTypes.STRING(16), allowNull: true });
  const paid = await qi.sequelize.query<{ id: number; lessonId: number; userId: number }>(
    `SELECT "id", "lessonId", "userId" FROM "Payments" WHERE "status" = 'paid' ORDER BY "paidAt" ASC, "id" ASC`,
    { type: QueryTypes.SELECT },
  );
  const kept = new Set<string>();
  for (const row of paid) {
    const seat = `${row.lessonId}:${row.userId}`;
    if (!kept.has(seat)) {
      kept.add(seat);
      continue;
    }
    await qi.sequelize.query(
      `UPDATE "Payments" SET "status" = 'refund-due', "refundReason" = 'already-paid', "note" = 'This seat was paid twice before Rackside refused it; refund this payment by hand.' WHERE "id" = :id`,
      { replacements: { id: row.id } },
    );
  }
  await qi.addIndex('Payments', ['lessonId', 'userId'], { unique: true, where: { status: 'paid' }, name: 'payments_one_paid_seat' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex('Payments', 'payments_one_paid_seat');
  await qi.removeColumn('Payments', 'refundReason');
}

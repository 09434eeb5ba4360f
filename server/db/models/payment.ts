import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Currency, PaymentStatus } from '../../../shared/lessons';

/** `lesson-full`: the last seat went to someone else first; `already-paid`: the student's seat was already paid. */
export type RefundReason = 'lesson-full' | 'already-paid';

/**
 * One attempt to pay for a seat. While `pending` and before `holdUntil` it holds a seat, so a
 * lesson never sells more checkouts than it has seats; only a verified webhook makes it `paid`,
 * and at most one payment per student and lesson is ever `paid` (a unique index where status is paid).
 */
export class Payment extends Model<InferAttributes<Payment>, InferCreationAttributes<Payment>> {
  declare id: CreationOptional<number>;
  declare lessonId: number;
  declare userId: number;
  declare checkoutSessionId: CreationOptional<string | null>;
  declare checkoutUrl: CreationOptional<string | null>;
  declare paymentIntentId: CreationOptional<string | null>;
  declare status: PaymentStatus;
  declare amountCents: number;
  declare currency: Currency;
  declare holdUntil: Date;
  declare paidAt: CreationOptional<Date | null>;
  declare refundedAt: CreationOptional<Date | null>;
  declare refundId: CreationOptional<string | null>;
  /** Why it was (or is to be) refunded. */
  declare refundReason: CreationOptional<RefundReason | null>;
  declare note: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** A webhook event already handled: its id is unique, so a repeated delivery changes nothing. */
export class PaymentEvent extends Model<InferAttributes<PaymentEvent>, InferCreationAttributes<PaymentEvent>> {
  declare id: CreationOptional<number>;
  declare eventId: string;
  declare type: string;
  declare paymentId: number | null;
  declare createdAt: CreationOptional<Date>;
}

export function initPayments(sequelize: Sequelize) {
  Payment.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      lessonId: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      checkoutSessionId: { type: DataTypes.STRING(255), allowNull: true },
      checkoutUrl: { type: DataTypes.STRING(2000), allowNull: true },
      paymentIntentId: { type: DataTypes.STRING(255), allowNull: true },
      status: { type: DataTypes.STRING(16), allowNull: false },
      amountCents: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      holdUntil: { type: DataTypes.DATE, allowNull: false },
      paidAt: { type: DataTypes.DATE, allowNull: true },
      refundedAt: { type: DataTypes.DATE, allowNull: true },
      refundId: { type: DataTypes.STRING(255), allowNull: true },
      refundReason: { type: DataTypes.STRING(16), allowNull: true },
      note: { type: DataTypes.STRING(300), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'Payments' },
  );
  PaymentEvent.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      eventId: { type: DataTypes.STRING(255), allowNull: false },
      type: { type: DataTypes.STRING(80), allowNull: false },
      paymentId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'PaymentEvents', updatedAt: false },
  );
}

import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A message the local SMTP fake received: the outbox that admins and teachers read in development. */
export class Mail extends Model<InferAttributes<Mail>, InferCreationAttributes<Mail>> {
  declare id: CreationOptional<number>;
  declare messageId: string | null;
  declare to: string;
  declare from: string;
  declare subject: string;
  declare text: string;
  declare html: string | null;
  /** From the X-Rackside-Kind header: invitation, password-reset, receipt, refund. */
  declare kind: string | null;
  /** From the X-Rackside-Sender header: the teacher whose action sent it, if any. */
  declare senderId: number | null;
  declare receivedAt: Date;
}

/** A password-reset link: only a hash of its token is kept; it expires and works once. */
export class PasswordReset extends Model<InferAttributes<PasswordReset>, InferCreationAttributes<PasswordReset>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMail(sequelize: Sequelize) {
  Mail.init(
    {
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
    },
    { sequelize, tableName: 'Mails', timestamps: false },
  );
  PasswordReset.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'PasswordResets' },
  );
}

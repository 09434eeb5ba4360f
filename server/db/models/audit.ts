import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A record of an admin's change to someone's account. Written, never edited. */
export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare actorId: number;
  declare action: string;
  declare targetUserId: number | null;
  declare details: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;
}

export function initAudit(sequelize: Sequelize) {
  AuditEntry.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      actorId: { type: DataTypes.INTEGER, allowNull: false },
      action: { type: DataTypes.STRING(40), allowNull: false },
      targetUserId: { type: DataTypes.INTEGER, allowNull: true },
      details: { type: DataTypes.JSON, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'AuditEntries', updatedAt: false },
  );
}

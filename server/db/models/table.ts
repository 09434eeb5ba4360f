import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Seat } from '../../../shared/seats';
import type { TableOptions, TableStatus } from '../../../shared/protocol';
import type { TileKind } from '../../../shared/tiles';

/** Who sits in a seat, as stored: a user or a bot. */
/** A bot may stand in for a player who left mid-exchange; that player can take the seat back. */
export type StandIn = { userId: number; displayName: string };
export type StoredOccupant = { kind: 'user'; userId: number; displayName: string } | { kind: 'bot'; strategy: string; displayName: string; standsInFor?: StandIn };
export type StoredSeats = Record<Seat, StoredOccupant | null>;
/** Options as stored: a drill's preset racks are kept here and never leave the server. */
export type StoredTableOptions = TableOptions & {
  racks?: Partial<Record<Seat, TileKind[]>>;
  /** Where the table's seed name holds (`lesson:<id>`, `drill:<id>`; absent: the table alone). Never shown. */
  dealScope?: string;
};

export class TableRow extends Model<InferAttributes<TableRow>, InferCreationAttributes<TableRow>> {
  declare id: string;
  declare name: string;
  declare hostId: number;
  declare hostName: string;
  declare private: boolean;
  declare inviteCode: string | null;
  declare options: StoredTableOptions;
  declare status: TableStatus;
  declare seats: StoredSeats;
  declare currentExchangeId: string | null;
  /** Raised by every save; a save from an out-of-date copy is refused (see migration 0006). */
  declare revision: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initTable(sequelize: Sequelize) {
  TableRow.init(
    {
      id: { type: DataTypes.STRING(36), primaryKey: true },
      name: { type: DataTypes.STRING(80), allowNull: false },
      hostId: { type: DataTypes.INTEGER, allowNull: false },
      hostName: { type: DataTypes.STRING(60), allowNull: false },
      private: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      inviteCode: { type: DataTypes.STRING(32), allowNull: true },
      options: { type: DataTypes.JSON, allowNull: false },
      status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'lobby' },
      seats: { type: DataTypes.JSON, allowNull: false },
      currentExchangeId: { type: DataTypes.STRING(36), allowNull: true },
      revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'Tables', version: 'revision' },
  );
}

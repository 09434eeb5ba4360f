import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { ExchangeOptions } from '../../../shared/exchange/types';
import type { StoredSeats } from './table';

/** The engine's options, and the seed name the host gave (the engine's seed is derived from it). */
export type StoredExchangeOptions = ExchangeOptions & { seedName?: string | null };

export class ExchangeRow extends Model<InferAttributes<ExchangeRow>, InferCreationAttributes<ExchangeRow>> {
  declare id: string;
  declare tableId: string;
  declare tableName: string;
  declare hostId: number;
  /** The engine's options, seed included: with the event log, the whole exchange. */
  declare options: StoredExchangeOptions;
  /** Who sat where when it started. */
  declare seats: StoredSeats;
  /** User ids of the seated people as ",3,7,", so "my exchanges" is one indexed LIKE. */
  declare participants: string;
  declare status: 'playing' | 'done';
  declare startedAt: Date;
  declare finishedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** One stored step of an exchange: an engine action, a resolve, or a huddle step. */
export type EventType = 'act' | 'resolve' | 'huddle-call' | 'huddle-reveal' | 'huddle-release';

export class ExchangeEventRow extends Model<InferAttributes<ExchangeEventRow>, InferCreationAttributes<ExchangeEventRow>> {
  declare id: CreationOptional<number>;
  declare exchangeId: string;
  declare seq: number;
  declare type: EventType;
  declare seat: string | null;
  declare payload: unknown;
  declare userId: number | null;
  declare createdAt: CreationOptional<Date>;
}

export class HuddleNoteRow extends Model<InferAttributes<HuddleNoteRow>, InferCreationAttributes<HuddleNoteRow>> {
  declare id: CreationOptional<number>;
  declare exchangeId: string;
  declare passIndex: number;
  declare phase: string;
  declare seat: string | null;
  declare authorId: number;
  declare authorName: string;
  declare text: string;
  declare createdAt: CreationOptional<Date>;
}

export function initExchange(sequelize: Sequelize) {
  ExchangeRow.init(
    {
      id: { type: DataTypes.STRING(36), primaryKey: true },
      tableId: { type: DataTypes.STRING(36), allowNull: false },
      tableName: { type: DataTypes.STRING(80), allowNull: false },
      hostId: { type: DataTypes.INTEGER, allowNull: false },
      options: { type: DataTypes.JSON, allowNull: false },
      seats: { type: DataTypes.JSON, allowNull: false },
      participants: { type: DataTypes.STRING(200), allowNull: false },
      status: { type: DataTypes.STRING(16), allowNull: false },
      startedAt: { type: DataTypes.DATE, allowNull: false },
      finishedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'Exchanges' },
  );
  ExchangeEventRow.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exchangeId: { type: DataTypes.STRING(36), allowNull: false },
      seq: { type: DataTypes.INTEGER, allowNull: false },
      type: { type: DataTypes.STRING(24), allowNull: false },
      seat: { type: DataTypes.STRING(8), allowNull: true },
      payload: { type: DataTypes.JSON, allowNull: true },
      userId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'ExchangeEvents', updatedAt: false },
  );
  HuddleNoteRow.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exchangeId: { type: DataTypes.STRING(36), allowNull: false },
      passIndex: { type: DataTypes.INTEGER, allowNull: false },
      phase: { type: DataTypes.STRING(24), allowNull: false },
      seat: { type: DataTypes.STRING(8), allowNull: true },
      authorId: { type: DataTypes.INTEGER, allowNull: false },
      authorName: { type: DataTypes.STRING(60), allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'HuddleNotes', updatedAt: false },
  );
}

export const participantsKey = (ids: number[]) => `,${ids.join(',')},`;
export const isParticipant = (row: Pick<ExchangeRow, 'participants'>, userId: number) => row.participants.includes(`,${userId},`);

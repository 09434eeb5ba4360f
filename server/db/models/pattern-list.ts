import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Pattern } from '../../../shared/analysis/pattern';

/** A teacher's own pattern list. The starter list is never stored: it is served from shared/. */
export class PatternListRow extends Model<InferAttributes<PatternListRow>, InferCreationAttributes<PatternListRow>> {
  declare id: string;
  declare ownerId: number;
  declare name: string;
  declare description: string;
  /** Every pattern was checked by the analysis schema before it was stored. */
  declare patterns: Pattern[];
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initPatternList(sequelize: Sequelize) {
  PatternListRow.init(
    {
      id: { type: DataTypes.STRING(36), primaryKey: true },
      ownerId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(80), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      patterns: { type: DataTypes.JSON, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'PatternLists' },
  );
}

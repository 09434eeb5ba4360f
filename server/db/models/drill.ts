import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { PresetRacks } from '../../../shared/drills';

/** A saved deal: a seed, preset racks per seat, which parts of the Charleston run, and the pattern list to judge by. */
export class DrillRow extends Model<InferAttributes<DrillRow>, InferCreationAttributes<DrillRow>> {
  declare id: string;
  declare ownerId: number;
  declare name: string;
  declare description: string;
  declare seed: string;
  declare jokers: boolean;
  declare secondCharleston: boolean;
  declare courtesy: boolean;
  /** Tile kinds per seat; the engine deals the rest of each rack from what remains. */
  declare racks: PresetRacks;
  /** "starter" or the id of one of the owner's pattern lists. */
  declare patternListId: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initDrill(sequelize: Sequelize) {
  DrillRow.init(
    {
      id: { type: DataTypes.STRING(36), primaryKey: true },
      ownerId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(80), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      seed: { type: DataTypes.STRING(120), allowNull: false },
      jokers: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      secondCharleston: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      courtesy: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      racks: { type: DataTypes.JSON, allowNull: false },
      patternListId: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'starter' },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'Drills' },
  );
}

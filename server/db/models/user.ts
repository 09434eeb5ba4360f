import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const ROLES = ['player', 'teacher', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare displayName: string;
  declare passwordHash: string;
  declare role: CreationOptional<Role>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  toPublic() {
    return { id: this.id, email: this.email, displayName: this.displayName, role: this.role, createdAt: this.createdAt };
  }
}

export function initUser(sequelize: Sequelize) {
  User.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      displayName: { type: DataTypes.STRING(60), allowNull: false },
      passwordHash: { type: DataTypes.STRING(100), allowNull: false },
      role: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'player' },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'Users' },
  );
}

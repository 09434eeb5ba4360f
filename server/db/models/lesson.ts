import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Currency, EnrollmentStatus } from '../../../shared/lessons';

/** A scheduled lesson: a start (UTC, shown in its own time zone), a length, seats, a price, and the deal to play. */
export class Lesson extends Model<InferAttributes<Lesson>, InferCreationAttributes<Lesson>> {
  declare id: CreationOptional<number>;
  declare teacherId: number;
  declare title: string;
  declare description: string;
  declare startsAt: Date;
  declare timeZone: string;
  declare durationMinutes: number;
  declare seats: number;
  /** 0 for a free lesson. */
  declare priceCents: number;
  declare currency: Currency;
  declare drillIds: string[];
  declare seed: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/**
 * A student's place in a lesson. `invited`: an invitation went to their address; `enrolled`: they
 * accepted (in a free lesson this holds a seat; in a priced one the seat is held once paid);
 * `paid`: the payment service confirmed their payment.
 */
export class Enrollment extends Model<InferAttributes<Enrollment>, InferCreationAttributes<Enrollment>> {
  declare id: CreationOptional<number>;
  declare lessonId: number;
  declare userId: number;
  declare status: EnrollmentStatus;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** An e-mailed invitation. Only a hash of its token is kept; the link itself is signed and expires. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare lessonId: number;
  declare email: string;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare usedBy: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** A table of a lesson's room, in the order the teacher split them. */
export class LessonTable extends Model<InferAttributes<LessonTable>, InferCreationAttributes<LessonTable>> {
  declare id: CreationOptional<number>;
  declare lessonId: number;
  declare tableId: string;
  declare index: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initLessons(sequelize: Sequelize) {
  const stamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE };
  Lesson.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      teacherId: { type: DataTypes.INTEGER, allowNull: false },
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
      ...stamps,
    },
    { sequelize, tableName: 'Lessons' },
  );
  Enrollment.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      lessonId: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      status: { type: DataTypes.STRING(16), allowNull: false },
      ...stamps,
    },
    { sequelize, tableName: 'Enrollments' },
  );
  Invitation.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      lessonId: { type: DataTypes.INTEGER, allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      usedBy: { type: DataTypes.INTEGER, allowNull: true },
      ...stamps,
    },
    { sequelize, tableName: 'Invitations' },
  );
  LessonTable.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      lessonId: { type: DataTypes.INTEGER, allowNull: false },
      tableId: { type: DataTypes.STRING(36), allowNull: false },
      index: { type: DataTypes.INTEGER, allowNull: false },
      ...stamps,
    },
    { sequelize, tableName: 'LessonTables' },
  );
}

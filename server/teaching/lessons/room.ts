/**
 * The lesson room: the students who hold a seat, split over tables of four, bots in the empty
 * seats, every table dealt the same drill or seed, and the teacher hosting each one (so they can
 * call a huddle at any of them).
 */
import { randomBytes, randomUUID } from 'node:crypto';
import { Op, type Sequelize } from 'sequelize';
import { BOT_STRATEGIES } from '../../../shared/analysis/bots';
import type { RoomTableDto } from '../../../shared/lessons';
import { TABLE_LIMITS } from '../../../shared/protocol';
import { SEATS, seatOfUser, type Seat } from '../../../shared/seats';
import { DrillRow, Enrollment, LessonTable, TableRow, User, type Lesson, type StoredSeats, type StoredTableOptions } from '../../db/models';
import { HttpError } from '../../errors';
import type { TableRegistry } from '../../realtime/registry';
import { defaultTableOptions, TableError, type TableMaster } from '../../realtime/table-master';
import { drillTableOptions } from '../drills/service';
import { seatedStatuses } from './seats';

const PER_TABLE = SEATS.length;

/** Students dealt round the tables in turn, so table sizes differ by at most one. */
function splitIntoTables<T>(students: T[], tables: number): T[][] {
  const out: T[][] = Array.from({ length: tables }, () => []);
  students.forEach((s, i) => out[i % tables].push(s));
  return out;
}

async function dealFor(lesson: Lesson, drillId: string | undefined, holdEveryPass: boolean): Promise<StoredTableOptions> {
  // Every table of the lesson deals the same deal from the lesson's seed (see services/deal-seed.ts).
  const options: StoredTableOptions = { ...defaultTableOptions({ seed: lesson.seed ?? undefined, huddleEveryPass: holdEveryPass }), dealScope: `lesson:${lesson.id}` };
  const id = drillId ?? lesson.drillIds[0];
  if (!id) return options;
  delete options.dealScope;
  if (!lesson.drillIds.includes(id)) throw new HttpError(400, 'BAD_INPUT', 'Some fields need another look.', { drillId: 'Pick one of the drills this lesson plays.' });
  const drill = await DrillRow.findByPk(id);
  if (!drill) throw new HttpError(409, 'DRILL_GONE', 'A drill of this lesson no longer exists. Edit the lesson or name a seed.');
  return Object.assign(options, drillTableOptions(drill));
}

export async function createRoom(
  sequelize: Sequelize,
  lesson: Lesson,
  teacher: User,
  input: { tables?: number; bot: string; drillId?: string; holdEveryPass: boolean },
): Promise<void> {
  if (await LessonTable.count({ where: { lessonId: lesson.id } })) {
    throw new HttpError(409, 'ROOM_EXISTS', 'The tables for this lesson are already set. Open them below.');
  }
  const enrollments = await Enrollment.findAll({ where: { lessonId: lesson.id, status: { [Op.in]: seatedStatuses(lesson) } }, order: [['id', 'ASC']] });
  if (!enrollments.length) {
    throw new HttpError(409, 'NO_STUDENTS', lesson.priceCents ? 'No student has paid for a seat yet, so there is nobody to seat.' : 'No student has accepted yet, so there is nobody to seat.');
  }
  const users = await User.findAll({ where: { id: { [Op.in]: enrollments.map((e) => e.userId) } } });
  const students = enrollments.map((e) => users.find((u) => u.id === e.userId)!).filter(Boolean);
  const least = Math.ceil(students.length / PER_TABLE);
  const count = input.tables ?? least;
  if (count < least) {
    throw new HttpError(400, 'BAD_INPUT', 'Some fields need another look.', { tables: `${students.length} students need at least ${least} tables of ${PER_TABLE}.` });
  }
  if (count > students.length) {
    throw new HttpError(400, 'BAD_INPUT', 'Some fields need another look.', { tables: `With ${students.length} students, use at most ${students.length} tables so each has a student.` });
  }
  const options = await dealFor(lesson, input.drillId, input.holdEveryPass);
  const bot = BOT_STRATEGIES.find((s) => s.id === input.bot)!;
  const title = lesson.title.slice(0, TABLE_LIMITS.nameMax - 12);
  await sequelize.transaction(async (transaction) => {
    for (const [index, group] of splitIntoTables(students, count).entries()) {
      const seats = Object.fromEntries(
        SEATS.map((seat, i): [Seat, StoredSeats[Seat]] => {
          const student = group[i];
          return [seat, student ? { kind: 'user', userId: student.id, displayName: student.displayName } : { kind: 'bot', strategy: bot.id, displayName: `${bot.name} (bot)` }];
        }),
      ) as StoredSeats;
      const table = await TableRow.create(
        {
          id: randomUUID(),
          name: `${title} · table ${index + 1}`,
          hostId: teacher.id,
          hostName: teacher.displayName,
          private: true,
          inviteCode: randomBytes(12).toString('base64url'),
          options: { ...options },
          status: 'lobby',
          seats,
          currentExchangeId: null,
        },
        { transaction },
      );
      await LessonTable.create({ lessonId: lesson.id, tableId: table.id, index }, { transaction });
    }
  });
}

/** The lesson's tables; for a student (viewerId given) only the table where they sit. */
export async function roomTables(lesson: Lesson, viewerId: number | null): Promise<RoomTableDto[]> {
  const links = await LessonTable.findAll({ where: { lessonId: lesson.id }, order: [['index', 'ASC']] });
  const rows = await TableRow.findAll({ where: { id: { [Op.in]: links.map((l) => l.tableId) } } });
  const out: RoomTableDto[] = [];
  for (const link of links) {
    const row = rows.find((r) => r.id === link.tableId);
    if (!row) continue;
    if (viewerId !== null && seatOfUser(row.seats, viewerId) === null) continue;
    out.push({
      id: row.id,
      name: row.name,
      index: link.index,
      status: row.status,
      seed: viewerId === null && !row.options.drillId ? row.options.seed : null,
      drillId: row.options.drillId ?? null,
      seats: Object.fromEntries(
        SEATS.map((s) => {
          const o = row.seats[s];
          return [s, o ? { kind: o.kind, displayName: o.displayName, ...(o.kind === 'user' ? { userId: o.userId } : {}) } : null];
        }),
      ) as RoomTableDto['seats'],
    });
  }
  return out;
}

/** Starts every table still in its lobby, as their host; returns how many started. */
export async function startRoom(lesson: Lesson, teacher: User, registry: TableRegistry, changed: (master: TableMaster) => void): Promise<number> {
  const links = await LessonTable.findAll({ where: { lessonId: lesson.id }, order: [['index', 'ASC']] });
  if (!links.length) throw new HttpError(409, 'NO_ROOM', 'Split the students into tables first.');
  let started = 0;
  for (const link of links) {
    const master = await registry.get(link.tableId);
    if (!master || master.row.status !== 'lobby') continue;
    try {
      await master.start({ userId: teacher.id, displayName: teacher.displayName, as: 'player', isAdmin: false });
    } catch (err) {
      if (err instanceof TableError) throw new HttpError(409, err.code, err.message);
      throw err;
    }
    started += 1;
    changed(master);
  }
  return started;
}

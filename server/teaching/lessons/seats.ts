/**
 * Seat accounting for lessons. Every change that may take a seat runs through `seatTransaction`:
 * one at a time per lesson in this process, inside an IMMEDIATE SQLite transaction (the write
 * lock is taken before the count is read, so a second process cannot count the same free seat);
 * on PostgreSQL the lesson's row is locked (SELECT … FOR UPDATE) to the same end.
 */
import { Op, Transaction, type Sequelize } from 'sequelize';
import { Enrollment, Lesson, Payment } from '../../db/models';

const queues = new Map<number, Promise<unknown>>();

function oneAtATime<T>(lessonId: number, task: () => Promise<T>): Promise<T> {
  const previous = queues.get(lessonId) ?? Promise.resolve();
  const next = previous.then(task, task);
  const settled = next.catch(() => undefined);
  queues.set(lessonId, settled);
  void settled.then(() => {
    if (queues.get(lessonId) === settled) queues.delete(lessonId);
  });
  return next;
}

const isBusy = (err: unknown) => /SQLITE_BUSY|database is locked/i.test(String((err as Error)?.message ?? err));

export function seatTransaction<T>(sequelize: Sequelize, lessonId: number, work: (t: Transaction) => Promise<T>): Promise<T> {
  return oneAtATime(lessonId, async () => {
    // A connection opened for a transaction may not wait on a lock held elsewhere: retry briefly.
    for (let attempt = 0; ; attempt++) {
      try {
        return await sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, async (t) => {
          if (sequelize.getDialect() === 'postgres') await Lesson.findByPk(lessonId, { transaction: t, lock: t.LOCK.UPDATE });
          return work(t);
        });
      } catch (err) {
        if (!isBusy(err) || attempt >= 20) throw err;
        await new Promise((r) => setTimeout(r, 25 * (attempt + 1)));
      }
    }
  });
}

/**
 * Seats held now: in a free lesson every accepted student; in a priced one every paid student
 * plus every other student with a checkout still inside its hold. A student counts once, however
 * many checkouts they started and whatever order their payments were heard of in.
 * `exceptUserId`: leave this student out (the one whose payment is being placed).
 */
export async function seatsTaken(lesson: Lesson, t?: Transaction, exceptUserId?: number): Promise<number> {
  if (lesson.priceCents === 0) {
    return Enrollment.count({ where: { lessonId: lesson.id, status: { [Op.in]: ['enrolled', 'paid'] } }, transaction: t });
  }
  const paid = (await Enrollment.findAll({ attributes: ['userId'], where: { lessonId: lesson.id, status: 'paid' }, transaction: t })).map((e) => e.userId);
  const leftOut = exceptUserId === undefined ? paid : [...paid, exceptUserId];
  const holding = await Payment.count({
    distinct: true,
    col: 'userId',
    where: {
      lessonId: lesson.id,
      status: 'pending',
      holdUntil: { [Op.gt]: new Date() },
      ...(leftOut.length ? { userId: { [Op.notIn]: leftOut } } : {}),
    },
    transaction: t,
  });
  return paid.filter((id) => id !== exceptUserId).length + holding;
}

/**
 * The seats of a lesson as people read them: how many are taken (as `seatsTaken` counts them), how
 * many of those are only held by a checkout still open (a student counts once, and a student who
 * paid is not held), and when the last of those holds ends.
 */
export async function seatCounts(lesson: Lesson): Promise<{ taken: number; held: number; holdEndsAt: Date | null }> {
  if (lesson.priceCents === 0) return { taken: await seatsTaken(lesson), held: 0, holdEndsAt: null };
  const paid = (await Enrollment.findAll({ attributes: ['userId'], where: { lessonId: lesson.id, status: 'paid' } })).map((e) => e.userId);
  const holds = await Payment.findAll({
    attributes: ['userId', 'holdUntil'],
    where: { lessonId: lesson.id, status: 'pending', holdUntil: { [Op.gt]: new Date() }, ...(paid.length ? { userId: { [Op.notIn]: paid } } : {}) },
  });
  const holders = new Set(holds.map((h) => h.userId));
  const last = holds.reduce<Date | null>((latest, h) => (!latest || h.holdUntil > latest ? h.holdUntil : latest), null);
  return { taken: paid.length + holders.size, held: holders.size, holdEndsAt: last };
}

/** Students who hold a seat (and so go to the lesson room). */
export function seatedStatuses(lesson: Lesson): ('enrolled' | 'paid')[] {
  return lesson.priceCents === 0 ? ['enrolled', 'paid'] : ['paid'];
}

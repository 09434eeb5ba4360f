/**
 * A player's progress: figures per finished exchange they sat in. Anyone sees their own; a
 * teacher sees a student enrolled in one of their lessons; an admin sees anyone.
 */
import { Router } from 'express';
import { Op } from 'sequelize';
import type { ProgressDto, ProgressPointDto } from '../../shared/progress';
import { requireUser } from '../auth/guards';
import { Enrollment, ExchangeRow, Lesson, User } from '../db/models';
import { HttpError } from '../errors';
import { figuresFor, seatOfUser } from '../services/exchange-stats';

/** The most recent exchanges counted (each takes the advice for every pass, so there is a bound). */
export const PROGRESS_MAX = 200;

const share = (n: number, of: number) => (of ? n / of : null);

export async function progressOf(user: Pick<User, 'id' | 'displayName'>): Promise<ProgressDto> {
  const rows = await ExchangeRow.findAll({
    where: { status: 'done', participants: { [Op.like]: `%,${user.id},%` } },
    order: [['finishedAt', 'DESC']],
    limit: PROGRESS_MAX + 1,
  });
  const counted = rows.slice(0, PROGRESS_MAX).reverse();
  const figures = await figuresFor(counted, (r) => [seatOfUser(r, user.id)!], true);
  const points = counted.map((row): ProgressPointDto => {
    const seat = seatOfUser(row, user.id)!;
    const f = figures.get(row.id)!.seats[seat]!;
    return {
      exchangeId: row.id,
      tableName: row.tableName,
      finishedAt: (row.finishedAt ?? row.startedAt).toISOString(),
      seat,
      awayBefore: f.awayBefore,
      awayAfter: f.awayAfter,
      gained: f.awayBefore - f.awayAfter,
      passes: f.passes.length,
      asAdvised: f.passes.filter((p) => p.asAdvised).length,
      brokePair: f.passes.filter((p) => p.brokePair).length,
      passedFlower: f.passes.filter((p) => p.passedFlower).length,
    };
  });
  const sum = (pick: (p: ProgressPointDto) => number) => points.reduce((a, p) => a + pick(p), 0);
  const passes = sum((p) => p.passes);
  return {
    user: { id: user.id, displayName: user.displayName },
    totals: {
      exchanges: points.length,
      passes,
      meanGained: points.length ? sum((p) => p.gained) / points.length : null,
      asAdvisedRate: share(sum((p) => p.asAdvised), passes),
      brokePairRate: share(sum((p) => p.brokePair), passes),
      passedFlowerRate: share(sum((p) => p.passedFlower), passes),
    },
    points,
    truncated: rows.length > PROGRESS_MAX,
  };
}

/** Whether the viewer teaches a lesson in which the student holds a place (accepted or paid). */
async function teaches(teacherId: number, studentId: number): Promise<boolean> {
  const lessons = await Lesson.findAll({ where: { teacherId }, attributes: ['id'] });
  if (!lessons.length) return false;
  const found = await Enrollment.findOne({ where: { userId: studentId, lessonId: { [Op.in]: lessons.map((l) => l.id) }, status: { [Op.in]: ['enrolled', 'paid'] } } });
  return found !== null;
}

export function progressRouter() {
  const router = Router();
  router.use(requireUser);

  router.get('/me', async (req, res) => {
    res.json({ progress: await progressOf(req.user!) });
  });

  router.get('/:userId', async (req, res) => {
    const viewer = req.user!;
    const id = Number(req.params.userId);
    const allowed = Number.isInteger(id) && id > 0 && (id === viewer.id || viewer.role === 'admin' || (await teaches(viewer.id, id)));
    if (!allowed) throw new HttpError(403, 'FORBIDDEN', 'You can see your own progress, and a teacher can see the progress of the students in their lessons.');
    const user = await User.findByPk(id);
    if (!user) throw new HttpError(404, 'NOT_FOUND', 'There is no player with that id.');
    res.json({ progress: await progressOf(user) });
  });

  return router;
}

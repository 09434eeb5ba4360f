/**
 * A player's progress: figures per finished exchange they sat in. Anyone sees their own; a
 * teacher sees a student enrolled in one of their lessons; an admin sees anyone.
 */
import { Router } from 'express';
import { Op } from 'sequelize';
import { requireUser } from '../../auth/guards';
import { Enrollment, Lesson, User } from '../../db/models';
import { HttpError } from '../../errors';
import { progressOf } from './service';

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

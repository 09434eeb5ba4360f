import { Router } from 'express';
import { z } from 'zod';
import { roleChangeSchema } from '../../shared/protocol';
import { requireAdmin } from '../auth/guards';
import { User } from '../db/models';
import { badInput, HttpError } from '../errors';

const idParam = z.coerce.number().int().positive();

export function adminRouter() {
  const router = Router();
  router.use(requireAdmin);

  router.get('/users', async (_req, res) => {
    const users = await User.findAll({ order: [['displayName', 'ASC']] });
    res.json({ users: users.map((u) => u.toPublic()) });
  });

  router.patch('/users/:id', async (req, res) => {
    const id = idParam.safeParse(req.params.id);
    if (!id.success) throw new HttpError(400, 'BAD_INPUT', 'A user id is a positive whole number.');
    const parsed = roleChangeSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    const user = await User.findByPk(id.data);
    if (!user) throw new HttpError(404, 'NOT_FOUND', 'No user has that id.');
    if (user.id === req.user!.id && parsed.data.role !== 'admin') {
      throw new HttpError(409, 'OWN_ROLE', 'You cannot take away your own admin role. Ask another admin.');
    }
    user.role = parsed.data.role;
    await user.save();
    res.json({ user: user.toPublic() });
  });

  return router;
}

import { Router } from 'express';
import { z } from 'zod';
import { roleChangeSchema } from '../../shared/protocol';
import { requireAdmin } from '../auth/guards';
import { userSessionsOf } from '../auth/user-sessions';
import type { Logger } from 'pino';
import { AuditEntry, User } from '../db/models';
import { badInput, HttpError } from '../errors';

const idParam = z.coerce.number().int().positive();

export function adminRouter(log?: Logger) {
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
    const from = user.role;
    if (from !== parsed.data.role) {
      await user.sequelize.transaction(async (transaction) => {
        user.role = parsed.data.role;
        await user.save({ transaction });
        await AuditEntry.create({ actorId: req.user!.id, action: 'role-change', targetUserId: user.id, details: { from, to: parsed.data.role } }, { transaction });
      });
      log?.info({ event: 'role-change', actorId: req.user!.id, targetUserId: user.id, from, to: parsed.data.role }, 'role changed');
      // Open sockets hold the user they connected as: they reconnect and read the new role.
      userSessionsOf(req).changed(user.id);
    }
    res.json({ user: user.toPublic() });
  });

  router.get('/audit', async (_req, res) => {
    const entries = await AuditEntry.findAll({ order: [['id', 'DESC']], limit: 500 });
    res.json({ entries: entries.map((e) => ({ id: e.id, actorId: e.actorId, action: e.action, targetUserId: e.targetUserId, details: e.details, at: e.createdAt.toISOString() })) });
  });

  return router;
}

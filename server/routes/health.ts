import { Router } from 'express';
import type { Sequelize } from 'sequelize';

export function healthRouter(sequelize: Sequelize, ready: () => boolean = () => true) {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await sequelize.query('SELECT 1');
      if (!ready()) {
        res.status(503).json({ ok: false, database: 'up', ready: false });
        return;
      }
      res.json({ ok: true, database: 'up', ready: true });
    } catch {
      res.status(503).json({ ok: false, database: 'down', ready: false });
    }
  });
  return router;
}

import { Router } from 'express';
import { randomUUID } from 'node:crypto';
import type { Sequelize } from 'sequelize';

/**
 * Names this process among several behind a balancer, so an operator (and the several-process tests)
 * can see which one answered; random per start, so it tells nothing about the machine.
 */
export const PROCESS_NAME = randomUUID().slice(0, 8);

export function healthRouter(sequelize: Sequelize, ready: () => boolean = () => true) {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await sequelize.query('SELECT 1');
      if (!ready()) {
        res.status(503).json({ ok: false, database: 'up', ready: false, process: PROCESS_NAME });
        return;
      }
      res.json({ ok: true, database: 'up', ready: true, process: PROCESS_NAME });
    } catch {
      res.status(503).json({ ok: false, database: 'down', ready: false });
    }
  });
  return router;
}

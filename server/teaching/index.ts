/**
 * Teaching: drills, pattern lists, lessons with their invitations and paid seats, one deal
 * compared across tables, and a player's progress. Each has a folder here with its router
 * (routes.ts), its service and file formats, and an index.ts naming what the rest of the server
 * may use; files/ holds the upload and download helpers that drills and pattern lists share.
 */
import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';
import type { TableRegistry } from '../realtime/registry';
import type { TableMaster } from '../realtime/table-master';
import type { Mailer } from '../services/mail/mailer';
import { createPaymentClient } from '../services/payments/client';
import { comparisonsRouter } from './comparisons';
import { drillsRouter } from './drills';
import { invitationsRouter } from './invitations';
import { lessonsRouter } from './lessons';
import { patternListsRouter } from './pattern-lists';
import { paymentsRouter, paymentsWebhookRouter } from './payments';
import { progressRouter } from './progress';

export interface TeachingDeps {
  config: Config;
  sequelize: Sequelize;
  mailer: Mailer;
  registry: TableRegistry;
  tableChanged: (master: TableMaster) => void;
}

export function teachingRoutes(deps: TeachingDeps) {
  const payments = { ...deps, stripe: createPaymentClient(deps.config) };
  const routes = Router();
  routes.use('/drills', drillsRouter());
  routes.use('/pattern-lists', patternListsRouter());
  routes.use('/lessons', lessonsRouter(deps));
  routes.use('/invitations', invitationsRouter(deps));
  routes.use('/payments', paymentsRouter(payments));
  routes.use('/comparisons', comparisonsRouter());
  routes.use('/progress', progressRouter());
  return {
    /** Mount at /payments/webhook before any body parser or origin check. */
    webhook: paymentsWebhookRouter(payments),
    /** /drills, /pattern-lists, /lessons, /invitations, /payments, /comparisons, /progress. */
    routes,
  };
}

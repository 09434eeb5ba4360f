/**
 * Stays only while server/app.ts builds its routes through here: lessons, invitations and
 * payments as before (drills, pattern lists, comparisons and progress it mounts itself), with the
 * password reset and the mail outbox, which belong with accounts. server/teaching/index.ts is the
 * teaching side's own wiring; once app.ts creates the mailer and uses it, this file goes.
 */
import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';
import type { TableRegistry } from '../realtime/registry';
import type { TableMaster } from '../realtime/table-master';
import { createMailer } from '../services/mail/mailer';
import { createPaymentClient } from '../services/payments/client';
import { invitationsRouter } from '../teaching/invitations';
import { lessonsRouter } from '../teaching/lessons';
import { paymentsRouter, paymentsWebhookRouter } from '../teaching/payments';
import { mailRouter } from './mail';
import { passwordResetRouter } from './password-reset';

export function teachingRoutes(deps: { config: Config; sequelize: Sequelize; registry: TableRegistry; tableChanged: (master: TableMaster) => void }) {
  const mailer = createMailer(deps.config);
  const payments = { ...deps, mailer, stripe: createPaymentClient(deps.config) };
  const routes = Router();
  routes.use('/lessons', lessonsRouter({ ...deps, mailer }));
  routes.use('/invitations', invitationsRouter(deps));
  routes.use('/payments', paymentsRouter(payments));
  routes.use('/mail', mailRouter());
  return {
    webhook: paymentsWebhookRouter(payments),
    passwordReset: passwordResetRouter({ config: deps.config, mailer }),
    routes,
    close: () => mailer.close(),
  };
}

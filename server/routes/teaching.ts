/** Lessons, invitations, paid seats, the mail outbox and password resets, with the services they share. */
import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';
import type { TableRegistry } from '../realtime/registry';
import type { TableMaster } from '../realtime/table-master';
import { createMailer } from '../services/mail/mailer';
import { createPaymentClient } from '../services/payments/client';
import { invitationsRouter } from './invitations';
import { lessonsRouter } from './lessons';
import { mailRouter } from './mail';
import { passwordResetRouter } from './password-reset';
import { paymentsRouter, paymentsWebhookRouter } from './payments';

export function teachingRoutes(deps: { config: Config; sequelize: Sequelize; registry: TableRegistry; tableChanged: (master: TableMaster) => void }) {
  const mailer = createMailer(deps.config);
  const stripe = createPaymentClient(deps.config);
  const payments = { ...deps, mailer, stripe };
  const routes = Router();
  routes.use('/lessons', lessonsRouter({ ...deps, mailer }));
  routes.use('/invitations', invitationsRouter(deps));
  routes.use('/payments', paymentsRouter(payments));
  routes.use('/mail', mailRouter());
  return {
    /** Mount at /payments/webhook before any body parser or origin check. */
    webhook: paymentsWebhookRouter(payments),
    /** Mount at /auth/password-reset. */
    passwordReset: passwordResetRouter({ config: deps.config, mailer }),
    /** /lessons, /invitations, /payments, /mail. */
    routes,
    close: () => mailer.close(),
  };
}

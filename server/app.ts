import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import express from 'express';
import helmet from 'helmet';
import type { Sequelize } from 'sequelize';
import { createPassport } from './auth/passport';
import type { Logger } from 'pino';
import { absoluteLifetime, createSession } from './auth/session';
import { createUserSessions } from './auth/user-sessions';
import { log } from './log';
import { refuseControlCharacters, refuseControlInBodies } from './security/control-characters';
import { setDealSecret } from './services/deal-seed';
import { requireOwnOrigin } from './security/origin';
import type { Config } from './config';
import { errorHandler, notFoundApi } from './errors';
import { adminRouter } from './routes/admin';
import { authRouter } from './routes/auth';
import { healthRouter } from './routes/health';
import { exchangesRouter } from './routes/exchanges';
import { tablesRouter } from './routes/tables';
import { mailRouter } from './routes/mail';
import { passwordResetRouter } from './routes/password-reset';
import { createMailer } from './services/mail/mailer';
import { teachingRoutes } from './teaching';
import { createEventWriter } from './db/event-writer';
import { closeRateLimits } from './security/rate-limits';
import { TableRegistry } from './realtime/registry';
import type { TableMaster } from './realtime/table-master';

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  /** Where the structured log goes; tests pass their own to read it. */
  logger?: Logger;
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApplication({ config, sequelize, logger = log }: AppDeps) {
  const app = express();
  app.set('trust proxy', config.trustProxy ? 1 : false);
  app.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: { 'script-src': ["'self'"], 'connect-src': ["'self'", 'ws:', 'wss:'], 'upgrade-insecure-requests': null },
      },
    }),
  );

  const session = createSession(sequelize, config);
  // Routes that end a user's other sessions or change their role reach it through req.app.locals.
  const userSessions = createUserSessions(session.store);
  app.locals.userSessions = userSessions;
  let draining = false;
  const passport = createPassport();
  const onLogout = new Set<(sessionId: string) => void>();
  const onTableChange = new Set<(master: TableMaster, fromPeer?: boolean) => void>();
  // One owner per table, shared by the REST routes and the sockets.
  const events = createEventWriter(sequelize, logger);
  setDealSecret(config.linkSecret);
  const registry = new TableRegistry({
    botDelayMs: config.botDelayMs,
    seatGraceMs: config.seatGraceMs,
    events,
    logger,
    movesPerExchange: config.rateLimits.actionsPerExchange,
    changed: (master, fromPeer) => onTableChange.forEach((fn) => fn(master, fromPeer)),
  });

  const mailer = createMailer(config);
  const teaching = teachingRoutes({ config, sequelize, mailer, registry, tableChanged: (master) => onTableChange.forEach((fn) => fn(master)) });

  const api = express.Router();
  // A NUL or other control character in a path parameter or the query string is a 400 on every route.
  api.use(refuseControlCharacters);
  // The payment service's webhook: raw body for its signature, and no browser Origin to check.
  api.use('/payments/webhook', teaching.webhook);
  api.use(requireOwnOrigin(config));
  api.use(express.json({ limit: '100kb' }));
  api.use(refuseControlInBodies);
  api.use(session.middleware);
  api.use(passport.initialize());
  api.use(passport.session());
  api.use(absoluteLifetime(config));
  api.use('/health', healthRouter(sequelize, () => !draining));
  api.use('/auth/password-reset', passwordResetRouter({ config, mailer }));
  api.use('/auth', authRouter(passport, config, { onLogout: (sid) => onLogout.forEach((fn) => fn(sid)), log: logger }));
  api.use('/admin', adminRouter(logger));
  api.use('/tables', tablesRouter(registry));
  api.use('/exchanges', exchangesRouter());
  api.use('/mail', mailRouter());
  api.use(teaching.routes);
  api.use(notFoundApi);
  app.use('/api', api);

  const clientDir = resolve(config.clientDir);
  if (existsSync(resolve(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(resolve(clientDir, 'index.html')));
  }
  app.use(errorHandler);

  return {
    app,
    config,
    session,
    passport,
    /** Lets the realtime layer hear of sign-outs, to close that session's sockets. */
    onLogout: (fn: (sessionId: string) => void) => onLogout.add(fn),
    /** Lets the realtime layer hear of a user's sessions ended (a password reset) or account changed (a new role). */
    userSessions,
    registry,
    /** Lets the realtime layer hear of every stored table change. */
    onTableChange: (fn: (master: TableMaster, fromPeer?: boolean) => void) => onTableChange.add(fn),
    logger,
    /** Readiness goes false once shutdown begins, so a load balancer stops sending new work. */
    drain: () => {
      draining = true;
    },
    /** Call once every table is idle: the event log's last group is written, then its connection closed. */
    close: async () => {
      mailer.close();
      session.close();
      await Promise.all([events.close(), closeRateLimits()]);
    },
  };
}

export type Application = ReturnType<typeof createApplication>;

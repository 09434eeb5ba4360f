import connectSessionSequelize from 'connect-session-sequelize';
import type { RequestHandler } from 'express';
import session from 'express-session';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';

export const SESSION_COOKIE = 'rackside.sid';

declare module 'express-session' {
  interface SessionData {
    /** When this session signed in (ms since the epoch): the start of its absolute lifetime. */
    signedInAt?: number;
  }
}

export function createSession(sequelize: Sequelize, config: Config) {
  const SequelizeStore = connectSessionSequelize(session.Store);
  const store = new SequelizeStore({ db: sequelize, expiration: config.sessionMaxAgeMs, checkExpirationInterval: 15 * 60 * 1000 });

  // The store's own sweep runs every 15 minutes; a session past its idle lifetime is refused at once.
  // The deadline is the row's `expires` column, which every request moves on (the store's touch);
  // the cookie expiry saved inside the session data moves only when the session itself changes.
  const rows = (store as unknown as { sessionModel: { findOne(q: object): Promise<{ data: string; expires: Date | string | null } | null> } }).sessionModel;
  store.get = (sid: string, done: (err: unknown, data?: session.SessionData | null) => void) => {
    rows
      .findOne({ where: { sid } })
      .then((row) => {
        if (!row) return done(null, null);
        const expires = row.expires ? new Date(row.expires).getTime() : Infinity;
        if (expires > Date.now()) return done(null, JSON.parse(row.data) as session.SessionData);
        store.destroy(sid, () => done(null, null));
      })
      .catch((err: unknown) => done(err));
  };

  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    // Every request pushes the idle deadline on; the absolute deadline is checked below.
    rolling: true,
    proxy: config.trustProxy,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      // 'auto': Secure whenever the request came over TLS (directly or, with trust proxy, through a proxy).
      secure: 'auto',
      maxAge: config.sessionMaxAgeMs,
    },
  });
  return { middleware, store, close: () => store.stopExpiringSessions() };
}

export function pastAbsoluteLifetime(data: session.SessionData | undefined, config: Config): boolean {
  return !!data?.signedInAt && Date.now() - data.signedInAt > config.sessionAbsoluteMs;
}

/** Ends a signed-in session once its absolute lifetime is over, however active it has been. */
export function absoluteLifetime(config: Config): RequestHandler {
  return (req, _res, next) => {
    if (!req.user || !pastAbsoluteLifetime(req.session, config)) return next();
    req.logout(() => req.session.destroy(() => next()));
  };
}

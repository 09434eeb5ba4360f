import connectSessionSequelize from 'connect-session-sequelize';
import session from 'express-session';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';

export const SESSION_COOKIE = 'rackside.sid';

export function createSession(sequelize: Sequelize, config: Config) {
  const SequelizeStore = connectSessionSequelize(session.Store);
  const store = new SequelizeStore({ db: sequelize, expiration: config.sessionMaxAgeMs, checkExpirationInterval: 15 * 60 * 1000 });
  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
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

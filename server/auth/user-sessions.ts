/**
 * Everything signed in as one user, across the session store and the live connections: a
 * password reset ends the user's other sessions, a role change reaches their open sockets.
 * Routes find it on `req.app.locals.userSessions`; the realtime layer listens through `on…`.
 */
import type { Request } from 'express';
import type { Store } from 'express-session';
import { Op, type Model, type ModelStatic } from 'sequelize';

type SessionRow = Model & { sid: string; data: string | null };

export interface UserSessions {
  /** Ends every stored session of the user except `keepSessionId`, and closes their sockets. Resolves with how many ended. */
  endOthers(userId: number, keepSessionId?: string): Promise<number>;
  /** The user's account changed (say, their role): their open sockets pick it up at once. */
  changed(userId: number): void;
  onEnded(fn: (userId: number, keepSessionId?: string) => void): void;
  onChanged(fn: (userId: number) => void): void;
}

function signedInUser(data: string | null): unknown {
  try {
    return (JSON.parse(data ?? '') as { passport?: { user?: unknown } })?.passport?.user;
  } catch {
    return undefined;
  }
}

export function createUserSessions(store: Store): UserSessions {
  // connect-session-sequelize keeps its rows in this model: sid, expires, and the session as JSON.
  const sessionModel = (store as unknown as { sessionModel: ModelStatic<SessionRow> }).sessionModel;
  const ended = new Set<(userId: number, keepSessionId?: string) => void>();
  const changed = new Set<(userId: number) => void>();
  return {
    async endOthers(userId, keepSessionId) {
      // passport keeps the user id as `"passport":{"user":<id>}`; the text match narrows, the parse decides.
      const rows = await sessionModel.findAll({
        attributes: ['sid', 'data'],
        where: { data: { [Op.like]: `%"user":${userId}%` }, ...(keepSessionId ? { sid: { [Op.ne]: keepSessionId } } : {}) },
      });
      const sids = rows.filter((row) => signedInUser(row.data) === userId).map((row) => row.sid);
      if (sids.length) await sessionModel.destroy({ where: { sid: { [Op.in]: sids } } });
      ended.forEach((fn) => fn(userId, keepSessionId));
      return sids.length;
    },
    changed(userId) {
      changed.forEach((fn) => fn(userId));
    },
    onEnded: (fn) => void ended.add(fn),
    onChanged: (fn) => void changed.add(fn),
  };
}

export function userSessionsOf(req: Request): UserSessions {
  return req.app.locals.userSessions as UserSessions;
}

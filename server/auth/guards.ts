import type { RequestHandler } from 'express';
import type { Role } from '../db/models';
import { HttpError } from '../errors';

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new HttpError(401, 'UNAUTHENTICATED', 'Please sign in first.');
  next();
};

/** Allows signed-in users holding one of the roles; admins pass every role guard. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw new HttpError(401, 'UNAUTHENTICATED', 'Please sign in first.');
    if (req.user.role !== 'admin' && !roles.includes(req.user.role)) {
      throw new HttpError(403, 'FORBIDDEN', `This needs the ${roles.join(' or ')} role.`);
    }
    next();
  };
}

export const requireTeacher = requireRole('teacher');
export const requireAdmin = requireRole('admin');

import type { ErrorRequestHandler, RequestHandler } from 'express';
import { UniqueConstraintError } from 'sequelize';
import type { ZodError } from 'zod';
import { fieldErrors } from '../shared/field-errors';
import { log } from './log';

/** An error meant for the person on the other end: a stable code, a plain message, a status. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export function badInput(error: ZodError): HttpError {
  return new HttpError(400, 'BAD_INPUT', 'Some fields need another look.', fieldErrors(error));
}

export const notFoundApi: RequestHandler = (req) => {
  throw new HttpError(404, 'NOT_FOUND', `There is no ${req.method} ${req.path} here.`);
};

/** The last middleware: every error leaves as `{ error: { code, message, fields? } }`, never a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, next) => {
  void next;
  if (err instanceof HttpError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } });
    return;
  }
  if (err instanceof UniqueConstraintError) {
    // Two requests stored the same thing at once (most often a double click): the first one counts.
    res.status(409).json({ error: { code: 'ALREADY_EXISTS', message: 'That was already saved, most likely by an earlier click or another tab. Reload the page to see it.' } });
    return;
  }
  const e = err as { type?: string; status?: number };
  if (e?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'BAD_JSON', message: 'The request body is not valid JSON.' } });
    return;
  }
  if (e?.type === 'entity.too.large') {
    res.status(413).json({ error: { code: 'TOO_LARGE', message: 'The request body is too large.' } });
    return;
  }
  if (e?.status && e.status >= 400 && e.status < 500) {
    res.status(e.status).json({ error: { code: 'BAD_REQUEST', message: 'The request could not be read.' } });
    return;
  }
  log.error({ err }, 'Unexpected error');
  res.status(500).json({ error: { code: 'SERVER_ERROR', message: 'Something went wrong on our side. Please try again.' } });
};

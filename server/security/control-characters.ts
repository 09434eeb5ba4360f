/**
 * Refuses a control character (Unicode category Cc: NUL, the rest of C0, DEL, C1) in the request
 * path or query string with 400 BAD_INPUT, before any route reads it. No Rackside id, token, seed
 * or address holds one, and some reach the database as they are (SQLite stops a string at NUL).
 */
import type { RequestHandler } from 'express';
import { HttpError } from '../errors';

const CONTROL = /\p{Cc}/u;

function hasControl(value: unknown): boolean {
  if (typeof value === 'string') return CONTROL.test(value);
  if (Array.isArray(value)) return value.some(hasControl);
  if (value && typeof value === 'object') return Object.entries(value).some(([k, v]) => CONTROL.test(k) || hasControl(v));
  return false;
}

/** A path segment that does not decode, or decodes to a control character. */
function badSegment(segment: string): boolean {
  try {
    return CONTROL.test(decodeURIComponent(segment));
  } catch {
    return true;
  }
}

export const refuseControlCharacters: RequestHandler = (req, _res, next) => {
  if (req.path.split('/').some(badSegment)) {
    throw new HttpError(400, 'BAD_INPUT', 'This address holds a control character (such as %00) or a broken %-escape, which no Rackside link has. Check the link and try again.');
  }
  const query = req.query as Record<string, unknown>;
  const bad = Object.keys(query).filter((key) => CONTROL.test(key) || hasControl(query[key]));
  if (bad.length) {
    const fields = Object.fromEntries(bad.map((key) => [key.replace(CONTROL, '?'), 'Remove the control character (such as %00) from this value.']));
    throw new HttpError(400, 'BAD_INPUT', 'The query string holds a control character (such as %00). Check the link and try again.', fields);
  }
  next();
};

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

/** Control characters that no text a person types holds: C0 except tab, line feed and carriage return, DEL and C1. */
// eslint-disable-next-line no-control-regex -- finding these characters is the point
export const TYPED_CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;

/**
 * Where in a parsed JSON body or socket payload a string holds such a character (a path like
 * "options.patternListId"), or null. Names, notes and ids alike: SQLite stops a string at NUL.
 */
export function controlCharacterAt(value: unknown, path = '', depth = 0): string | null {
  if (typeof value === 'string') return TYPED_CONTROL.test(value) ? path || 'value' : null;
  if (depth > 32 || !value || typeof value !== 'object') return null;
  for (const [key, inner] of Object.entries(value)) {
    const at = path ? `${path}.${key}` : key;
    if (TYPED_CONTROL.test(key)) return at;
    const found = controlCharacterAt(inner, at, depth + 1);
    if (found) return found;
  }
  return null;
}

/** Refuses a JSON body with a control character in any of its strings, naming the field. */
export const refuseControlInBodies: RequestHandler = (req, _res, next) => {
  const at = controlCharacterAt(req.body);
  if (at) throw new HttpError(400, 'BAD_INPUT', `"${at}" holds a control character (such as NUL), which no Rackside text may hold. Remove it and send again.`, { [at]: 'Remove the control character from this value.' });
  next();
};

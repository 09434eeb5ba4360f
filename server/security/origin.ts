import type { IncomingMessage } from 'node:http';
import type { RequestHandler } from 'express';
import type { Config } from '../config';
import { HttpError } from '../errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Is this request from one of our own pages? A browser names the page's origin in `Origin`
 * on every cross-site request and on same-site writes; we accept our own host (as the client
 * reached it, so the dev proxy and a TLS proxy both work) and any configured origin. With no
 * Origin, a browser still says `Sec-Fetch-Site`; a request with neither is not from a browser
 * page, so it cannot carry a forged cross-site intent.
 */
export function isOwnOrigin(req: IncomingMessage, config: Config): boolean {
  const origin = req.headers.origin;
  if (origin === undefined) return req.headers['sec-fetch-site'] !== 'cross-site';
  if (config.allowedOrigins.includes(origin)) return true;
  const host = req.headers['x-forwarded-host'] && config.trustProxy ? String(req.headers['x-forwarded-host']) : req.headers.host;
  if (!host) return false;
  try {
    return new URL(origin).host === host;
  } catch {
    return false;
  }
}

/** Refuses state-changing requests from other sites' pages (cross-site request forgery). */
export function requireOwnOrigin(config: Config): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method) || isOwnOrigin(req, config)) return next();
    next(new HttpError(403, 'FOREIGN_ORIGIN', 'This request came from another site, so Rackside refused it. Use Rackside from its own pages.'));
  };
}

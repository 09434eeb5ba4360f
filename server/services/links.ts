import type { Request } from 'express';
import type { Config } from '../config';

const LOOPBACK = new Set(['localhost', '127.0.0.1', '[::1]']);

/**
 * The address people reach Rackside at, for links in mail and for the payment service's return
 * pages. PUBLIC_URL when set. Without it (development and tests) the page's own origin when that
 * is a loopback address, so the dev proxy and a browser on 127.0.0.1 both come back signed in;
 * never an arbitrary Host header, which anyone could forge into a mailed link.
 */
export function publicBase(config: Config, req?: Request): string {
  if (config.publicUrl) return config.publicUrl.replace(/\/+$/, '');
  const origin = req?.headers.origin;
  if (origin) {
    try {
      const url = new URL(origin);
      if (LOOPBACK.has(url.hostname)) return url.origin;
    } catch {
      // fall through to the default
    }
  }
  return `http://localhost:${config.port}`;
}

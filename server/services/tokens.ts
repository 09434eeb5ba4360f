/**
 * Signed, expiring links: `<id>.<expires>.<nonce>.<signature>`. The signature (HMAC-SHA256 over the
 * purpose and the rest) lets us refuse a made-up or altered link before touching the database;
 * the database keeps only a SHA-256 of the whole token, so a leaked table holds no working links.
 */
import { createHash, createHmac, randomBytes, timingSafeEqual } from 'node:crypto';

export type TokenPurpose = 'invitation' | 'password-reset';

function signature(secret: string, purpose: TokenPurpose, body: string) {
  return createHmac('sha256', secret).update(`${purpose}:${body}`).digest('base64url');
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export function signToken(secret: string, purpose: TokenPurpose, id: number, expiresAt: Date): string {
  const body = `${id}.${Math.floor(expiresAt.getTime() / 1000)}.${randomBytes(18).toString('base64url')}`;
  return `${body}.${signature(secret, purpose, body)}`;
}

/** The id and expiry a token carries, when its signature is ours; null for anything else. */
export function readToken(secret: string, purpose: TokenPurpose, token: string): { id: number; expiresAt: Date } | null {
  const parts = token.split('.');
  if (parts.length !== 4) return null;
  const [id, expires, nonce, given] = parts;
  if (!/^\d{1,12}$/.test(id) || !/^\d{1,12}$/.test(expires) || !nonce) return null;
  const expected = Buffer.from(signature(secret, purpose, `${id}.${expires}.${nonce}`));
  const actual = Buffer.from(given);
  if (expected.length !== actual.length || !timingSafeEqual(expected, actual)) return null;
  return { id: Number(id), expiresAt: new Date(Number(expires) * 1000) };
}

import pino from 'pino';

/** Rackside's structured log. Passwords and cookies are redacted wherever they appear. */
export const log = pino({
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' || process.env.VITEST ? 'silent' : 'info'),
  redact: { paths: ['password', '*.password', 'req.headers.cookie', 'cookie', 'body.password'], censor: '[redacted]' },
  base: { app: 'rackside' },
});

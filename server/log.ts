import pino, { type DestinationStream, type Logger } from 'pino';

/** Fields whose values never reach the log, at the top level or nested up to three objects deep. */
const SECRET_KEYS = ['password', 'newPassword', 'currentPassword', 'token', 'cookie', 'authorization', 'Authorization', '["set-cookie"]'];

const REDACTED_PATHS = SECRET_KEYS.flatMap((key) => {
  const at = (prefix: string) => (key.startsWith('[') ? `${prefix}${key}` : prefix ? `${prefix}.${key}` : key);
  return [at(''), at('*'), at('*.*'), at('*.*.*')];
});

/** Rackside's structured log. Passwords, tokens, cookies and authorization headers are redacted. */
export function createLogger(destination?: DestinationStream, level?: string): Logger {
  const options = {
    level: level ?? process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' || process.env.VITEST ? 'silent' : 'info'),
    redact: { paths: REDACTED_PATHS, censor: '[redacted]' },
    base: { app: 'rackside' },
  };
  return destination ? pino(options, destination) : pino(options);
}

export const log = createLogger();

/** Every setting Rackside reads from the environment, with its default, in one place. */
import { randomBytes } from 'node:crypto';

export interface Config {
  port: number;
  databaseUrl: string;
  sessionSecret: string;
  /** Express "trust proxy": set when Rackside runs behind a TLS-terminating proxy, so cookies get Secure. */
  trustProxy: boolean;
  bcryptRounds: number;
  /** Sign-in attempts allowed per address and e-mail within the window. */
  loginRateLimit: { max: number; windowMs: number };
  seedDemo: boolean;
  /** Where the built client lives; served when present. */
  clientDir: string;
  /** A session ends after this long without a request (idle lifetime), in ms. */
  sessionMaxAgeMs: number;
  /** A session ends this long after sign-in, however busy (absolute lifetime), in ms. */
  sessionAbsoluteMs: number;
  /** Origins besides our own host that may send state-changing requests and open sockets (ALLOWED_ORIGINS, comma-separated). */
  allowedOrigins: string[];
  /** Requests allowed per window, per address (and e-mail where one is given). */
  rateLimits: Record<'register' | 'passwordReset' | 'invitations', { max: number; windowMs: number }> & { chatPerMinute: number };
  production: boolean;
  /** How long a bot waits before it acts, in ms. */
  botDelayMs: number;
}

function int(value: string | undefined, fallback: number): number {
  if (value === undefined || value === '') return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 0) throw new Error(`Expected a whole number, got "${value}"`);
  return n;
}

function bool(value: string | undefined, fallback: boolean): boolean {
  if (value === undefined || value === '') return fallback;
  return ['1', 'true', 'yes', 'on'].includes(value.toLowerCase());
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env, overrides: Partial<Config> = {}): Config {
  const production = env.NODE_ENV === 'production';
  const config: Config = {
    port: int(env.PORT, 3000),
    databaseUrl: env.DATABASE_URL || 'sqlite:data/rackside.sqlite',
    // A random secret per start is safe (sessions end at restart); set SESSION_SECRET to keep them.
    sessionSecret: env.SESSION_SECRET || randomBytes(32).toString('hex'),
    trustProxy: bool(env.TRUST_PROXY, false),
    bcryptRounds: int(env.BCRYPT_ROUNDS, 10),
    loginRateLimit: { max: int(env.LOGIN_RATE_MAX, 10), windowMs: int(env.LOGIN_RATE_WINDOW_MS, 15 * 60 * 1000) },
    seedDemo: bool(env.SEED_DEMO, true),
    clientDir: env.CLIENT_DIR || 'dist/client',
    sessionMaxAgeMs: int(env.SESSION_IDLE_MS, 2 * 60 * 60 * 1000),
    sessionAbsoluteMs: int(env.SESSION_ABSOLUTE_MS, 12 * 60 * 60 * 1000),
    allowedOrigins: (env.ALLOWED_ORIGINS ?? '').split(',').map((o) => o.trim()).filter(Boolean),
    rateLimits: {
      register: { max: int(env.REGISTER_RATE_MAX, 20), windowMs: int(env.REGISTER_RATE_WINDOW_MS, 60 * 60 * 1000) },
      passwordReset: { max: int(env.RESET_RATE_MAX, 5), windowMs: int(env.RESET_RATE_WINDOW_MS, 60 * 60 * 1000) },
      invitations: { max: int(env.INVITE_RATE_MAX, 100), windowMs: int(env.INVITE_RATE_WINDOW_MS, 60 * 60 * 1000) },
      chatPerMinute: int(env.CHAT_RATE_PER_MINUTE, 30),
    },
    production,
    botDelayMs: int(env.BOT_DELAY_MS, 600),
  };
  return { ...config, ...overrides };
}

/** A configuration for tests: in-memory database, fast hashing, no demo. */
export function testConfig(overrides: Partial<Config> = {}): Config {
  return loadConfig({}, {
    databaseUrl: 'sqlite::memory:',
    sessionSecret: 'test-secret',
    bcryptRounds: 4,
    seedDemo: false,
    clientDir: 'dist/does-not-exist',
    botDelayMs: 0,
    ...overrides,
  });
}

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
  /** Session lifetime in ms. */
  sessionMaxAgeMs: number;
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
    sessionMaxAgeMs: int(env.SESSION_MAX_AGE_MS, 7 * 24 * 60 * 60 * 1000),
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

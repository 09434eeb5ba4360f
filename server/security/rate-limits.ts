/**
 * The HTTP rate limits (sign-in, registration, password reset, invitations). With REDIS_URL set
 * their counts live in Redis, so several processes share one limit instead of each allowing the
 * whole of it; otherwise each process counts in its own memory (express-rate-limit's store).
 * Either way express-rate-limit answers: a 429 with our JSON error, and the draft-7 `RateLimit`,
 * `RateLimit-Policy` and `Retry-After` headers.
 */
import { createHash } from 'node:crypto';
import type { Request } from 'express';
import { rateLimit, type ClientRateLimitInfo, type Options, type Store } from 'express-rate-limit';
import { Redis } from 'ioredis';
import { RateLimiterMemory, RateLimiterRedis, type RateLimiterRes } from 'rate-limiter-flexible';
import type { Config } from '../config';
import { log } from '../log';

/**
 * One connection per Redis per process, shared by every limiter, opened with the first limiter so
 * that it is ready before the first request. While it is not ready, counts go to memory (below).
 */
const connections = new Map<string, Redis>();

function connection(url: string): Redis {
  let client = connections.get(url);
  if (!client) {
    client = new Redis(url, { maxRetriesPerRequest: 2 });
    client.on('error', (err: Error) => log.error({ connection: 'rate-limits', error: err.message }, 'redis connection error'));
    connections.set(url, client);
  }
  return client;
}

/** Closes the rate limits' Redis connections (at shutdown); a later count opens a new one. */
export async function closeRateLimits(): Promise<void> {
  const open = [...connections.values()];
  connections.clear();
  await Promise.allSettled(open.map((client) => client.quit()));
}

/** A key as stored: as given when short, else its hash, so a long typed e-mail cannot make a long Redis key. */
const stored = (key: string) => (key.length <= 200 ? key : `sha256:${createHash('sha256').update(key).digest('hex')}`);

const info = (res: RateLimiterRes): ClientRateLimitInfo => ({ totalHits: Math.max(0, res.consumedPoints), resetTime: new Date(Date.now() + Math.max(0, res.msBeforeNext)) });

/**
 * An express-rate-limit store over rate-limiter-flexible's RateLimiterRedis: a key's count is one
 * Redis key that expires a window after its first hit, as in the memory store. Should Redis be
 * unreachable, counting goes on in this process's memory until it is back, rather than failing the
 * request or letting everything through.
 */
class RedisCountStore implements Store {
  readonly localKeys = false;
  readonly prefix: string;
  private counts: RateLimiterRedis | null = null;

  constructor(
    private readonly client: Redis,
    name: string,
  ) {
    this.prefix = `rackside:http-limit:${name}`;
  }

  init(options: Options) {
    // rate-limiter-flexible counts in whole seconds; a window is never shorter than the one configured.
    const duration = Math.max(1, Math.ceil(options.windowMs / 1000));
    const points = typeof options.limit === 'number' && options.limit > 0 ? options.limit : 1;
    this.counts = new RateLimiterRedis({
      storeClient: this.client,
      keyPrefix: this.prefix,
      points,
      duration,
      rejectIfRedisNotReady: true,
      insuranceLimiter: new RateLimiterMemory({ keyPrefix: this.prefix, points, duration }),
    });
  }

  private get store(): RateLimiterRedis {
    if (!this.counts) throw new Error('The rate limit store was used before express-rate-limit set it up');
    return this.counts;
  }

  async get(key: string) {
    const res = await this.store.get(stored(key));
    return res ? info(res) : undefined;
  }

  async increment(key: string) {
    return info(await this.store.penalty(stored(key), 1));
  }

  async decrement(key: string) {
    await this.store.reward(stored(key), 1);
  }

  async resetKey(key: string) {
    await this.store.delete(stored(key));
  }
}

export interface HttpLimit {
  /** Names the limit's counts in Redis; one name per limiter. */
  name: string;
  /** Requests allowed per key within the window. */
  limit: { max: number; windowMs: number };
  /** Whose requests count together (an address, an address and e-mail, an account). */
  key: (req: Request) => string;
  /** Shown to whoever is refused. */
  message: string;
  /** Called for each refused request, before the answer (to log it). */
  onLimit?: (req: Request) => void;
  /** Requests answered below 400 are taken back off the count (sign-in: only failures count). */
  skipSuccessfulRequests?: boolean;
}

/** A limiter middleware: counts in Redis when the config names one, in this process otherwise. */
export function httpRateLimit(config: Pick<Config, 'redisUrl'>, limit: HttpLimit) {
  return rateLimit({
    windowMs: limit.limit.windowMs,
    limit: limit.limit.max,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: limit.key,
    skipSuccessfulRequests: limit.skipSuccessfulRequests ?? false,
    store: config.redisUrl ? new RedisCountStore(connection(config.redisUrl), limit.name) : undefined,
    handler: (req, res) => {
      limit.onLimit?.(req);
      res.status(429).json({ error: { code: 'RATE_LIMITED', message: limit.message } });
    },
  });
}

/**
 * The other Rackside processes, reached through Socket.IO's Redis adapter: room emits and the
 * server-side notices of ./wire.ts (`InterServerEvents`). Without a Redis this process is alone,
 * and every notice is a no-op.
 */
import { createAdapter } from '@socket.io/redis-adapter';
import { Redis } from 'ioredis';
import { RateLimiterMemory, RateLimiterRedis, type RateLimiterAbstract } from 'rate-limiter-flexible';
import type { Application } from '../app';
import type { TableRegistry } from './registry';
import type { TableMaster } from './table-master';
import { tableRoom, type RacksideServer } from './wire';

export type PeersDeps = Pick<Application, 'config' | 'logger'>;

export interface Peers {
  /** Whether other processes may share the tables (a Redis is configured). */
  readonly shared: boolean;
  /** A rate limiter that counts across every process when they share a Redis. */
  limiter(keyPrefix: string, points: number, durationSeconds: number): RateLimiterAbstract;
  /** Tells the other processes that a table changed in the database, so that they catch up and show it. */
  tellMoved(master: TableMaster, whole?: boolean): void;
  /** Asks the other processes to count who is at the table again. */
  askRecount(tableId: string): void;
  /** Answers the other processes' notices about the tables this process holds. */
  listen(registry: TableRegistry, recount: (master: TableMaster) => void): void;
  /** Closes the connections to Redis, once the sockets are closed. */
  close(): Promise<void>;
}

/** The two Redis connections the adapter needs (one publishes, one listens); errors are logged, and ioredis reconnects. */
function connectRedis(url: string, { logger }: PeersDeps) {
  const pub = new Redis(url, { maxRetriesPerRequest: 2 });
  const sub = pub.duplicate();
  for (const [name, client] of [['publish', pub], ['subscribe', sub]] as const) {
    client.on('error', (err: Error) => logger.error({ connection: name, error: err.message }, 'redis connection error'));
  }
  return {
    pub,
    sub,
    close: async () => {
      await Promise.allSettled([pub.quit(), sub.quit()]);
    },
  };
}

/** Connects the server to the other processes when a Redis is configured; `closing` stops the notices once shutdown begins. */
export function connectPeers(io: RacksideServer, deps: PeersDeps, closing: () => boolean): Peers {
  const redis = deps.config.redisUrl ? connectRedis(deps.config.redisUrl, deps) : null;
  if (redis) io.adapter(createAdapter(redis.pub, redis.sub));
  const telling = () => redis !== null && !closing();

  return {
    shared: redis !== null,
    limiter: (keyPrefix, points, duration) =>
      redis ? new RateLimiterRedis({ storeClient: redis.pub, keyPrefix, points, duration }) : new RateLimiterMemory({ keyPrefix, points, duration }),
    tellMoved(master, whole = false) {
      if (!telling()) return;
      // The balancer sends every socket of a table to one process: while all of them are here, no
      // other process shows it and none is told. A process without the table's sockets (a REST
      // request changed it here) tells, so that the process with the sockets catches up.
      const here = io.of('/').adapter.rooms.get(tableRoom(master.id))?.size ?? 0;
      if (here > 0 && master.remoteSockets === 0) return;
      io.serverSideEmit('table:moved', { tableId: master.id, ...master.position, whole });
    },
    askRecount(tableId) {
      if (telling()) io.serverSideEmit('table:presence', tableId);
    },
    listen(registry, recount) {
      if (!redis) return;
      io.on('table:presence', (tableId) => {
        if (typeof tableId !== 'string') return;
        registry
          .peek(tableId)
          .then((master) => {
            if (!master) return;
            // Another process has a socket at this table (or had): tell it every change from now on,
            // until the count says otherwise.
            master.remoteSockets = Math.max(1, master.remoteSockets);
            recount(master);
          })
          .catch(() => undefined);
      });
      io.on('table:moved', (told) => {
        const tableId = told?.tableId;
        if (typeof tableId !== 'string') return;
        registry
          .peek(tableId)
          .then((master) => master?.catchUp(told))
          .catch((err) => deps.logger.error({ err, tableId }, 'catching up with another process failed'));
      });
    },
    close: async () => {
      await redis?.close();
    },
  };
}

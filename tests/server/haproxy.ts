/**
 * A real HAProxy in front of two Rackside processes, with the configuration kept for production
 * (server/deploy/haproxy.cfg), on free loopback ports. It comes from Debian's package (haproxy),
 * which the test command installs.
 */
import { spawn } from 'node:child_process';
import { accessSync, constants } from 'node:fs';
import { delimiter, join, resolve } from 'node:path';
import { freePort, waitFor } from './backing-servers';

export const HAPROXY_CONFIG = resolve(import.meta.dirname, '../../server/deploy/haproxy.cfg');

/** The haproxy program: on the PATH, or in /usr/sbin where Debian puts it (not on a user's PATH). */
export function haproxyBin(): string | null {
  for (const dir of [...(process.env.PATH ?? '').split(delimiter), '/usr/sbin', '/usr/local/sbin']) {
    if (!dir) continue;
    try {
      accessSync(join(dir, 'haproxy'), constants.X_OK);
      return join(dir, 'haproxy');
    } catch {
      // not here
    }
  }
  return null;
}

/** One server line of HAProxy's status page, as it stands now. */
export interface ServerStatus {
  backend: string;
  server: string;
  /** UP, DOWN, or a transition such as "UP 1/2". */
  status: string;
  /** Connections open through it now: for the `tables` backend, each WebSocket of a table is one. */
  current: number;
}

export interface RunningHaproxy {
  /** Where clients connect: the `rackside` frontend. */
  url: string;
  /** The servers of every backend, from HAProxy's status page (`/;csv`). */
  servers(): Promise<ServerStatus[]>;
  /** What HAProxy printed (its request log and its server state changes), for a failing test. */
  output(): string;
  stop(): Promise<void>;
}

/** Starts HAProxy before the given processes' ports (the config's servers a and b), and waits until it serves through both. */
export async function startHaproxy(ports: { a: number; b: number }): Promise<RunningHaproxy> {
  const bin = haproxyBin();
  if (!bin) throw new Error('HAProxy is not installed (Debian package haproxy).');
  const [port, statsPort] = [await freePort(), await freePort()];
  const child = spawn(bin, ['-db', '-f', HAPROXY_CONFIG], {
    env: {
      ...process.env,
      RACKSIDE_LISTEN: `127.0.0.1:${port}`,
      RACKSIDE_A: `127.0.0.1:${ports.a}`,
      RACKSIDE_B: `127.0.0.1:${ports.b}`,
      RACKSIDE_HAPROXY_STATS: `127.0.0.1:${statsPort}`,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let printed = '';
  const keep = (d: Buffer) => {
    printed = (printed + d.toString()).slice(-200_000);
  };
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  const exited = new Promise<void>((done) => child.once('exit', () => done()));
  const url = `http://127.0.0.1:${port}`;

  async function servers(): Promise<ServerStatus[]> {
    const res = await fetch(`http://127.0.0.1:${statsPort}/;csv`);
    const [head, ...rows] = (await res.text()).trim().split('\n');
    const columns = head.replace(/^# /, '').split(',');
    const at = (name: string) => columns.indexOf(name);
    return rows
      .map((line) => line.split(','))
      .filter((cells) => !['FRONTEND', 'BACKEND'].includes(cells[at('svname')]))
      .map((cells) => ({ backend: cells[at('pxname')], server: cells[at('svname')], status: cells[at('status')], current: Number(cells[at('scur')]) }));
  }

  // Rejects if HAProxy stops before it is up (a bad config, a port taken); handled here so that stopping it later is no error.
  const died = exited.then(() => Promise.reject(new Error('HAProxy stopped')));
  died.catch(() => undefined);
  try {
    await Promise.race([
      waitFor(async () => {
        const all = await servers();
        return all.length > 0 && all.every((s) => s.status === 'UP') && (await fetch(`${url}/api/health`)).status === 200;
      }, 'HAProxy in front of both processes'),
      died,
    ]);
  } catch (err) {
    child.kill('SIGKILL');
    throw new Error(`${(err as Error).message}; exit code ${child.exitCode}; HAProxy said:\n${printed}`, { cause: err });
  }

  return {
    url,
    servers,
    output: () => printed,
    stop: async () => {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
      await exited;
    },
  };
}

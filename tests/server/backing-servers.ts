/**
 * Real Redis and PostgreSQL servers for the tests that need them, each started fresh in a temporary
 * folder on a free loopback port and stopped afterwards. They come from Debian's packages
 * (redis-server, postgresql), which the test command installs.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { chmodSync, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

/** Waits until check() is true (an error counts as not yet), trying every 100 ms; fails after ms. */
export async function waitFor(check: () => boolean | Promise<boolean>, what: string, ms = 20_000) {
  const until = Date.now() + ms;
  for (;;) {
    try {
      if (await check()) return;
    } catch {
      // not up yet
    }
    if (Date.now() > until) throw new Error(`${what} did not come up within ${ms} ms`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

export interface Running {
  url: string;
  stop(): Promise<void>;
}

export interface RunningPostgres extends Running {
  /** A new empty database on this server, for one test. */
  newDatabase(name: string): string;
}

export function redisAvailable() {
  try {
    execFileSync('redis-server', ['--version'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

export async function startRedis(): Promise<Running> {
  const port = await freePort();
  const child: ChildProcess = spawn('redis-server', ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--protected-mode', 'yes'], { stdio: 'ignore' });
  const { default: Redis } = await import('ioredis');
  await waitFor(async () => {
    const probe = new Redis(port, '127.0.0.1', { lazyConnect: true, maxRetriesPerRequest: 0, retryStrategy: () => null });
    // Refused while redis-server is still starting: that is what the wait is for, not an error to print.
    probe.on('error', () => undefined);
    try {
      await probe.connect();
      return (await probe.ping()) === 'PONG';
    } finally {
      probe.disconnect();
    }
  }, 'redis-server');
  return {
    url: `redis://127.0.0.1:${port}`,
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

function postgresBin(): string | null {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const versions = readdirSync(base).filter((v) => existsSync(join(base, v, 'bin', 'initdb'))).sort((a, b) => Number(b) - Number(a));
  return versions.length ? join(base, versions[0], 'bin') : null;
}

export const postgresAvailable = () => postgresBin() !== null;

/** PostgreSQL refuses to run as root; as root, its programs run as the `postgres` user the package made. */
function asPostgres(program: string, args: string[]) {
  const isRoot = process.getuid?.() === 0;
  return isRoot ? execFileSync('runuser', ['-u', 'postgres', '--', program, ...args], { stdio: 'pipe' }) : execFileSync(program, args, { stdio: 'pipe' });
}

export async function startPostgres(): Promise<RunningPostgres> {
  const bin = postgresBin();
  if (!bin) throw new Error('PostgreSQL is not installed (Debian package postgresql).');
  const dir = mkdtempSync(join(tmpdir(), 'rackside-pg-'));
  chmodSync(dir, 0o777);
  const data = join(dir, 'data');
  const port = await freePort();
  if (process.getuid?.() === 0) execFileSync('chown', ['postgres', dir]);
  asPostgres(join(bin, 'initdb'), ['-D', data, '-U', 'rackside', '--auth=trust', '--no-sync', '-E', 'UTF8']);
  asPostgres(join(bin, 'pg_ctl'), ['-D', data, '-l', join(dir, 'log'), '-w', '-o', `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1 -c fsync=off`, 'start']);
  asPostgres(join(bin, 'createdb'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'rackside', 'rackside']);
  return {
    url: `postgres://rackside@127.0.0.1:${port}/rackside`,
    newDatabase: (name) => {
      asPostgres(join(bin, 'createdb'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'rackside', name]);
      return `postgres://rackside@127.0.0.1:${port}/${name}`;
    },
    stop: async () => {
      try {
        asPostgres(join(bin, 'pg_ctl'), ['-D', data, '-m', 'immediate', 'stop']);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}

/**
 * One Rackside process as it runs in production, on its own free port, with `env` on top of this
 * process's environment; resolves once it says it is ready. The caller kills it (`child`).
 */
export async function startRackside(env: Record<string, string>): Promise<{ child: ChildProcess; port: number; url: string }> {
  const port = await freePort();
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, BCRYPT_ROUNDS: '4', BOT_DELAY_MS: '0', CLIENT_DIR: 'none', LOG_LEVEL: 'error', ...env, PORT: String(port) },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('a Rackside process did not start')), 30_000);
    child.stdout!.on('data', (d: Buffer) => {
      if (d.toString().includes('ready on')) {
        clearTimeout(timer);
        resolve();
      }
    });
    child.stderr!.on('data', (d: Buffer) => process.stderr.write(d));
    child.once('exit', (code) => reject(new Error(`a Rackside process exited with ${code}`)));
  }).catch((err) => {
    child.kill('SIGKILL');
    throw err;
  });
  return { child, port, url: `http://127.0.0.1:${port}` };
}

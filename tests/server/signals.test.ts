/**
 * `npm start` and `npm run serve` as a process manager runs them: the signal goes to the npm
 * process alone (not to its process group), and Rackside must still close cleanly.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, expect, test } from 'vitest';
import { accepts } from './ports';

const dir = mkdtempSync(join(tmpdir(), 'rackside-signals-'));
const clientDir = join(dir, 'client');
mkdirSync(clientDir);
writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>Rackside</title>');
// Newer than any source, so `npm start` serves this folder instead of building the client.
const later = new Date(Date.now() + 365 * 24 * 60 * 60 * 1000);
utimesSync(join(clientDir, 'index.html'), later, later);

let running: ChildProcess | undefined;

afterEach(() => {
  // The npm process leads a process group of its own: whatever is left of it goes.
  if (running?.pid && groupAlive(running.pid)) process.kill(-running.pid, 'SIGKILL');
  running = undefined;
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function groupAlive(pgid: number): boolean {
  try {
    process.kill(-pgid, 0);
    return true;
  } catch {
    return false;
  }
}

/** Polls until `done` holds or the deadline passes; returns whether it held. */
async function eventually(done: () => boolean | Promise<boolean>, deadlineMs: number): Promise<boolean> {
  const until = Date.now() + deadlineMs;
  for (;;) {
    if (await done()) return true;
    if (Date.now() > until) return false;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

/** Runs `npm <args>` in its own process group and resolves with the port once /api/health answers. */
function start(args: string[], name: string): Promise<{ child: ChildProcess; port: number; output: () => string }> {
  const child = spawn('npm', args, {
    cwd: process.cwd(),
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
    env: {
      ...process.env,
      PORT: '0',
      DATABASE_URL: `sqlite:${join(dir, `${name}.sqlite`)}`,
      CLIENT_DIR: clientDir,
      SEED_DEMO: 'false',
      BCRYPT_ROUNDS: '4',
      SESSION_SECRET: 'signals-test',
      npm_config_update_notifier: 'false',
    },
  });
  running = child;
  let text = '';
  child.stdout!.on('data', (d: Buffer) => (text += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (text += d.toString()));
  return new Promise((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`npm ${args.join(' ')} exited with ${code} before it was ready:\n${text}`)));
    const check = async () => {
      const port = Number(/ready on http:\/\/localhost:(\d+)/.exec(text)?.[1]);
      if (port) {
        const health = await fetch(`http://127.0.0.1:${port}/api/health`).catch(() => null);
        if (health?.ok) return resolve({ child, port, output: () => text });
      }
      setTimeout(check, 50);
    };
    void check();
  });
}

const exited = (child: ChildProcess) => child.exitCode !== null || child.signalCode !== null;

for (const [script, args] of [
  ['npm start', ['start']],
  ['npm run serve', ['run', 'serve']],
] as const) {
  for (const signal of ['SIGTERM', 'SIGINT'] as const) {
    test(`${script}: ${signal} to the npm process closes Rackside cleanly and leaves nothing running or listening`, { timeout: 60_000 }, async () => {
      const { child, port, output } = await start([...args], `${args.at(-1)}-${signal}`);
      child.removeAllListeners('exit');
      process.kill(child.pid!, signal);
      expect(await eventually(() => exited(child), 20_000), `npm did not exit:\n${output()}`).toBe(true);
      // Exit code 0: Rackside closed itself, nothing was killed.
      expect(child.exitCode, output()).toBe(0);
      expect(await eventually(async () => !(await accepts(port)), 20_000), `port ${port} still accepts connections:\n${output()}`).toBe(true);
      // No process of the group (npm, a shell, node) lives on.
      expect(await eventually(() => !groupAlive(child.pid!), 20_000), `a process of the group lives on:\n${output()}`).toBe(true);
      expect(output()).not.toMatch(/Unexpected error|Unhandled/);
    });
  }
}

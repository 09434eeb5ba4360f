import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, test } from 'vitest';
import { accepts } from './ports';

const dir = mkdtempSync(join(tmpdir(), 'rackside-unhandled-'));
let child: ChildProcess | undefined;
afterAll(() => {
  if (child && child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
  rmSync(dir, { recursive: true, force: true });
});

test('an unhandled rejection is logged and the process exits with a non-zero code, its port closed', { timeout: 60_000 }, async () => {
  const started = spawn(process.execPath, ['--import', 'tsx', 'tests/server/fixtures/unhandled-rejection.ts'], {
    env: { ...process.env, PORT: '0', DATABASE_URL: `sqlite:${join(dir, 'unhandled.sqlite')}`, CLIENT_DIR: 'none', SEED_DEMO: 'false', BCRYPT_ROUNDS: '4', SESSION_SECRET: 'unhandled-test' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child = started;
  let output = '';
  started.stdout.on('data', (d: Buffer) => (output += d.toString()));
  started.stderr.on('data', (d: Buffer) => (output += d.toString()));
  const [code] = await new Promise<[number | null, NodeJS.Signals | null]>((resolve) => started.once('exit', (c, s) => resolve([c, s])));
  expect(output).toMatch(/ready on/);
  expect(output).toMatch(/Unhandled rejection[\s\S]*a rejection nobody handles/);
  expect(code, output).toBe(1);
  const port = Number(/fixture: listening on (\d+)/.exec(output)?.[1]);
  expect(port).toBeGreaterThan(0);
  expect(await accepts(port)).toBe(false);
});

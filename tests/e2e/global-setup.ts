import { execSync, spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

let server: ChildProcess | undefined;
let dir: string | undefined;

/** Builds the client and starts the real server, as `npm start` would, on a temporary database. */
export default async function setup(project: TestProject) {
  dir = mkdtempSync(join(tmpdir(), 'rackside-e2e-'));
  // The client is built into this run's own folder, so another build of dist/client cannot pull files from under it.
  // NODE_ENV is "test" under vitest, which would make Vite bundle React's development build; build what users get.
  const clientDir = join(dir, 'client');
  execSync(`npx vite build --logLevel error --outDir ${JSON.stringify(clientDir)} --emptyOutDir`, { stdio: 'inherit', env: { ...process.env, NODE_ENV: 'production' } });
  const port = 3400 + Math.floor(Math.random() * 500);
  server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, PORT: String(port), CLIENT_DIR: clientDir, DATABASE_URL: `sqlite:${join(dir, 'e2e.sqlite')}`, BCRYPT_ROUNDS: '4', SESSION_SECRET: 'e2e',
      // Every browser test comes from one address; the limits themselves are tested in tests/server.
      LOGIN_RATE_MAX: '10000', REGISTER_RATE_MAX: '10000', RESET_RATE_MAX: '10000', INVITE_RATE_MAX: '10000', CHAT_RATE_PER_MINUTE: '10000' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('The server did not start within 30 s')), 30_000);
    server!.stdout!.on('data', (chunk: Buffer) => {
      if (chunk.toString().includes('ready on')) {
        clearTimeout(timer);
        resolve();
      }
    });
    server!.on('exit', (code) => reject(new Error(`The server exited early with code ${code}`)));
  });
  project.provide('baseUrl', `http://127.0.0.1:${port}`);
  return async () => {
    server?.kill('SIGTERM');
    await new Promise((resolve) => server?.once('exit', resolve));
    if (dir) rmSync(dir, { recursive: true, force: true });
  };
}

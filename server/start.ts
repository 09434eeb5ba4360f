/**
 * `npm start` (`node --import tsx server/start.ts`, with no shell or wrapper between npm and this
 * process, so the SIGTERM a process manager sends to npm reaches the server): builds the client when
 * it is missing or older than its sources, then serves everything in this same process.
 */
import { execSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { loadConfigOrExit } from './config';
import { serve } from './index';
import { log } from './log';

function newestChange(path: string): number {
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return Math.max(stat.mtimeMs, ...readdirSync(path).map((name) => newestChange(join(path, name))));
}

// The demo runs with the local mail and payment fakes unless NODE_ENV=production or real services are configured.
const config = loadConfigOrExit();
const builtIndex = join(config.clientDir, 'index.html');
const sources = ['src', 'shared', 'index.html', 'vite.config.ts'].filter((p) => existsSync(p));
if (!existsSync(builtIndex) || statSync(builtIndex).mtimeMs < Math.max(...sources.map(newestChange))) {
  log.info('Building the client…');
  execSync('npx vite build', { stdio: 'inherit' });
}

void serve(config);

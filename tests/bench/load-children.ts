/**
 * The processes `npm run bench:load` measures: starting a server script in its own Node process
 * with the bench's preloads, reading what it answers on stdout (memory after a full collection,
 * its table counters), and finding the helper programs this bench started (HAProxy, redis-server)
 * so their CPU time can be read too.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';

export interface Started {
  child: ChildProcess;
  port: number;
}

/** Runs `script` under tsx with --expose-gc and the given preloads; resolves with the port its stdout names (the first group of `ready`). */
export function startChild(script: string, env: Record<string, string>, ready: RegExp, preloads: string[]): Promise<Started> {
  const profile = script.startsWith('server') && process.env.PROFILE_SERVER ? ['--cpu-prof', '--cpu-prof-dir=/tmp/prof'] : [];
  const imports = preloads.flatMap((p) => ['--import', p]);
  const child = spawn(process.execPath, [...profile, '--expose-gc', '--import', 'tsx', ...imports, script], { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => {
      const m = d.toString().match(ready);
      if (m) resolve({ child, port: Number(m[1]) });
    });
    child.once('exit', (code) => reject(new Error(`${script} exited with ${code}`)));
  });
}

/** The first whole line of the child's stdout from now on that matches `line` (listen before sending what prompts it). */
export function heard(child: ChildProcess, line: RegExp, timeoutMs = 0): Promise<RegExpMatchArray | null> {
  return new Promise((resolve) => {
    let rest = '';
    let timer: NodeJS.Timeout | undefined;
    const finish = (m: RegExpMatchArray | null) => {
      clearTimeout(timer);
      child.stdout!.off('data', hear);
      resolve(m);
    };
    const hear = (d: Buffer) => {
      const lines = (rest + d.toString()).split('\n');
      rest = lines.pop()!;
      for (const l of lines) {
        const m = l.match(line);
        if (m) return finish(m);
      }
    };
    child.stdout!.on('data', hear);
    if (timeoutMs > 0) timer = setTimeout(() => finish(null), timeoutMs);
  });
}

function rssKb(pid: number): number {
  const line = readFileSync(`/proc/${pid}/status`, 'utf8').split('\n').find((l) => l.startsWith('VmRSS:'))!;
  return Number(line.replace(/\D+/g, ''));
}

/** Resident memory of a server after it has run a full garbage collection (see gc-on-signal.ts). */
export async function settledRssKb(child: ChildProcess): Promise<number> {
  const collected = heard(child, /^collected/);
  child.kill('SIGUSR2');
  const m = await collected;
  if (process.env.SHOW_HEAP) console.error(m![0]);
  return rssKb(child.pid!);
}

/** A Rackside process's table counters (server/realtime/counters.ts), as counters-on-signal.ts prints them. */
export type TableCounts = Record<'retried' | 'split' | 'caughtUp' | 'rebuilt', number>;

/** Asks for the counters and waits up to 10 s for them; null when the process did not answer. */
export async function readCounters(child: ChildProcess): Promise<TableCounts | null> {
  const answer = heard(child, /^counters (\{.*\})$/, 10_000);
  child.kill('SIGWINCH');
  const m = await answer;
  return m ? (JSON.parse(m[1]) as TableCounts) : null;
}

/**
 * The processes named `command` (the kernel's short name, as in /proc/<pid>/stat) whose parent is
 * this process: the HAProxy or redis-server this bench started, without the helpers that start
 * them having to hand out their pids.
 */
export function childPidsNamed(command: string): number[] {
  const pids: number[] = [];
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    let stat: string;
    try {
      stat = readFileSync(`/proc/${entry}/stat`, 'utf8');
    } catch {
      continue; // gone since the listing
    }
    const name = stat.slice(stat.indexOf('(') + 1, stat.lastIndexOf(')'));
    // After the name: state, then the parent's pid.
    const parent = Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]);
    if (name === command && parent === process.pid) pids.push(Number(entry));
  }
  return pids;
}

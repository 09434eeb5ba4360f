/**
 * CPU time (user + system) of benchmarked server processes, read from outside in /proc/<pid>/stat,
 * as the kernel counts it: every thread of that process (the event loop, libuv's pool where SQLite
 * runs, V8's helpers), not the process reading it and not any child of the server. Nothing is
 * loaded into the server and no signal is sent, so measuring cannot change what is measured.
 * Linux only, like the memory figures beside it (/proc/<pid>/status).
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';

function clockTicksPerSecond(): number {
  try {
    return Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim()) || 100;
  } catch {
    return 100;
  }
}

const TICKS_PER_SECOND = clockTicksPerSecond();

/** utime + stime in ms from the text of one /proc/<pid>/stat. */
export function cpuMsOfStat(stat: string, ticksPerSecond = TICKS_PER_SECOND): number {
  // Field 2, the command name, is in parentheses and may itself hold spaces or ')': count from the last ')'.
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  // fields[0] is field 3 (state), so utime (field 14) and stime (field 15) are fields[11] and fields[12].
  const ticks = Number(fields[11]) + Number(fields[12]);
  if (!Number.isFinite(ticks)) throw new Error(`no CPU times in /proc stat line: ${stat.slice(0, 120)}`);
  return (ticks * 1000) / ticksPerSecond;
}

/** CPU time (ms) used so far by these processes together: one server, or several behind a balancer. */
export function cpuMs(pids: readonly number[]): number {
  return pids.reduce((sum, pid) => sum + cpuMsOfStat(readFileSync(`/proc/${pid}/stat`, 'utf8')), 0);
}

/** Starts counting now; the function returned gives the CPU time (ms) these processes have used since. */
export function cpuMeter(pids: readonly number[]): () => number {
  const before = cpuMs(pids);
  return () => cpuMs(pids) - before;
}

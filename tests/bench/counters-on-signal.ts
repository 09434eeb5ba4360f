/**
 * Loaded into a benchmarked Rackside process (`--import`): SIGWINCH answers on stdout with one line,
 * `counters {"retried":…,"split":…,"caughtUp":…,"rebuilt":…}`, the process's table counters
 * (server/realtime/counters.ts) since it started. SIGWINCH because SIGUSR1 starts Node's inspector
 * and gc-on-signal.ts answers SIGUSR2; a process started without this file ignores SIGWINCH.
 */
import { tableCounters } from '../../server/realtime/counters';

process.on('SIGWINCH', () => {
  process.stdout.write(`counters ${JSON.stringify(tableCounters)}\n`);
});

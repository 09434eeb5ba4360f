/**
 * How often the table masters of this process took the slower paths of a table that several
 * processes may serve: plain counts since the process started, for the load benchmark to read
 * (tests/bench/counters-on-signal.ts prints them). Nothing in the app decides anything by them.
 */
export const tableCounters = {
  /** Actions tried once more after another process stored first (a conflict) and the table reloaded. */
  retried: 0,
  /**
   * Actions taken here on a table whose sockets were also on another process (a split table). No
   * action is ever forwarded: the balancer sends a table's connections to its one owner, and where a
   * table is split anyway each process checks and stores its own, the log deciding between them.
   */
  split: 0,
  /** Catch-ups on another process's new events of the same exchange, read and folded alone (one query). */
  caughtUp: 0,
  /** Times a table read its row and log again whole: after a failed write, or a change it could not fold. */
  rebuilt: 0,
};

/**
 * The Charleston engine: pure, seeded, replayable. Both the server and the client use it.
 *
 * - act records a seat's choice and never moves tiles; resolve moves them once every seat
 *   has committed. Votes and courtesy asks settle inside act (the first stop, the fourth
 *   "continue", the fourth ask), so they need no resolve.
 * - In the courtesy pass a seat whose across pair agreed on 0 has nothing to send and counts
 *   as committed from the start; if both pairs agree on 0 the exchange goes straight to done.
 * - A withdraw takes back a pass, a "continue" vote or a courtesy ask that has not settled.
 * - Every random choice comes from the seed: the tile ids and the deal from the seed alone,
 *   each blind pick from the seed and the position of its resolve in the log. The rule for
 *   blind passes is written out in resolve.ts.
 * - An illegal action or resolve returns { ok: false, code, message } and the input state is
 *   never changed; legal ones return a new state that shares unchanged parts with the old.
 */
export { createExchange } from './create';
export { act, canResolve } from './act';
export { resolve } from './resolve';
export { replay } from './replay';
export { viewFor } from './view';
export { validateOptions } from './options';
export { phaseOf, rackOf, legalPassSize, passableTiles, isCommitted } from './status';
export { afterPass, afterCharleston } from './flow';
export { chanceOfAtLeastOne } from './odds';
export {
  PASS_SIZE,
  COURTESY_MAX,
  PHASES,
  FIRST_CHARLESTON,
  SECOND_CHARLESTON,
  PASS_DIRECTION,
  BLIND_PHASES,
  isPassPhase,
  isCharlestonPass,
  isBlindPhase,
} from './constants';
export type * from './types';

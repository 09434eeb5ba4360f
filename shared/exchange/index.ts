/** The Charleston engine: pure, seeded, replayable. Both the server and the client use it. */
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

import { act } from './act';
import { createExchange } from './create';
import { resolve } from './resolve';
import type { ExchangeOptions, ExchangeState } from './types';

/**
 * Rebuilds an exchange from its options and log: the same state again, on any machine.
 * Throws if the log does not fit the options (an entry the engine would refuse).
 */
export function replay(options: ExchangeOptions, log: ExchangeState['log']): ExchangeState {
  let state = createExchange(options);
  log.forEach((entry, index) => {
    const result = 'resolve' in entry ? resolve(state) : act(state, entry.seat, entry.action);
    if (!result.ok) throw new Error(`Entry ${index + 1} of the log can't be replayed: ${result.message}`);
    state = result.state;
  });
  return state;
}

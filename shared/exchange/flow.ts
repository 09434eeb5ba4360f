import type { ExchangeState, Phase } from './types';

type Options = ExchangeState['options'];

/** Where an exchange goes once the Charleston passes are over. */
export function afterCharleston(options: Options): Phase {
  return options.courtesy ? 'courtesy-ask' : 'done';
}

/** The phase after a pass phase resolves. */
export function afterPass(phase: Phase, options: Options): Phase {
  switch (phase) {
    case 'first-right':
      return 'first-across';
    case 'first-across':
      return 'first-left';
    case 'first-left':
      return options.secondCharleston ? 'vote' : afterCharleston(options);
    case 'second-left':
      return 'second-across';
    case 'second-across':
      return 'second-right';
    case 'second-right':
      return afterCharleston(options);
    default:
      return 'done';
  }
}

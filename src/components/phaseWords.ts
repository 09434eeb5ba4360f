import type { Phase } from '../../shared/exchange';

export const PHASE_TITLES: Record<Phase | 'lobby', string> = {
  lobby: 'Waiting for players',
  'first-right': 'First Charleston · pass right',
  'first-across': 'First Charleston · pass across',
  'first-left': 'First Charleston · pass left',
  vote: 'Vote: a second Charleston?',
  'second-left': 'Second Charleston · pass left',
  'second-across': 'Second Charleston · pass across',
  'second-right': 'Second Charleston · pass right',
  'courtesy-ask': 'Courtesy pass · ask',
  'courtesy-pass': 'Courtesy pass · send',
  done: 'The Charleston is over',
};

export function tilesWord(n: number) {
  return `${n} ${n === 1 ? 'tile' : 'tiles'}`;
}

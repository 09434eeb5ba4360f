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

/** A count with its noun: "1 pattern", "3 patterns", "1 match", "2 matches". */
export function countWord(n: number, one: string, many = `${one}s`) {
  return `${n} ${n === 1 ? one : many}`;
}

export function tilesWord(n: number) {
  return countWord(n, 'tile');
}

export function patternsWord(n: number) {
  return countWord(n, 'pattern');
}

/** Odds of finishing as a short figure: "12%", "under 1%" (a chance too small to round to 1), "0%". */
export function oddsWord(odds: number): string {
  return odds > 0 && odds < 0.005 ? 'under 1%' : `${Math.round(odds * 100)}%`;
}

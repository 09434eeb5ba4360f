import type { Direction } from '../seats';
import type { CourtesyCount, Phase } from './types';

/** Tiles in every Charleston pass. */
export const PASS_SIZE = 3;

/** The most tiles a seat may ask for, and so exchange, in the courtesy pass. */
export const COURTESY_MAX: CourtesyCount = 3;

/** Every phase, in the order an exchange can go through them. Some are skipped by options or by the vote. */
export const PHASES: readonly Phase[] = [
  'first-right',
  'first-across',
  'first-left',
  'vote',
  'second-left',
  'second-across',
  'second-right',
  'courtesy-ask',
  'courtesy-pass',
  'done',
];

export const FIRST_CHARLESTON: readonly Phase[] = ['first-right', 'first-across', 'first-left'];
export const SECOND_CHARLESTON: readonly Phase[] = ['second-left', 'second-across', 'second-right'];

/** Phases in which tiles move, and the direction they go. */
export const PASS_DIRECTION: Readonly<Partial<Record<Phase, Direction>>> = {
  'first-right': 'right',
  'first-across': 'across',
  'first-left': 'left',
  'second-left': 'left',
  'second-across': 'across',
  'second-right': 'right',
  'courtesy-pass': 'across',
};

/** The last pass of each Charleston, where a seat may forward arriving tiles unseen. */
export const BLIND_PHASES: readonly Phase[] = ['first-left', 'second-right'];

export function isPassPhase(phase: Phase): boolean {
  return phase in PASS_DIRECTION;
}

export function isCharlestonPass(phase: Phase): boolean {
  return FIRST_CHARLESTON.includes(phase) || SECOND_CHARLESTON.includes(phase);
}

export function isBlindPhase(phase: Phase): boolean {
  return BLIND_PHASES.includes(phase);
}

import { bestAway, rankPatterns, type Pattern } from '../../../shared/analysis';
import { createExchange, PASS_DIRECTION, type ExchangeState, type PassRecord, type Phase } from '../../../shared/exchange';
import type { ExchangeReplayDto } from '../../../shared/protocol';
import { SEATS, type Seat } from '../../../shared/seats';
import { closedHuddle, reduceTable, type Table } from '../../../shared/table';

export interface ReplayStep {
  /** How many log entries this step has replayed. */
  at: number;
  state: ExchangeState;
  /** The pass that just resolved to reach this step, if any. */
  pass: PassRecord | null;
  title: string;
  /** A word for the chart's axis. */
  short: string;
  away: Record<Seat, number>;
}

const PASS_TITLES: Partial<Record<Phase, string>> = {
  'first-right': 'first Charleston, pass right',
  'first-across': 'first Charleston, pass across',
  'first-left': 'first Charleston, pass left',
  'second-left': 'second Charleston, pass left',
  'second-across': 'second Charleston, pass across',
  'second-right': 'second Charleston, pass right',
  'courtesy-pass': 'courtesy pass',
};

function awayOf(state: ExchangeState, patterns: readonly Pattern[]): Record<Seat, number> {
  return Object.fromEntries(SEATS.map((s) => [s, bestAway(state.racks[s].map((t) => t.kind), patterns)])) as Record<Seat, number>;
}

/** Every state of the exchange, entry by entry, through the same table reducer the live table runs. */
function statesOf(dto: ExchangeReplayDto): ExchangeState[] {
  const seats = { east: null, south: null, west: null, north: null };
  let table: Table = { status: 'playing', seats, exchange: { id: 'replay', state: createExchange(dto.options), seq: 0, huddle: closedHuddle(), notes: [] } };
  const states = [table.exchange!.state];
  dto.log.forEach((entry, index) => {
    const result = reduceTable(table, 'resolve' in entry ? { type: 'resolve' } : { type: 'act', seat: entry.seat, action: entry.action });
    if (!result.ok) throw new Error(`Entry ${index + 1} of the log can't be replayed: ${result.message}`);
    table = result.table;
    states.push(table.exchange!.state);
  });
  return states;
}

/** One step for the deal and one after each change of phase, each rebuilt by the shared engine. */
export function replaySteps(dto: ExchangeReplayDto): ReplayStep[] {
  const states = statesOf(dto);
  const cuts = [0];
  for (let k = 1; k < states.length; k++) if (states[k].phase !== states[k - 1].phase) cuts.push(k);
  return cuts.map((at, i) => {
    const state = states[at];
    const prev = i > 0 ? states[cuts[i - 1]] : null;
    const pass = prev && state.history.length > prev.history.length ? state.history[state.history.length - 1] : null;
    let title = 'The deal';
    let short = 'Deal';
    if (pass) {
      title = `After the ${PASS_TITLES[pass.phase] ?? pass.phase}`;
      short = pass.phase === 'courtesy-pass' ? 'Courtesy' : `${pass.phase.startsWith('first') ? '1st' : '2nd'} ${PASS_DIRECTION[pass.phase]}`;
    } else if (prev?.phase === 'vote') {
      title = state.phase === 'second-left' ? 'The table chose a second Charleston' : 'The table stopped after the first Charleston';
      short = 'Vote';
    } else if (prev?.phase === 'courtesy-ask') {
      title = 'Courtesy asks settled';
      short = 'Asks';
    }
    return { at, state, pass, title, short, away: awayOf(state, dto.patternList.patterns) };
  });
}

/** The nearest pattern of the table's own list. */
export function nearestOf(state: ExchangeState, seat: Seat, patterns: readonly Pattern[]) {
  return rankPatterns(state.racks[seat].map((t) => t.kind), patterns, 1)[0] ?? null;
}

export { PASS_DIRECTION };

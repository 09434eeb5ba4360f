import { createExchange, act, resolve, viewFor, type Action, type ExchangeState } from '../../shared/exchange';
import type { TableStateDto } from '../../shared/protocol';
import { SEATS, type Seat } from '../../shared/seats';
import { starterPatterns } from '../../shared/analysis';

const occupants = {
  east: { kind: 'user', userId: 1, displayName: 'Ruth Adeyemi', connected: true },
  south: { kind: 'bot', strategy: 'advised', displayName: 'Coach (bot)' },
  west: { kind: 'user', userId: 2, displayName: 'Theo Brandt', connected: true },
  north: { kind: 'bot', strategy: 'multiples', displayName: 'Pair keeper (bot)' },
} as const;

export const OPTIONS = { seed: 'harbor-lane-week-01', jokers: true, secondCharleston: true, courtesy: true, huddleEveryPass: false, teaching: false, hideAdvice: false, botsPlaySecond: false };

/** A table state as the server would send it, built from a real engine state. */
export function tableState(state: ExchangeState | null, viewer: Seat | null, extra: Partial<TableStateDto> = {}, version = 1): TableStateDto {
  const view = state && viewer ? viewFor(state, viewer) : null;
  return {
    tableId: 't1',
    name: 'Harbor Lane Tuesday',
    version,
    phase: state ? state.phase : 'lobby',
    status: state ? (state.phase === 'done' ? 'done' : 'playing') : 'lobby',
    hostId: 1,
    isHost: viewer === 'east',
    mySeat: viewer,
    myRack: state && viewer ? state.racks[viewer] : [],
    seats: Object.fromEntries(SEATS.map((s) => [s, { occupant: occupants[s], committed: view ? view.seats[s].committed : false, rackSize: view ? view.seats[s].rackSize : 0 }])) as TableStateDto['seats'],
    options: OPTIONS,
    exchangeId: state ? 'x1' : null,
    view,
    huddle: { open: false, revealed: {}, notes: [] },
    spectators: 0,
    ...extra,
  };
}

export function fresh(): ExchangeState {
  return createExchange({ seed: OPTIONS.seed });
}

export function must(result: ReturnType<typeof act>): ExchangeState {
  if (!result.ok) throw new Error(result.message);
  return result.state;
}

/** Every seat passes its first three non-joker tiles, then the pass resolves. */
export function passAll(state: ExchangeState, blind: Partial<Record<Seat, number>> = {}): ExchangeState {
  let s = state;
  for (const seat of SEATS) {
    const b = blind[seat] ?? 0;
    const tiles = s.racks[seat].filter((t) => t.kind !== 'joker').slice(0, 3 - b).map((t) => t.id);
    const action: Action = { type: 'pass', tiles, ...(b ? { blind: b } : {}) };
    s = must(act(s, seat, action));
  }
  return must(resolve(s));
}

/** A finished exchange as GET /api/exchanges/:id/replay sends it: three passes (one with a blind pass), a stop vote, no courtesy tiles. */
export function finishedReplay() {
  let s = passAll(passAll(fresh()));
  s = passAll(s, { north: 1 });
  s = must(act(s, 'south', { type: 'vote', stop: true }));
  for (const seat of SEATS) s = must(act(s, seat, { type: 'courtesy-ask', count: 0 }));
  return {
    id: 'x1',
    tableId: 't1',
    tableName: 'Harbor Lane Tuesday',
    options: { seed: OPTIONS.seed },
    log: s.log,
    patternList: { id: 'starter', name: 'Starter list', patterns: starterPatterns },
    seats: {
      east: { displayName: 'Ruth Adeyemi', kind: 'user' as const },
      south: { displayName: 'Coach (bot)', kind: 'bot' as const, strategy: 'advised' },
      west: { displayName: 'Theo Brandt', kind: 'user' as const },
      north: { displayName: 'Pair keeper (bot)', kind: 'bot' as const, strategy: 'multiples' },
    },
    notes: [{ id: 1, passIndex: 0, phase: 'first-right' as const, seat: 'west' as const, authorName: 'Ruth Adeyemi', text: 'Theo kept both flowers here.', createdAt: '' }],
    startedAt: '2026-12-01T18:00:00Z',
    finishedAt: '2026-12-01T18:20:00Z',
    final: s,
  };
}

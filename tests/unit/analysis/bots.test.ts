import fc from 'fast-check';
import { expect, test } from 'vitest';
import {
  BOT_STRATEGIES,
  chooseBotAction,
  createBot,
  isBotStrategyId,
  starterPatterns,
  STOP_WHEN_AWAY,
  STOP_WHEN_ODDS,
  completionOdds,
  tilesAway,
  type BotStrategyId,
} from '../../../shared/analysis';
import {
  act,
  canResolve,
  createExchange,
  resolve,
  viewFor,
  type Action,
  type ExchangeOptions,
  type ExchangeState,
  type ExchangeView,
  type Phase,
} from '../../../shared/exchange';
import { SEATS, type Seat } from '../../../shared/seats';
import type { TileKind } from '../../../shared/tiles';
import { rack, testPattern } from './helpers';

const ids = BOT_STRATEGIES.map((s) => s.id);

interface Move {
  seat: Seat;
  view: ExchangeView;
  action: Action;
}

/** Plays one exchange to the end with the given bots, checking every action as it goes. */
function playOut(options: ExchangeOptions, lineup: Record<Seat, BotStrategyId>): { state: ExchangeState; moves: Move[] } {
  const bots = Object.fromEntries(SEATS.map((seat) => [seat, createBot(lineup[seat], `${options.seed}:${seat}`)]));
  let state = createExchange(options);
  const moves: Move[] = [];
  for (let step = 0; state.phase !== 'done'; step++) {
    if (step > 60) throw new Error('the exchange did not finish');
    for (const seat of SEATS) {
      const view = viewFor(state, seat);
      const action = bots[seat].chooseAction(view, starterPatterns);
      if (!action) continue;
      const result = act(state, seat, action);
      if (!result.ok) throw new Error(`${lineup[seat]} at ${seat} in ${state.phase}: ${result.code} ${result.message}`);
      moves.push({ seat, view, action });
      state = result.state;
      // Once committed, a bot has nothing more to say until the step resolves.
      expect(state.phase === view.phase ? bots[seat].chooseAction(viewFor(state, seat), starterPatterns) : null).toBeNull();
    }
    if (canResolve(state)) {
      const result = resolve(state);
      if (!result.ok) throw new Error(result.message);
      state = result.state;
    }
  }
  return { state, moves };
}

function checkMoves(moves: Move[]) {
  expect(moves.length).toBeGreaterThan(0);
  for (const { seat, view, action } of moves) {
    if (action.type === 'pass') {
      const kinds = new Map(view.racks[seat]!.map((t) => [t.id, t.kind]));
      for (const id of action.tiles) expect(kinds.get(id)).toBeDefined();
      expect(action.tiles.map((id) => kinds.get(id))).not.toContain('joker');
      expect(new Set(action.tiles).size).toBe(action.tiles.length);
      expect(action.tiles.length + (action.blind ?? 0)).toBe(view.passSize);
      expect(action.blind ?? 0).toBeLessThanOrEqual(view.blindAllowed ? view.passSize : 0);
    } else if (action.type === 'vote') {
      expect(view.phase).toBe('vote');
    } else if (action.type === 'courtesy-ask') {
      expect(view.phase).toBe('courtesy-ask');
      expect([0, 1, 2, 3]).toContain(action.count);
    } else {
      throw new Error(`unexpected ${action.type}`);
    }
  }
}

const jokerHeavy: TileKind[] = [...rack(['joker', 4], ['bam1', 2], ['bam2', 1], ['dot5', 3]), 'flower', 'wind-n', 'crack9'];

for (const id of ids) {
  test(`the ${id} bot plays whole exchanges legally, never passing a joker`, () => {
    for (let i = 0; i < 6; i++) {
      const lineup = { east: id, south: id, west: id, north: id };
      const { state, moves } = playOut({ seed: `bots-${id}-${i}`, racks: i % 2 ? { south: jokerHeavy } : undefined }, lineup);
      expect(state.phase).toBe('done');
      checkMoves(moves);
    }
  });
}

test('mixed tables of every strategy play to the end legally', () => {
  fc.assert(
    fc.property(fc.string({ minLength: 1, maxLength: 8 }), fc.array(fc.constantFrom(...ids), { minLength: 4, maxLength: 4 }), fc.boolean(), (seed, picks, jokers) => {
      const lineup = Object.fromEntries(SEATS.map((seat, i) => [seat, picks[i]])) as Record<Seat, BotStrategyId>;
      const { moves } = playOut({ seed, jokers }, lineup);
      checkMoves(moves);
    }),
    { seed: 777, numRuns: 25 },
  );
});

test('the random bot is seeded: the same seed plays the same exchange, another seed another', () => {
  const lineup = { east: 'random', south: 'random', west: 'random', north: 'random' } as const;
  const a = playOut({ seed: 'same-deal' }, lineup).moves.map((m) => m.action);
  const b = playOut({ seed: 'same-deal' }, lineup).moves.map((m) => m.action);
  expect(b).toEqual(a);
  const view = viewFor(createExchange({ seed: 'same-deal' }), 'east');
  const choices = new Set(['s1', 's2', 's3', 's4', 's5'].map((seed) => JSON.stringify(chooseBotAction('random', view, starterPatterns, seed))));
  expect(choices.size).toBeGreaterThan(1);
});

/** A hand-made view for one seat. */
function viewWith(kinds: TileKind[], phase: Phase, extra: Partial<ExchangeView> = {}): ExchangeView {
  const status = { rackSize: kinds.length, committed: false };
  const tiles = kinds.map((kind, i) => ({ id: `t${i + 1}`, kind }));
  return {
    viewer: 'east',
    phase,
    seats: { east: status, south: status, west: status, north: status },
    racks: { east: tiles },
    received: {},
    pending: {},
    passSize: 0,
    blindAllowed: false,
    asks: {},
    agreed: {},
    votes: {},
    history: [],
    kinds: Object.fromEntries(tiles.map((t) => [t.id, t.kind])),
    ...extra,
  };
}

// Kong 2, pung 4, pung 6, kong 8 in one suit, beside the starter list: `complete` is it less one 8, 1 away on 13 tiles.
const evenClimb = testPattern('even-climb', [
  { size: 4, suit: 'A', rank: 2 },
  { size: 3, suit: 'A', rank: 4 },
  { size: 3, suit: 'A', rank: 6 },
  { size: 4, suit: 'A', rank: 8 },
]);
const withClimb = [...starterPatterns, evenClimb];
const complete = rack(['dot2', 4], ['dot4', 3], ['dot6', 3], ['dot8', 3]);
const scattered: TileKind[] = ['bam1', 'bam5', 'bam9', 'crack2', 'crack6', 'dot3', 'dot7', 'wind-n', 'wind-e', 'dragon-red', 'flower', 'dot9', 'crack9'];

test('the advised bot votes by its odds of finishing: it stops only when they are already good', () => {
  const odds = (kinds: TileKind[]) => completionOdds(kinds, withClimb).patterns[0].odds;
  expect(odds(complete)).toBeGreaterThanOrEqual(STOP_WHEN_ODDS);
  expect(odds(scattered)).toBeLessThan(STOP_WHEN_ODDS);
  for (const kinds of [complete, scattered, [...complete.slice(0, 9), 'wind-n', 'wind-s', 'crack5', 'bam9'] as TileKind[]]) {
    expect(chooseBotAction('advised', viewWith(kinds, 'vote'), withClimb)).toEqual({ type: 'vote', stop: odds(kinds) >= STOP_WHEN_ODDS });
  }
});

test('the advised bot reads its history: it passes a neighbour what they have been passing away', () => {
  // A list in cracks and winds: the bams and dots on the rack are dead weight, so which go is the defence's call.
  const cracks = [
    testPattern('cracks', [
      { size: 3, suit: 'crack', rank: 1 },
      { size: 3, suit: 'crack', rank: 2 },
      { size: 3, suit: 'crack', rank: 3 },
      { size: 3, tile: 'wind-e' },
      { size: 2, tile: 'wind-w' },
    ]),
  ];
  const kinds: TileKind[] = ['crack1', 'crack1', 'crack1', 'crack2', 'crack2', 'crack2', 'crack3', 'crack3', 'wind-e', 'bam4', 'bam8', 'dot4', 'dot8'];
  const empty = () => ({ east: [] as string[], south: [] as string[], west: [] as string[], north: [] as string[] });
  // In the first right east received three tiles from north (on its left): two of them dots.
  const received = { ...empty(), east: ['h1', 'h2', 'h3'] };
  const history = [{ phase: 'first-right' as const, sent: { ...empty(), east: ['h4', 'h5', 'h6'] }, forwarded: empty(), received, blind: { east: 0, south: 0, west: 0, north: 0 } }];
  const historyKinds = { h1: 'dot2', h2: 'dot6', h3: 'crack9', h4: 'wind-n', h5: 'bam1', h6: 'crack7' } as const;
  const view = viewWith(kinds, 'second-left', { passSize: 3, history });
  const action = chooseBotAction('advised', { ...view, kinds: { ...view.kinds, ...historyKinds } }, cracks) as { tiles: string[] };
  const passed = action.tiles.map((id) => kinds[Number(id.slice(1)) - 1]);
  expect(passed).toEqual(expect.arrayContaining(['dot4', 'dot8']));
});

test('the steady bots vote to stop when their best pattern is close, and to go on when it is not', () => {
  expect(Math.min(...withClimb.map((p) => tilesAway(complete, p)))).toBeLessThanOrEqual(STOP_WHEN_AWAY);
  expect(Math.min(...withClimb.map((p) => tilesAway(scattered, p)))).toBeGreaterThan(STOP_WHEN_AWAY);
  for (const id of ['multiples', 'advised'] as const) {
    expect(chooseBotAction(id, viewWith(complete, 'vote'), withClimb)).toEqual({ type: 'vote', stop: true });
    expect(chooseBotAction(id, viewWith(scattered, 'vote'), withClimb)).toEqual({ type: 'vote', stop: false });
  }
});

test('the advised bot asks for as many courtesy tiles as it has spare, up to three', () => {
  expect(chooseBotAction('advised', viewWith(complete, 'courtesy-ask'), withClimb)).toEqual({ type: 'courtesy-ask', count: 0 });
  const oneSpare = [...complete.slice(1), 'wind-n' as TileKind];
  expect(chooseBotAction('advised', viewWith(oneSpare, 'courtesy-ask'), withClimb)).toEqual({ type: 'courtesy-ask', count: 1 });
  expect(chooseBotAction('advised', viewWith(scattered, 'courtesy-ask'), withClimb)).toEqual({ type: 'courtesy-ask', count: 3 });
});

test('the multiples bot asks for nothing when every tile is a pair, a pung or a flower', () => {
  expect(chooseBotAction('multiples', viewWith(rack(['bam1', 2], ['bam2', 3], ['dot5', 2], ['crack7', 2], ['flower', 4]), 'courtesy-ask'), [])).toEqual({
    type: 'courtesy-ask',
    count: 0,
  });
});

test('the multiples bot keeps pairs, pungs and flowers and passes odd tiles outside its leading suit', () => {
  const kinds: TileKind[] = [...rack(['bam3', 2], ['wind-w', 3], ['flower', 1], ['dot2', 1], ['dot4', 1], ['dot5', 1], ['dot7', 1]), 'crack9', 'dragon-red', 'bam8'];
  const action = chooseBotAction('multiples', viewWith(kinds, 'first-right', { passSize: 3 }), starterPatterns);
  expect(action?.type).toBe('pass');
  const passed = (action as { tiles: string[] }).tiles.map((id) => kinds[Number(id.slice(1)) - 1]);
  expect(passed.sort()).toEqual(['bam8', 'crack9', 'dragon-red']);
});

test('the multiples bot passes blind rather than break a pair, where blind is allowed', () => {
  const allMultiples = rack(['bam1', 2], ['bam2', 2], ['dot5', 3], ['crack7', 2], ['flower', 2], ['joker', 2]);
  expect(chooseBotAction('multiples', viewWith(allMultiples, 'first-left', { passSize: 3, blindAllowed: true }), [])).toEqual({
    type: 'pass',
    tiles: [],
    blind: 3,
  });
  const noBlind = chooseBotAction('multiples', viewWith(allMultiples, 'first-across', { passSize: 3 }), []);
  expect(noBlind).toMatchObject({ type: 'pass', blind: 0 });
  expect((noBlind as { tiles: string[] }).tiles).toHaveLength(3);
});

test('the advised bot plays the first advice', () => {
  const action = chooseBotAction('advised', viewWith([...complete, 'wind-n'], 'first-left', { passSize: 3, blindAllowed: true }), withClimb);
  expect(action).toEqual({ type: 'pass', tiles: ['t14'], blind: 2 });
});

test('bots return null when there is nothing to do', () => {
  expect(ids.length).toBeGreaterThan(0);
  for (const id of ids) {
    const bot = createBot(id, 'quiet');
    expect(bot.chooseAction(viewWith(scattered, 'first-right', { passSize: 3, seats: { ...viewWith(scattered, 'vote').seats, east: { rackSize: 13, committed: true } } }), starterPatterns)).toBeNull();
    expect(bot.chooseAction(viewWith(scattered, 'courtesy-pass', { passSize: 0 }), starterPatterns)).toBeNull();
    expect(bot.chooseAction(viewWith(scattered, 'done'), starterPatterns)).toBeNull();
    expect(bot.chooseAction({ ...viewWith(scattered, 'first-right', { passSize: 3 }), viewer: 'host' }, starterPatterns)).toBeNull();
  }
});

test('the courtesy pass sends exactly the agreed count', () => {
  expect(ids.length).toBeGreaterThan(0);
  for (const id of ids) {
    const action = chooseBotAction(id, viewWith(scattered, 'courtesy-pass', { passSize: 2 }), starterPatterns, 'c');
    expect(action).toMatchObject({ type: 'pass', blind: 0 });
    expect((action as { tiles: string[] }).tiles).toHaveLength(2);
  }
});

test('the registry lists three or more strategies with ids and names of their own', () => {
  expect(BOT_STRATEGIES.length).toBeGreaterThanOrEqual(3);
  expect(new Set(ids).size).toBe(ids.length);
  expect(ids).toEqual(expect.arrayContaining(['random', 'multiples', 'advised']));
  for (const s of BOT_STRATEGIES) {
    expect(s.name.length).toBeGreaterThan(0);
    expect(s.description.length).toBeGreaterThan(0);
    expect(s.create().strategy).toBe(s.id);
    expect(isBotStrategyId(s.id)).toBe(true);
  }
  expect(isBotStrategyId('psychic')).toBe(false);
  expect(() => createBot('psychic' as BotStrategyId)).toThrow(/Unknown bot strategy/);
});

test('the multiples bot keeps a lone wind or dragon as much as the list asks for honours', async () => {
  const { honourShare, keepValue } = await import('../../../shared/analysis/bots');
  const winds = [{ id: 'w', name: 'Winds', family: 'w', value: 10, sealed: false, groups: [{ size: 4, tile: 'wind-n' }, { size: 4, tile: 'wind-e' }, { size: 3, tile: 'wind-s' }, { size: 3, tile: 'wind-w' }] }];
  const numbers = [{ id: 'n', name: 'Numbers', family: 'n', value: 10, sealed: false, groups: [{ size: 4, suit: 'A', rank: 1 }, { size: 4, suit: 'A', rank: 2 }, { size: 3, suit: 'A', rank: 3 }, { size: 3, suit: 'A', rank: 4 }] }];
  expect(honourShare(winds as never)).toBe(1);
  expect(honourShare(numbers as never)).toBe(0);
  const rack = ['wind-n', 'bam3', 'dot7'] as const;
  // On a list of numbers a lone wind goes before an off-suit number; on a list of winds it stays.
  expect(keepValue('wind-n', [...rack], 'crack', 0)).toBeLessThan(keepValue('dot7', [...rack], 'crack', 0));
  expect(keepValue('wind-n', [...rack], 'crack', 1)).toBeGreaterThan(keepValue('dot7', [...rack], 'crack', 1));
});

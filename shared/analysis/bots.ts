/**
 * Bots that fill an empty seat. Every strategy answers one question, "what does this seat do
 * now?", from the seat's own view alone, and always with a legal action: jokers are never
 * passed, the pass size and the blind rule are respected.
 *
 * When the seat has nothing to do (it already committed, its courtesy count is 0, the exchange
 * is done, or the viewer is not a seat), `chooseAction` returns null; a caller should not ask then.
 */
import type { BotStrategyId } from '../bot-ids';
import type { Action, CourtesyCount, ExchangeView, Phase } from '../exchange/types';
import { randomInt, rngFor, type Rng } from '../random';
import { isSeat, type Seat } from '../seats';
import { kindOrder, MATCHING_DRAGON, rankOf, suitOf, type Suit, type Tile, type TileKind } from '../tiles';
import { adviceContextFor, advisePass } from './advice';
import { bestAway } from './away';
import { rackFocus } from './focus';
import { completionOdds } from './odds';
import type { Pattern } from './pattern';
import { summarizeRack } from './summary';

/** The multiples bot votes to stop after the first Charleston when its best pattern is at most this many tiles away. */
export const STOP_WHEN_AWAY = 4;
/**
 * The advised bot votes to stop when its odds of finishing the best pattern are at least this:
 * a second Charleston sends nine more tiles away, which a rack this far along can ill spare.
 */
export const STOP_WHEN_ODDS = 0.3;
/** The most tiles a courtesy ask may name. */
export const COURTESY_ASK_MAX = 3;

export type { BotStrategyId } from '../bot-ids';

export interface Bot {
  readonly strategy: BotStrategyId;
  chooseAction(view: ExchangeView, list: readonly Pattern[]): Action | null;
}

export interface BotStrategyInfo {
  id: BotStrategyId;
  name: string;
  description: string;
  create(seed?: string): Bot;
}

/** What the seat is being asked to do now, or null if nothing. */
export type Task = { kind: 'pass'; size: number; blindAllowed: boolean } | { kind: 'vote' } | { kind: 'ask' };

export function taskOf(view: ExchangeView): Task | null {
  const seat = seatOf(view);
  if (!seat || view.seats[seat]?.committed) return null;
  if (view.phase === 'vote') return { kind: 'vote' };
  if (view.phase === 'courtesy-ask') return { kind: 'ask' };
  if (view.phase === 'done' || view.passSize <= 0) return null;
  return { kind: 'pass', size: view.passSize, blindAllowed: view.blindAllowed };
}

function seatOf(view: ExchangeView): Seat | null {
  return isSeat(view.viewer) ? view.viewer : null;
}

function ownRack(view: ExchangeView): Tile[] {
  const seat = seatOf(view);
  return seat ? (view.racks[seat] ?? []) : [];
}

/** Tile ids for the chosen kinds, never a joker, each tile once, in rack order. */
export function idsForKinds(rack: readonly Tile[], kinds: readonly TileKind[]): string[] {
  const left = [...kinds];
  const ids: string[] = [];
  for (const tile of rack) {
    const at = left.indexOf(tile.kind);
    if (tile.kind === 'joker' || at < 0) continue;
    ids.push(tile.id);
    left.splice(at, 1);
  }
  return ids;
}

/** A pass of exactly `size`: own tiles plus blind; if too few own tiles can go, blind makes up the rest where allowed. */
function passAction(ids: string[], blind: number, task: Extract<Task, { kind: 'pass' }>): Action {
  const own = ids.slice(0, task.size - blind);
  const rest = task.size - own.length;
  return { type: 'pass', tiles: own, blind: task.blindAllowed ? rest : 0 };
}

function courtesyCount(n: number): CourtesyCount {
  return Math.max(0, Math.min(COURTESY_ASK_MAX, Math.round(n))) as CourtesyCount;
}

/** A stream of chance for this seat at this moment: the same seed and view give the same choice. */
function rngForView(seed: string, view: ExchangeView): Rng {
  const rack = ownRack(view)
    .map((t) => t.id)
    .sort()
    .join(',');
  return rngFor(seed, 'bot', String(view.viewer), view.phase, view.history.length, rack);
}

/** Random legal play: any non-joker tiles, any blind count allowed, a coin-flip vote, any courtesy ask. */
export class RandomBot implements Bot {
  readonly strategy = 'random' as const;
  constructor(private readonly seed = 'rackside-bot') {}

  chooseAction(view: ExchangeView): Action | null {
    const task = taskOf(view);
    if (!task) return null;
    const rng = rngForView(this.seed, view);
    if (task.kind === 'vote') return { type: 'vote', stop: rng() < 0.5 };
    if (task.kind === 'ask') return { type: 'courtesy-ask', count: courtesyCount(randomInt(rng, COURTESY_ASK_MAX + 1)) };
    const passable = ownRack(view).filter((t) => t.kind !== 'joker');
    const blind = task.blindAllowed ? randomInt(rng, task.size + 1) : 0;
    const ids = passable.map((t) => t.id);
    for (let i = ids.length - 1; i > 0; i--) {
      const j = randomInt(rng, i + 1);
      [ids[i], ids[j]] = [ids[j], ids[i]];
    }
    return passAction(ids, blind, task);
  }
}

/**
 * How much of a list is winds and dragons: their share of the tiles its hands hold, flowers aside.
 * A player who keeps multiples still knows the card they play to: on a list of honours, a lone
 * wind or dragon is worth keeping; on a list of numbers, it is the first to go.
 */
export function honourShare(list: readonly Pattern[]): number {
  let honours = 0;
  let all = 0;
  for (const p of list) {
    for (const g of p.groups) {
      if ('tile' in g && g.tile === 'flower') continue;
      all += g.size;
      if ('dragon' in g || ('tile' in g && (g.tile.startsWith('wind-') || g.tile.startsWith('dragon-')))) honours += g.size;
    }
  }
  return all ? honours / all : 0;
}

/** How much the multiples bot wants to keep each tile: pairs, pungs and flowers first, then the leading suit; lone honours as much as the list asks for them. */
export function keepValue(kind: TileKind, rack: readonly TileKind[], leading: Suit | null, honours = 0): number {
  if (kind === 'joker') return Infinity;
  if (kind === 'flower') return 6;
  const same = rack.filter((k) => k === kind).length;
  if (same >= 2) return 5 + same;
  const suit = suitOf(kind);
  if (!suit) return (leading && MATCHING_DRAGON[leading] === kind ? 1.5 : 0.5) + Math.min(2, 4 * honours);
  const near = rack.filter((k) => k !== kind && suitOf(k) === suit && Math.abs(rankOf(k)! - rankOf(kind)!) <= 2).length;
  return (suit === leading ? 3 : 1) + 0.5 * Math.min(near, 2);
}

/** The value at which the multiples bot would rather pass blind than give the tile away. */
const BLIND_RATHER_THAN = 5;

/** Keep the multiples: holds pairs, pungs and flowers, follows the leading suit, and passes blind rather than break a pair. */
export class MultiplesBot implements Bot {
  readonly strategy = 'multiples' as const;

  chooseAction(view: ExchangeView, list: readonly Pattern[]): Action | null {
    const task = taskOf(view);
    if (!task) return null;
    const rack = ownRack(view);
    const kinds = rack.map((t) => t.kind);
    if (task.kind === 'vote') return { type: 'vote', stop: bestAway(kinds, list) <= STOP_WHEN_AWAY };
    const leading = summarizeRack(kinds, []).leadingSuit;
    const honours = honourShare(list);
    const ranked = rack
      .filter((t) => t.kind !== 'joker')
      .map((t) => ({ t, value: keepValue(t.kind, kinds, leading, honours) }))
      .sort((a, b) => a.value - b.value || kindOrder(a.t.kind) - kindOrder(b.t.kind) || a.t.id.localeCompare(b.t.id));
    if (task.kind === 'ask') {
      const spare = ranked.filter((r) => r.value < 3).length;
      return { type: 'courtesy-ask', count: courtesyCount(spare) };
    }
    const chosen = ranked.slice(0, task.size);
    const blind = task.blindAllowed ? chosen.filter((r) => r.value >= BLIND_RATHER_THAN).length : 0;
    return passAction(
      chosen.filter((r) => r.value < BLIND_RATHER_THAN || !task.blindAllowed).map((r) => r.t.id),
      blind,
      task,
    );
  }
}

/**
 * Follows the pass advice (with the seat's history, for defence); votes to stop when its odds
 * of finishing are already good; asks for as many courtesy tiles as it has spare.
 */
export class AdvisedBot implements Bot {
  readonly strategy = 'advised' as const;

  chooseAction(view: ExchangeView, list: readonly Pattern[]): Action | null {
    const task = taskOf(view);
    if (!task) return null;
    const rack = ownRack(view);
    const kinds = rack.map((t) => t.kind);
    if (task.kind === 'vote') {
      const odds = completionOdds(kinds, list, {});
      return { type: 'vote', stop: (odds.patterns[0]?.odds ?? 0) >= STOP_WHEN_ODDS };
    }
    if (task.kind === 'ask') return { type: 'courtesy-ask', count: courtesyCount(rackFocus(kinds, list, { phase: view.phase }).spare.length) };
    const advice = advisePass(kinds, list, { ...adviceContextFor(view), phase: view.phase as Phase, blindAllowed: task.blindAllowed, count: task.size })[0];
    if (!advice) return passAction([], task.size, task);
    return passAction(idsForKinds(rack, advice.tiles), advice.blind, task);
  }
}

export const BOT_STRATEGIES: readonly BotStrategyInfo[] = [
  {
    id: 'random',
    name: 'Wild card',
    description: 'Passes any tiles but jokers, votes on a coin flip, asks for any courtesy count.',
    create: (seed) => new RandomBot(seed),
  },
  {
    id: 'multiples',
    name: 'Pair keeper',
    description: 'Holds pairs, pungs and flowers, follows its longest suit, and passes blind rather than break a pair.',
    create: () => new MultiplesBot(),
  },
  {
    id: 'advised',
    name: 'Coach',
    description: 'Plays the pass advice: keeps the tiles that give the best odds of finishing, avoids feeding the neighbour a pass goes to, stops early only with good odds.',
    create: () => new AdvisedBot(),
  },
];

export function isBotStrategyId(value: unknown): value is BotStrategyId {
  return BOT_STRATEGIES.some((s) => s.id === value);
}

export function createBot(strategy: BotStrategyId, seed?: string): Bot {
  const info = BOT_STRATEGIES.find((s) => s.id === strategy);
  if (!info) throw new Error(`Unknown bot strategy "${strategy}".`);
  return info.create(seed);
}

/** One action for one seat, or null when the seat has nothing to do now. */
export function chooseBotAction(strategy: BotStrategyId, view: ExchangeView, list: readonly Pattern[], seed?: string): Action | null {
  return createBot(strategy, seed).chooseAction(view, list);
}
